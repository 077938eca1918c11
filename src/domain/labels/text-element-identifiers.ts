// Text Element Identifiers (ATA Spec 2000 Ch. 9 family, as used by DoD IUID; trade-facts 1.3).
import type { FieldSpec } from "./split-readings";
import { isCage, isDuns, isPrintable, isUiiText } from "./value-formats";

export interface TextElementIdentifier {
  id: string;
  name: string;
  accepts(value: string): boolean;
  format: string;
}

const any = { accepts: isPrintable, format: "printable text" };
const cage = { accepts: isCage, format: "a 5-character CAGE code" };

export const TEXT_ELEMENT_IDENTIFIERS: readonly TextElementIdentifier[] = [
  { id: "MFR", name: "manufacturer CAGE code", ...cage },
  { id: "CAG", name: "CAGE code", ...cage },
  { id: "SPL", name: "supplier CAGE code", ...cage },
  { id: "DUN", name: "DUNS number", accepts: isDuns, format: "a 9-digit DUNS number" },
  { id: "EUC", name: "GS1 enterprise identifier", ...any },
  { id: "SER", name: "serial number", ...any },
  { id: "SEQ", name: "serial number within part number", ...any },
  { id: "UCN", name: "unique component number", ...any },
  { id: "PNR", name: "part number", ...any },
  { id: "PNO", name: "original part number", ...any },
  { id: "LOT", name: "lot number", ...any },
  { id: "LTN", name: "lot number within enterprise", ...any },
  { id: "BII", name: "batch item identifier", ...any },
  { id: "UID", name: "unique item identifier", accepts: isUiiText, format: "a UII (A-Z, 0-9, - and /)" },
  { id: "DMF", name: "date of manufacture", ...any }, // meaning from memory, trade-facts 1.3
];

const BY_ID = new Map(TEXT_ELEMENT_IDENTIFIERS.map((tei) => [tei.id, tei]));

export function findTextElementIdentifier(id: string): TextElementIdentifier | undefined {
  return BY_ID.get(id.toUpperCase());
}

/** Split specs for format 12/DD messages whose GS separators were dropped: TEI, a space, the value. */
export const TEXT_ELEMENT_SPECS: readonly FieldSpec[] = TEXT_ELEMENT_IDENTIFIERS.map((tei) => ({
  id: tei.id,
  marker: `${tei.id} `,
  accepts: tei.accepts,
}));
