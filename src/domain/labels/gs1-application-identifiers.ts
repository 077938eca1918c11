// GS1 Application Identifiers we support. Lengths and character sets are from the GS1 General
// Specifications [from memory] except where trade-facts 1.4 confirms them (10, 11, 17, 8004).
import { isValidYymmdd } from "./calendar-dates";
import { excerpt } from "./control-characters";
import type { FieldSpec } from "./split-readings";

export interface ApplicationIdentifier {
  ai: string;
  name: string;
  /** "n" = digits, "x" = GS1 character set 82, "date" = YYMMDD (day 00 = end of month). */
  content: "n" | "x" | "date";
  /** Value length when fixed. Every fixed-length AI here is in the predefined-length table (no GS needed after it). */
  fixedLength?: number;
  maxLength?: number;
  /** The last digit is a GS1 mod-10 check digit. */
  hasCheckDigit?: boolean;
}

const date = (ai: string, name: string): ApplicationIdentifier => ({ ai, name, content: "date", fixedLength: 6 });
const text = (ai: string, name: string, maxLength: number): ApplicationIdentifier => ({ ai, name, content: "x", maxLength });

export const APPLICATION_IDENTIFIERS: readonly ApplicationIdentifier[] = [
  { ai: "00", name: "SSCC", content: "n", fixedLength: 18, hasCheckDigit: true },
  { ai: "01", name: "GTIN", content: "n", fixedLength: 14, hasCheckDigit: true },
  { ai: "02", name: "GTIN of contained trade items", content: "n", fixedLength: 14, hasCheckDigit: true },
  text("10", "batch or lot number", 20),
  date("11", "production date"),
  date("12", "due date"),
  date("13", "packaging date"),
  date("15", "best before date"),
  date("16", "sell by date"),
  date("17", "expiration date"),
  { ai: "20", name: "internal product variant", content: "n", fixedLength: 2 },
  text("21", "serial number", 20),
  text("22", "consumer product variant", 20),
  text("240", "additional product identification", 30),
  text("241", "customer part number", 30),
  text("250", "secondary serial number", 30),
  { ai: "30", name: "variable count", content: "n", maxLength: 8 },
  { ai: "37", name: "count of trade items", content: "n", maxLength: 8 },
  text("400", "customer purchase order number", 30),
  text("8004", "GIAI (global individual asset identifier)", 30),
  text("90", "information agreed between trading partners", 30),
  // 91-99: company internal information, variable length (E4 in trade-facts 1.3 uses 95).
  ...["91", "92", "93", "94", "95", "96", "97", "98", "99"].map((ai) => text(ai, "company internal information", 90)),
];

const BY_AI = new Map(APPLICATION_IDENTIFIERS.map((def) => [def.ai, def]));

export function findApplicationIdentifier(ai: string): ApplicationIdentifier | undefined {
  return BY_AI.get(ai);
}

/** The AI that starts at `pos` (AIs are prefix-free, so at most one matches). */
export function applicationIdentifierAt(text: string, pos: number): ApplicationIdentifier | undefined {
  for (const length of [2, 3, 4]) {
    const def = BY_AI.get(text.slice(pos, pos + length));
    if (def) return def;
  }
  return undefined;
}

// GS1 AI encodable character set 82 [from memory].
const CSET_82 = /^[!"%&'()*+,\-./0-9:;<=>?A-Z_a-z]+$/;

/** Why `value` does not fit `def`, or null when it fits (check digits are checked separately). */
export function applicationIdentifierValueProblem(def: ApplicationIdentifier, value: string): string | null {
  const length = def.fixedLength !== undefined ? `exactly ${def.fixedLength}` : `1 to ${def.maxLength}`;
  const wrongLength =
    def.fixedLength !== undefined ? value.length !== def.fixedLength : value.length < 1 || value.length > (def.maxLength ?? 0);
  if (def.content === "date") {
    return isValidYymmdd(value, true) ? null : `AI ${def.ai} (${def.name}) must be a YYMMDD date, got "${excerpt(value)}"`;
  }
  if (def.content === "n" && (wrongLength || !/^\d+$/.test(value))) {
    return `AI ${def.ai} (${def.name}) must be ${length} digits, got "${excerpt(value)}"`;
  }
  if (def.content === "x" && (wrongLength || !CSET_82.test(value))) {
    return `AI ${def.ai} (${def.name}) must be ${length} characters of the GS1 character set, got "${excerpt(value)}"`;
  }
  return null;
}

/** The check-digit error of a value, or null. */
export function applicationIdentifierCheckDigitProblem(
  def: ApplicationIdentifier,
  value: string,
  computeCheckDigit: (digits: string) => number,
): { expected: number; given: number } | null {
  if (!def.hasCheckDigit) return null;
  const expected = computeCheckDigit(value.slice(0, -1));
  const given = Number(value[value.length - 1]);
  return expected === given ? null : { expected, given };
}

export const APPLICATION_IDENTIFIER_SPECS: readonly FieldSpec[] = APPLICATION_IDENTIFIERS.map((def) => ({
  id: def.ai,
  marker: def.ai,
  fixedLength: def.fixedLength,
  maxLength: def.maxLength,
  accepts: (value: string) => applicationIdentifierValueProblem(def, value) === null,
}));
