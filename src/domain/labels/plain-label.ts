// Fallback for labels typed or printed in free form: "P/N 123-456 S/N A1234",
// "PN: 123-456, SN: A1234", "PART NO 123-456 SERIAL NO A1234", with optional "CAGE 0AB12" or
// "MFR 0AB12". Captions are case-insensitive; fields are separated by spaces, newlines, commas,
// semicolons or slashes.
import type { LabelledTextGrammar } from "./labelled-text";
import type { LabelledVocabulary } from "./labelled-label-reading";
import { isCage } from "./value-formats";

const DELIMITER = String.raw`(?:\s*[:#]\s*|\s+)`;
const caption = (id: string, alternatives: string) => ({ id, pattern: new RegExp(`^(?:${alternatives})${DELIMITER}`, "i") });

const grammar: LabelledTextGrammar = {
  captions: [
    caption("P/N", String.raw`P\/N|PN|PART\s+NO\.?|PART\s+NUMBER`),
    caption("S/N", String.raw`S\/N|SN|SERIAL\s+NO\.?|SERIAL\s+NUMBER|SERIAL`),
    caption("CAGE", String.raw`CAGE\s+CODE|CAGE`),
    caption("MFR", "MFR"),
  ],
  separators: /[\s\x1D,;/]/,
  valueCharacter: /[^\s\x1D,;:]/,
};

const NAMES: Record<string, string> = {
  "P/N": "part number",
  "S/N": "serial number",
  CAGE: "CAGE code",
  MFR: "manufacturer CAGE code",
};

const isCageCaption = (id: string) => id === "CAGE" || id === "MFR";

export const PLAIN_VOCABULARY: LabelledVocabulary = {
  grammar,
  nameOf: (id) => NAMES[id] ?? id,
  // Typed labels may be lower case; a CAGE code is stored upper case.
  normalise: (id, value) => (isCageCaption(id) ? value.toUpperCase() : value),
  valueProblem: (id, value) =>
    isCageCaption(id) && !isCage(value) ? `${NAMES[id]} ${value} (${id}) is not a 5-character CAGE code` : null,
};
