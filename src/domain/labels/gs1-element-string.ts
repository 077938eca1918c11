// GS1 element strings: AIs with FNC1/GS separators, an optional symbology identifier, and the
// human-readable form with parentheses, "(01)04912345123459(21)ABC".
import { excerpt, GS, normaliseControlCharacters, splitSymbologyId } from "./control-characters";
import {
  APPLICATION_IDENTIFIER_SPECS,
  applicationIdentifierAt,
  applicationIdentifierCheckDigitProblem,
  applicationIdentifierValueProblem,
  findApplicationIdentifier,
} from "./gs1-application-identifiers";
import { gs1CheckDigit } from "./gs1-check-digit";
import { displayId, interpretElements, refusal } from "./interpret-elements";
import { chooseReading, commonElements, describeCandidates, enumerateSplits, type SplitElement } from "./split-readings";
import type { LabelElement, LabelRefusal, ParseLabelOptions } from "./types";

export type Gs1ElementStringResult =
  | { ok: true; elements: LabelElement[]; symbologyId: string | null; inferredSeparators: boolean }
  | LabelRefusal;

type Gs1DataResult = { ok: true; elements: LabelElement[]; inferredSeparators: boolean } | LabelRefusal;

function named(split: readonly SplitElement[]): LabelElement[] {
  return split.map(({ id, value }) => ({ id, name: findApplicationIdentifier(id)?.name ?? "unknown AI", value }));
}

/** Standard reading: fixed-length AIs take their length, a variable-length AI runs to the next GS. */
function readSeparated(data: string): Gs1DataResult {
  const elements: LabelElement[] = [];
  for (const segment of data.split(GS)) {
    let pos = 0;
    while (pos < segment.length) {
      const def = applicationIdentifierAt(segment, pos);
      if (!def) {
        const rest = excerpt(segment.slice(pos));
        return refusal("malformed", `GS1 data "${rest}" does not start with an Application Identifier we support.`, elements);
      }
      const start = pos + def.ai.length;
      const end = def.fixedLength !== undefined ? start + def.fixedLength : segment.length;
      const value = segment.slice(start, end);
      const problem = applicationIdentifierValueProblem(def, value);
      if (problem) {
        const hint = def.fixedLength === undefined ? " (a GS separator may be missing after it)" : "";
        return refusal("malformed", `${problem}${hint}.`, elements);
      }
      elements.push({ id: def.ai, name: def.name, value });
      pos = end;
    }
  }
  return { ok: true, elements, inferredSeparators: false };
}

/** Human-readable form: each AI in parentheses, so the boundaries are explicit. */
function readParenthesised(data: string): Gs1DataResult {
  const markers = [...data.matchAll(/\((\d{2,4})\)/g)];
  const elements: LabelElement[] = [];
  if (markers.length === 0 || markers[0].index !== 0) {
    return refusal("malformed", `GS1 text "${excerpt(data)}" does not start with an AI in parentheses.`, elements);
  }
  for (let i = 0; i < markers.length; i++) {
    const def = findApplicationIdentifier(markers[i][1]);
    if (!def) return refusal("malformed", `(${markers[i][1]}) is not a GS1 Application Identifier we support.`, elements);
    const start = markers[i].index + markers[i][0].length;
    const value = data.slice(start, markers[i + 1]?.index ?? data.length).trim();
    const problem = applicationIdentifierValueProblem(def, value);
    if (problem) return refusal("malformed", `${problem}.`, elements);
    elements.push({ id: def.ai, name: def.name, value });
  }
  return { ok: true, elements, inferredSeparators: false };
}

/** No separator seen: apply the rule of split-readings.ts. */
function readUnseparated(data: string): Gs1DataResult {
  const choice = chooseReading(enumerateSplits(data, APPLICATION_IDENTIFIER_SPECS), (reading) =>
    interpretElements(named(reading), { syntax: "gs1", vocabularies: ["gs1"] }).ok,
  );
  if (choice.kind === "none") {
    return refusal("malformed", `GS1 data "${excerpt(data)}" cannot be split into Application Identifiers we support.`, []);
  }
  if (choice.kind === "ambiguous") {
    const readings = describeCandidates(choice.candidates, displayId);
    return refusal(
      "ambiguous",
      `This GS1 string has no GS (FNC1) separators and can be read in more than one way: ${readings}. ` +
        "Scan it with a reader that sends GS separators, or enter the values by hand.",
      named(commonElements(choice.candidates)),
    );
  }
  return { ok: true, elements: named(choice.reading), inferredSeparators: choice.byCompleteness };
}

function checkDigits(result: Gs1DataResult): Gs1DataResult {
  if (!result.ok) return result;
  for (const e of result.elements) {
    const def = findApplicationIdentifier(e.id);
    const wrong = def && applicationIdentifierCheckDigitProblem(def, e.value, gs1CheckDigit);
    if (wrong) {
      return refusal(
        "bad_check_digit",
        `${e.name} ${e.value} (${displayId(e.id)}) ends in check digit ${wrong.given}, ` +
          `but the GS1 check digit of ${e.value.slice(0, -1)} is ${wrong.expected}.`,
        result.elements,
      );
    }
  }
  return result;
}

/**
 * Reads GS1 data (an element string without symbology identifier, or the data of a 15434
 * format 05 envelope). `separatorsSeen`: a GS, FNC1 or GS1 symbology identifier was transmitted,
 * so the decoder keeps separators and the standard reading applies.
 */
export function readGs1Data(data: string, separatorsSeen: boolean): Gs1DataResult {
  if (data.startsWith("(")) return checkDigits(readParenthesised(data));
  return checkDigits(separatorsSeen ? readSeparated(data) : readUnseparated(data));
}

/** Lower-level GS1 reader: returns the elements without deciding part or serial number. */
export function parseGs1ElementString(raw: string, options: ParseLabelOptions = {}): Gs1ElementStringResult {
  const { symbologyId, isGs1, rest } = splitSymbologyId(normaliseControlCharacters(raw).trim());
  const leadingFnc1 = rest.startsWith(GS);
  const data = leadingFnc1 ? rest.slice(1) : rest;
  if (data === "") return refusal("malformed", "The GS1 string is empty.", []);
  const separatorsSeen = Boolean(options.separatorsReliable) || isGs1 || leadingFnc1 || data.includes(GS);
  const result = readGs1Data(data, separatorsSeen);
  return result.ok ? { ...result, symbologyId } : result;
}
