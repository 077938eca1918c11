// Concatenated Unique Item Identifier (UII) from label elements, per MIL-STD-130N Table A-II
// (DIs) and the DoD TEI practice (trade-facts 1.2, 1.3). Issuing agency codes (Table V):
// D = CAGE, UN = DUNS. The UII uses the ORIGINAL part number (PNO / 1P), never PNR (Table IV).
import type { LabelElement } from "./types";
import { isUiiText } from "./value-formats";

export type UiiDerivation =
  | { ok: true; uii: string; construct: 1 | 2 | null; from: string[] }
  | { ok: false; message: string };

type Lookup = (id: string) => string | undefined;

interface Rule {
  construct: 1 | 2 | null;
  from: string[];
  build(get: Lookup): string | undefined;
}

const asIs = (id: string, construct: 1 | null): Rule => ({ construct, from: [id], build: (get) => get(id) });

const join = (...parts: Array<string | undefined>): string | undefined =>
  parts.every((p) => p !== undefined) ? parts.join("") : undefined;

// Order matters: a complete UII carried as one element wins over one assembled from parts.
const RULES: Rule[] = [
  asIs("25S", 1), // complete Construct #1 UII
  asIs("UID", null), // TEI counterpart of 25S
  asIs("8004", null), // GS1 GIAI, an IUID equivalent
  { construct: 1, from: ["18S"], build: (get) => join("D", get("18S")) },
  // TEI Construct #1: enterprise ID + serial within the enterprise.
  ...["MFR", "CAG", "SPL"].flatMap((cage): Rule[] =>
    ["SER", "UCN"].map((serial) => ({ construct: 1, from: [cage, serial], build: (get) => join("D", get(cage), get(serial)) })),
  ),
  ...["SER", "UCN"].map((serial): Rule => ({ construct: 1, from: ["DUN", serial], build: (get) => join("UN", get("DUN"), get(serial)) })),
  // TEI Construct #2: enterprise ID + original part number + serial within it.
  ...["MFR", "CAG", "SPL"].map((cage): Rule => ({ construct: 2, from: [cage, "PNO", "SEQ"], build: (get) => join("D", get(cage), get("PNO"), get("SEQ")) })),
  { construct: 2, from: ["DUN", "PNO", "SEQ"], build: (get) => join("UN", get("DUN"), get("PNO"), get("SEQ")) },
  // DI Construct #2 (Table A-II), part-number and lot variants.
  ...["1P", "1T"].flatMap((item): Rule[] => [
    { construct: 2, from: ["17V", item, "S"], build: (get) => join("D", get("17V"), get(item), get("S")) },
    { construct: 2, from: ["12V", item, "S"], build: (get) => join("UN", get("12V"), get(item), get("S")) },
    { construct: 2, from: ["18V", item, "S"], build: (get) => join(get("18V"), get(item), get("S")) },
  ]),
  // GTIN + serial, as a UII-capable reader outputs it (Microscan MS-Q Imager manual §10, "Valid Formats").
  { construct: null, from: ["01", "21"], build: (get) => join(get("01"), get("21")) },
];

/** Derives the concatenated UII, or says why the elements do not make one. */
export function deriveUii(elements: readonly LabelElement[]): UiiDerivation {
  const get: Lookup = (id) => elements.find((e) => e.id === id)?.value;
  for (const rule of RULES) {
    const uii = rule.build(get);
    if (uii === undefined) continue;
    if (!isUiiText(uii)) {
      return { ok: false, message: `UII "${uii}" (from ${rule.from.join(" + ")}) must be 1-50 characters of A-Z, 0-9, "-" and "/".` };
    }
    return { ok: true, uii, construct: rule.construct, from: rule.from };
  }
  const ids = elements.map((e) => e.id).join(", ") || "no elements";
  return {
    ok: false,
    message: `No UII can be built from ${ids}: need 25S, UID, 8004 or 18S; an enterprise ID (MFR, CAG, SPL, DUN) with SER or UCN, or with PNO and SEQ; or 17V, 12V or 18V with 1P (or 1T) and S.`,
  };
}
