// UII derivation rules: MIL-STD-130N Table A-II (DI constructs), Table V (issuing agency codes
// D = CAGE, UN = DUNS), Table IV (original part number), all as in trade-facts 1.2; TEI
// constructs per trade-facts 1.3. Published values are in published-examples.test.ts; here the
// rules are checked as properties over invented values.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { deriveUii, type LabelElement } from "@/domain/labels";
import { cageCode, partOrSerial } from "./arbitraries";

const el = (id: string, value: string): LabelElement => ({ id, name: id, value });
const duns = fc.string({ unit: fc.constantFrom(..."0123456789"), minLength: 9, maxLength: 9 });

describe("deriveUii", () => {
  it("Construct #2 from DIs: D + 17V + 1P + S, UN + 12V + 1P + S, 18V + 1P + S; 1T in place of 1P (Table A-II)", () => {
    fc.assert(
      fc.property(cageCode, duns, partOrSerial, partOrSerial, (cage, dunsNumber, pn, sn) => {
        expect(deriveUii([el("17V", cage), el("1P", pn), el("S", sn)])).toMatchObject({ uii: `D${cage}${pn}${sn}`, construct: 2 });
        expect(deriveUii([el("12V", dunsNumber), el("1P", pn), el("S", sn)])).toMatchObject({ uii: `UN${dunsNumber}${pn}${sn}` });
        expect(deriveUii([el("18V", `LH${cage}`), el("1P", pn), el("S", sn)])).toMatchObject({ uii: `LH${cage}${pn}${sn}` });
        expect(deriveUii([el("17V", cage), el("1T", pn), el("S", sn)])).toMatchObject({ uii: `D${cage}${pn}${sn}` });
      }),
    );
  });

  it("Construct #1 from DIs: D + 18S, or 25S as it stands (Table A-II)", () => {
    fc.assert(
      fc.property(cageCode, partOrSerial, (cage, sn) => {
        expect(deriveUii([el("18S", cage + sn)])).toEqual({ ok: true, uii: `D${cage}${sn}`, construct: 1, from: ["18S"] });
        expect(deriveUii([el("25S", `D${cage}${sn}`), el("17V", "ZZZZZ")])).toMatchObject({ uii: `D${cage}${sn}`, from: ["25S"] });
      }),
    );
  });

  it("TEI constructs: D + MFR/CAG/SPL + SER or UCN (#1), D + MFR + PNO + SEQ (#2), UN + DUN; never PNR (Table IV)", () => {
    fc.assert(
      fc.property(cageCode, duns, partOrSerial, partOrSerial, (cage, dunsNumber, pn, sn) => {
        expect(deriveUii([el("SPL", cage), el("UCN", sn)])).toMatchObject({ uii: `D${cage}${sn}`, construct: 1 });
        expect(deriveUii([el("DUN", dunsNumber), el("SER", sn)])).toMatchObject({ uii: `UN${dunsNumber}${sn}` });
        const construct2 = deriveUii([el("MFR", cage), el("PNR", "CURRENT-9"), el("PNO", pn), el("SEQ", sn)]);
        expect(construct2).toMatchObject({ uii: `D${cage}${pn}${sn}`, construct: 2, from: ["MFR", "PNO", "SEQ"] });
      }),
    );
  });

  it("takes UID and 8004 as they stand", () => {
    expect(deriveUii([el("UID", "D1XY23ABC")])).toMatchObject({ ok: true, uii: "D1XY23ABC" });
    expect(deriveUii([el("8004", "0614141ABC")])).toMatchObject({ ok: true, uii: "0614141ABC" });
  });

  it("refuses a UII with characters outside A-Z 0-9 - / or longer than 50 (uidlaser, trade-facts 1.2)", () => {
    expect(deriveUii([el("MFR", "1XY23"), el("SER", "a b")])).toMatchObject({ ok: false });
    expect(deriveUii([el("MFR", "1XY23"), el("SER", "9".repeat(44))])).toMatchObject({ ok: true });
    expect(deriveUii([el("MFR", "1XY23"), el("SER", "9".repeat(45))])).toMatchObject({ ok: false });
  });

  it("says what is needed when no construct fits", () => {
    const r = deriveUii([el("1P", "PN-7"), el("S", "1")]);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/No UII can be built from 1P, S: need 25S/);
  });
});
