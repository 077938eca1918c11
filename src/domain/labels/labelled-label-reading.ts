// Shared last step for the two plain-text syntaxes: pick one parse, check values, interpret.
import { excerpt } from "./control-characters";
import { interpretElements, refusal, type InterpretContext } from "./interpret-elements";
import { parseLabelledText, type LabelledTextGrammar } from "./labelled-text";
import { chooseReading, commonElements, describeCandidates, type SplitElement } from "./split-readings";
import type { LabelElement, LabelParseResult } from "./types";

export interface LabelledVocabulary {
  grammar: LabelledTextGrammar;
  nameOf(id: string): string;
  /** Why the value does not fit the caption, or null. */
  valueProblem(id: string, value: string): string | null;
  /** Canonical form of a value (e.g. CAGE upper-cased); identity by default. */
  normalise?(id: string, value: string): string;
}

export type LabelledReadResult = { kind: "read"; result: LabelParseResult } | { kind: "no-parse"; stuckAt: number };

export function readLabelledLabel(text: string, vocabulary: LabelledVocabulary, context: InterpretContext): LabelledReadResult {
  const outcome = parseLabelledText(text, vocabulary.grammar);
  const toElements = (reading: readonly SplitElement[]): LabelElement[] =>
    reading.map(({ id, value }) => ({ id, name: vocabulary.nameOf(id), value: vocabulary.normalise?.(id, value) ?? value }));
  const firstProblem = (elements: readonly LabelElement[]) =>
    elements.map((e) => vocabulary.valueProblem(e.id, e.value)).find((p) => p !== null) ?? null;

  const choice = chooseReading(outcome, (reading) => {
    const elements = toElements(reading);
    return firstProblem(elements) === null && interpretElements(elements, context).ok;
  });
  if (choice.kind === "none") return { kind: "no-parse", stuckAt: outcome.stuckAt };
  if (choice.kind === "ambiguous") {
    const readings = describeCandidates(choice.candidates, (id) => id);
    return {
      kind: "read",
      result: refusal(
        "ambiguous",
        `"${excerpt(text)}" can be read in more than one way: ${readings}. Enter the values by hand.`,
        toElements(commonElements(choice.candidates)),
      ),
    };
  }
  const elements = toElements(choice.reading);
  const problem = firstProblem(elements);
  if (problem) return { kind: "read", result: refusal("malformed", `${problem}.`, elements) };
  return { kind: "read", result: interpretElements(elements, context) };
}
