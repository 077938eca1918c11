// Reading a message whose element separators (GS / FNC1) were dropped by the decoder.
// Used only when no separator was seen anywhere in the scan: a GS (even the one after the 15434
// format indicator), a leading FNC1 or a GS1 symbology identifier shows that the decoder
// transmits separators, and then the standard reading applies.
//
// RULE. Enumerate every split of the text into known identifiers, each followed by a non-empty
// value that satisfies that identifier's format (fixed length, digits, 5-character CAGE, valid
// date, ...), each identifier used at most once. Then:
//   - no split: the text is malformed;
//   - exactly one split: that is the reading;
//   - several splits: accept the one split that gives a complete, consistent reading
//     (part number and serial found, no contradiction); if none or more than one does, refuse
//     as ambiguous.
// The true message is always one of the splits, so a unique complete split is the true message
// whenever the true message is complete. Example: "1PABC-123S9876517VAB123" splits as
// 1P+S+17V and also as 1P+S with S = "9876517VAB123": both complete, so it is ambiguous.
// Fixed-length fields are never ambiguous; the risk sits in variable fields that contain text
// shaped like another identifier, which is why our encoders put fixed-length fields first.
// Residual risk: a message that is itself incomplete (say a part number "ABS123" with no serial)
// can look like a complete one ("AB" + serial "123"); such readings carry inferredSeparators so
// the UI can ask for a check. A search that hits its limits counts as ambiguous.

export interface FieldSpec {
  id: string;
  /** The characters that introduce the field in the text, e.g. "1P", "MFR ", "01". */
  marker: string;
  fixedLength?: number;
  maxLength?: number;
  accepts(value: string): boolean;
}

export interface SplitElement {
  id: string;
  value: string;
}

export interface SplitOutcome {
  readings: SplitElement[][];
  /** True when the search stopped at a limit: there are too many readings to choose from. */
  exhausted: boolean;
}

const MAX_READINGS = 32;
const MAX_STEPS = 50_000;

export function enumerateSplits(text: string, specs: readonly FieldSpec[]): SplitOutcome {
  const markersAt: FieldSpec[][] = [];
  for (let pos = 0; pos <= text.length; pos++) {
    markersAt.push(specs.filter((spec) => text.startsWith(spec.marker, pos)));
  }
  const readings: SplitElement[][] = [];
  let steps = 0;
  let exhausted = false;
  const path: SplitElement[] = [];
  const used = new Set<string>();

  const endsWell = (end: number) => end === text.length || markersAt[end].length > 0;

  const visit = (pos: number): void => {
    if (exhausted) return;
    if (++steps > MAX_STEPS || readings.length > MAX_READINGS) {
      exhausted = true;
      return;
    }
    if (pos === text.length) {
      if (path.length > 0) readings.push([...path]);
      return;
    }
    for (const spec of markersAt[pos]) {
      if (used.has(spec.id)) continue;
      const start = pos + spec.marker.length;
      const ends: number[] = [];
      if (spec.fixedLength !== undefined) ends.push(start + spec.fixedLength);
      else {
        const last = Math.min(text.length, start + (spec.maxLength ?? text.length));
        for (let end = start + 1; end <= last; end++) ends.push(end);
      }
      for (const end of ends) {
        if (end > text.length || !endsWell(end)) continue;
        const value = text.slice(start, end);
        if (!spec.accepts(value)) continue;
        used.add(spec.id);
        path.push({ id: spec.id, value });
        visit(end);
        path.pop();
        used.delete(spec.id);
      }
    }
  };
  visit(0);
  return { readings, exhausted };
}

export type ReadingChoice =
  /** `byCompleteness`: other splits existed and were set aside as incomplete (separators were inferred). */
  | { kind: "unique"; reading: SplitElement[]; byCompleteness: boolean }
  | { kind: "ambiguous"; candidates: SplitElement[][] }
  | { kind: "none" };

/** Applies the RULE above to the readings of one text. */
export function chooseReading(
  outcome: SplitOutcome,
  isCompleteAndConsistent: (reading: SplitElement[]) => boolean,
): ReadingChoice {
  const { readings, exhausted } = outcome;
  if (exhausted) return { kind: "ambiguous", candidates: readings };
  if (readings.length === 0) return { kind: "none" };
  if (readings.length === 1) return { kind: "unique", reading: readings[0], byCompleteness: false };
  const complete = readings.filter(isCompleteAndConsistent);
  if (complete.length === 1) return { kind: "unique", reading: complete[0], byCompleteness: true };
  return { kind: "ambiguous", candidates: complete.length > 1 ? complete : readings };
}

/** Elements (same id and value) present in every candidate: what is certain despite the ambiguity. */
export function commonElements(candidates: SplitElement[][]): SplitElement[] {
  if (candidates.length === 0) return [];
  return candidates[0].filter((element) =>
    candidates.every((reading) => reading.some((e) => e.id === element.id && e.value === element.value)),
  );
}

/** "1P ABC + S 123, or 1P ABCS123" — shows up to three candidate readings. */
export function describeCandidates(candidates: SplitElement[][], show: (id: string) => string): string {
  const shown = candidates.slice(0, 3).map((reading) => reading.map((e) => `${show(e.id)} ${e.value.length > 30 ? `${e.value.slice(0, 27)}...` : e.value}`).join(" + "));
  const more = candidates.length > 3 ? `, or ${candidates.length - 3} more` : "";
  return shown.join(", or ") + more;
}
