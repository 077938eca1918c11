// ATA Spec 2000 text elements written as plain text on plates and labels, without a 15434
// envelope: "MFR 0CVA5/PNR 123-456/SER A1234", or separated by spaces, GS or newlines.
import type { LabelledTextGrammar } from "./labelled-text";
import type { LabelledVocabulary } from "./labelled-label-reading";
import { findTextElementIdentifier, TEXT_ELEMENT_IDENTIFIERS } from "./text-element-identifiers";

const grammar: LabelledTextGrammar = {
  captions: TEXT_ELEMENT_IDENTIFIERS.map((tei) => ({ id: tei.id, pattern: new RegExp(`^${tei.id}[ \\t]+`, "i") })),
  separators: /[\s\x1D/]/,
  valueCharacter: /[^\s\x1D]/,
};

export const ATA_TEXT_VOCABULARY: LabelledVocabulary = {
  grammar,
  nameOf: (id) => findTextElementIdentifier(id)?.name ?? id,
  valueProblem: (id, value) => {
    const tei = findTextElementIdentifier(id);
    return tei && !tei.accepts(value) ? `${tei.name} ${value} (${id}) is not ${tei.format}` : null;
  },
};

/** True when the text opens with a known TEI and a space: it is meant as text elements. */
export function looksLikeAtaText(text: string): boolean {
  return grammar.captions.some((caption) => caption.pattern.test(text));
}
