// Published worked examples. Each check names its source; "trade-facts" is
// /work/shared/reference/trade-facts.md, which lists the original documents.
import { describe, expect, it } from "vitest";
import { deriveUii, gs1CheckDigit, isValidGtin, parseGs1ElementString, parseLabel } from "@/domain/labels";

describe("ISO/IEC 15434 format 12 / DD text-element examples", () => {
  // E1: uidlaser.com "IUID string" example, as cited in trade-facts 1.3.
  const E1 = "[)>␞12␝MFR 0CVA5␝SER 674A36458␞␄";

  it("E1: finds CAGE 0CVA5 and serial 674A36458, refuses for want of a part number (uidlaser.com, trade-facts 1.3)", () => {
    const result = parseLabel(E1);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.code).toBe("missing_part_number");
    expect(result.found).toEqual([
      { id: "MFR", name: "manufacturer CAGE code", value: "0CVA5" },
      { id: "SER", name: "serial number", value: "674A36458" },
    ]);
    expect(result.message).toContain("0CVA5");
    expect(result.message).toContain("674A36458");
    expect(result.message).toMatch(/no part number \(PNR or PNO\)/);
  });

  it("E1: UII D0CVA5674A36458, Construct #1 (uidlaser.com, trade-facts 1.3)", () => {
    const result = parseLabel(E1);
    if (result.ok) throw new Error("E1 has no part number");
    expect(deriveUii(result.found)).toEqual({ ok: true, uii: "D0CVA5674A36458", construct: 1, from: ["MFR", "SER"] });
  });

  it('E2: CAG A3309 + SER 1234567 gives UII DA33091234567 (Brady "Encoding UII Data", trade-facts 1.3)', () => {
    const result = parseLabel("[)>␞12␝CAG A3309␝SER 1234567␞␄");
    if (result.ok) throw new Error("E2 has no part number");
    expect(result.code).toBe("missing_part_number");
    expect(result.found.map((e) => [e.id, e.value])).toEqual([
      ["CAG", "A3309"],
      ["SER", "1234567"],
    ]);
    expect(deriveUii(result.found)).toMatchObject({ ok: true, uii: "DA33091234567" });
  });

  it("E3: the DD format indicator reads like format 12, UII as E1 (ezmarking, trade-facts 1.3)", () => {
    const result = parseLabel("[)>␞DD␝MFR 0CVA5␝SER 674A36458␞␄");
    if (result.ok) throw new Error("E3 has no part number");
    expect(result.found.map((e) => [e.id, e.value])).toEqual([
      ["MFR", "0CVA5"],
      ["SER", "674A36458"],
    ]);
    expect(deriveUii(result.found)).toMatchObject({ ok: true, uii: "D0CVA5674A36458" });
  });
});

describe("ISO/IEC 15434 format 05 (GS1) example", () => {
  // E4: IDAutomation "MIL-STD-130 UID Marking Label Generation", reproducing MIL-STD-130N Fig. 8 (trade-facts 1.3).
  const E4 = "[)>␞05␝800406141419999960MH80312␝21MH80312␝950614141␝24099999␞␄";

  it("E4: GIAI, serial MH80312 and part number 99999 from AI 240 (IDAutomation / MIL-STD-130N Fig. 8)", () => {
    expect(parseLabel(E4)).toEqual({
      ok: true,
      syntax: "iso15434",
      format: "05",
      partNumber: "99999",
      serialNumber: "MH80312",
      cage: null,
      elements: [
        { id: "8004", name: "GIAI (global individual asset identifier)", value: "06141419999960MH80312" },
        { id: "21", name: "serial number", value: "MH80312" },
        // IDAutomation's field table: AI 95 "SPLR ID GS1" = 0614141.
        { id: "95", name: "company internal information", value: "0614141" },
        { id: "240", name: "additional product identification", value: "99999" },
      ],
    });
  });

  it("E4: the GIAI is the UII 06141419999960MH80312 (trade-facts 1.3)", () => {
    const result = parseLabel(E4);
    if (!result.ok) throw new Error(result.message);
    expect(deriveUii(result.elements)).toMatchObject({ ok: true, uii: "06141419999960MH80312" });
  });
});

