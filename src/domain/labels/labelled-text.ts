// Reads "CAPTION value CAPTION value ..." text such as "MFR 0CVA5/PNR 123-456/SER A1234" or
// "P/N: 123-456, S/N: A1234". Values hold no whitespace. A "/" may separate fields or sit
// inside a value ("123/456"), so every place where "/" is followed by a caption is tried both
// ways; the caller picks among the complete parses with chooseReading.
import type { SplitElement, SplitOutcome } from "./split-readings";

export interface Caption {
  id: string;
  /** Matches the caption and its delimiter at the start of the string, e.g. /^P\/N(?:\s*:\s*|\s+)/i. */
  pattern: RegExp;
}

export interface LabelledTextGrammar {
  captions: readonly Caption[];
  /** Characters allowed between fields (besides nothing at all after a "/"-split). */
  separators: RegExp;
  /** One character that can belong to a value. */
  valueCharacter: RegExp;
}

export interface LabelledTextOutcome extends SplitOutcome {
  /** Furthest position where a caption was expected but not found. */
  stuckAt: number;
}

const MAX_PARSES = 32;
const MAX_STEPS = 20_000;

function captionAt(text: string, pos: number, grammar: LabelledTextGrammar): Array<{ id: string; end: number }> {
  const found: Array<{ id: string; end: number }> = [];
  for (const caption of grammar.captions) {
    const match = caption.pattern.exec(text.slice(pos));
    if (match) found.push({ id: caption.id, end: pos + match[0].length });
  }
  return found;
}

export function parseLabelledText(text: string, grammar: LabelledTextGrammar): LabelledTextOutcome {
  const readings: SplitElement[][] = [];
  const path: SplitElement[] = [];
  let steps = 0;
  let exhausted = false;
  let stuckAt = 0;

  const skipSeparators = (pos: number): number => {
    let p = pos;
    while (p < text.length && grammar.separators.test(text[p])) p++;
    return p;
  };

  const visit = (pos: number): void => {
    if (exhausted) return;
    if (++steps > MAX_STEPS || readings.length > MAX_PARSES) {
      exhausted = true;
      return;
    }
    const p = skipSeparators(pos);
    if (p === text.length) {
      if (path.length > 0) readings.push([...path]);
      return;
    }
    const captions = captionAt(text, p, grammar);
    if (captions.length === 0) stuckAt = Math.max(stuckAt, p);
    for (const caption of captions) {
      let runEnd = caption.end;
      while (runEnd < text.length && grammar.valueCharacter.test(text[runEnd])) runEnd++;
      for (let end = runEnd; end > caption.end; end--) {
        const splitsHere = end === runEnd || (text[end] === "/" && captionAt(text, end + 1, grammar).length > 0);
        const value = text.slice(caption.end, end);
        if (!splitsHere || !/[A-Za-z0-9]/.test(value)) continue;
        path.push({ id: caption.id, value });
        visit(end);
        path.pop();
      }
    }
  };
  visit(0);
  return { readings, exhausted, stuckAt };
}
