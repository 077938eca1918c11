// Separator characters of ISO/IEC 15434 and GS1 element strings, and the visible stand-ins
// that keyboard-wedge scanners and manual entry produce for them.

export const GS = "\x1D";
export const RS = "\x1E";
export const EOT = "\x04";

const CONTROL_BY_NAME: Record<string, string> = { GS, RS, EOT, FNC1: GS };
const CONTROL_BY_CARET: Record<string, string> = { "^]": GS, "^^": RS, "^D": EOT };
const CONTROL_BY_PICTURE: Record<string, string> = { "\u241D": GS, "\u241E": RS, "\u2404": EOT };

// Control pictures, caret notation, and <GS>/{GS}-style tokens. <FNC1> stands for GS because a
// non-leading FNC1 is transmitted as GS (ISO/IEC 16022 §5.2.4.6, trade-facts 1.4).
const STAND_IN = /[\u241D\u241E\u2404]|\^[\]^D]|<(?:GS|RS|EOT|FNC1)>|\{(?:GS|RS|EOT|FNC1)\}/gi;

/** Replaces visible stand-ins by the control characters they represent. */
export function normaliseControlCharacters(raw: string): string {
  return raw.replace(STAND_IN, (token) => {
    if (token in CONTROL_BY_PICTURE) return CONTROL_BY_PICTURE[token];
    if (token.startsWith("^")) return CONTROL_BY_CARET[token] ?? token; // "^d" is not caret notation
    return CONTROL_BY_NAME[token.slice(1, -1).toUpperCase()];
  });
}

/** For messages: shows control characters as their Unicode control pictures. */
export function showControlCharacters(text: string): string {
  return text.replaceAll(GS, "\u241D").replaceAll(RS, "\u241E").replaceAll(EOT, "\u2404");
}

/** For messages: control pictures, and long text cut to `max` characters. */
export function excerpt(text: string, max = 60): string {
  const shown = showControlCharacters(text);
  return shown.length > max ? `${shown.slice(0, max - 3)}...` : shown;
}

// AIM symbology identifiers that announce GS1 data (FNC1 in first position) [from memory].
const GS1_SYMBOLOGY_IDS = new Set(["]C1", "]d2", "]Q3", "]e0"]);

export interface SymbologyPrefix {
  symbologyId: string | null;
  isGs1: boolean;
  rest: string;
}

/** Splits off a leading AIM symbology identifier such as "]d2" that some scanners prepend. */
export function splitSymbologyId(text: string): SymbologyPrefix {
  const match = /^\][A-Za-z][0-9A-Za-z]/.exec(text);
  if (!match) return { symbologyId: null, isGs1: false, rest: text };
  return { symbologyId: match[0], isGs1: GS1_SYMBOLOGY_IDS.has(match[0]), rest: text.slice(3) };
}