describe("GS1 element string example (qrcode2 docs, as cited in trade-facts 1.4)", () => {
  const QRCODE2 = "01049123451234591597033130128␝10ABC123";
  const expected = [
    { id: "01", name: "GTIN", value: "04912345123459" },
    { id: "15", name: "best before date", value: "970331" },
    { id: "30", name: "variable count", value: "128" },
    { id: "10", name: "batch or lot number", value: "ABC123" },
  ];

  it("parseGs1ElementString returns (01) 04912345123459, (15) 970331, (30) 128, (10) ABC123", () => {
    expect(parseGs1ElementString(QRCODE2)).toEqual({ ok: true, elements: expected, symbologyId: null, inferredSeparators: false });
  });

  it("parseLabel refuses it for want of a serial (AI 21) and lists the four elements", () => {
    const result = parseLabel(QRCODE2);
    if (result.ok) throw new Error("there is no AI 21 in the example");
    expect(result.code).toBe("missing_serial_number");
    expect(result.found).toEqual(expected);
    expect(result.message).toMatch(/no serial number \(AI 21\)/);
  });

  it("still reads uniquely with its GS removed: AI 30 is digits only, so it cannot swallow \"10ABC123\"", () => {
    expect(parseGs1ElementString(QRCODE2.replace("␝", ""))).toMatchObject({ ok: true, elements: expected });
  });
});

describe("GS1 check digit", () => {
  it("629104150021 -> 3 (gs1.org check digit calculator example, trade-facts 1.4)", () => {
    expect(gs1CheckDigit("629104150021")).toBe(3);
    expect(isValidGtin("6291041500213")).toBe(true);
  });

  it("0491234512345 -> 9 (verified by the qrcode2 example's own string, GTIN 04912345123459)", () => {
    expect(gs1CheckDigit("0491234512345")).toBe(9);
    expect(isValidGtin("04912345123459")).toBe(true);
  });
});

// Microscan MS-Q Imager User's Manual §10 p. 10-8, "Examples of Valid UII Message Streams and UII
// Output" (the same table is in the Quadrus EZ Reader manual p. 13-8). Braces are the manual's notation.
describe("Microscan reader manual examples", () => {
  it("format 06 with 18S: UII DOCVA5674A36458; CAGE and serial come out of the 18S value", () => {
    // This copy prints the letter O where uidlaser writes 0CVA5; the derivation keeps it either way.
    const result = parseLabel("[)>{RS}06{GS}18SOCVA5674A36458{RS}{EOT}");
    if (result.ok) throw new Error("no part number in the example");
    expect(result.code).toBe("missing_part_number");
    expect(result.found).toEqual([{ id: "18S", name: "CAGE code + serial number", value: "OCVA5674A36458" }]);
    expect(result.message).toContain("serial number 674A36458");
    expect(deriveUii(result.found)).toEqual({ ok: true, uii: "DOCVA5674A36458", construct: 1, from: ["18S"] });
  });

  it("format 05 with 01 + 21: UII 000614141999991A0B9C3D6, but its GTIN fails the mod-10 check", () => {
    const result = parseLabel("[)>{RS}05{GS}0100061414199999{GS}211A0B9C3D6{RS}{EOT}");
    if (result.ok) throw new Error("expected a check-digit refusal");
    // The expected digit 5 is computed here with the gs1.org rule; the manual does not state it.
    expect(result.code).toBe("bad_check_digit");
    expect(result.message).toMatch(/check digit 9.*is 5/);
    expect(deriveUii(result.found)).toMatchObject({ ok: true, uii: "000614141999991A0B9C3D6" });
  });

  it("format DD example: TEIs written without a space are read, but its 6-character CAGE is refused", () => {
    // Not usable as a UII check: its output serial (MKLJHUIYD) differs from its input (MKJHUIYD).
    const result = parseLabel("[)>{RS}DD{GS}CAG987654{GS}SERMKJHUIYD{RS}{EOT}");
    if (result.ok) throw new Error("expected a refusal");
    expect(result.code).toBe("malformed");
    expect(result.message).toMatch(/987654.*CAG.*5-character CAGE/);
  });
});
