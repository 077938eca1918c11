// ATA Spec 2000 text elements written as plain text (no 15434 envelope). TEI meanings: trade-facts
// 1.3. CAGE 0CVA5 and serial 674A36458 are quoted from E1 (uidlaser.com); part numbers are
// invented. The checks cover Threadline's reading rules for this form.
import { describe, expect, it } from "vitest";
import { deriveUii, parseLabel, type LabelParseResult } from "@/domain/labels";

function reading(result: LabelParseResult) {
  if (!result.ok) throw new Error(`expected a reading, got ${result.code}: ${result.message}`);
  return result;
}
function refusalOf(result: LabelParseResult) {
  if (result.ok) throw new Error(`expected a refusal, got ${JSON.stringify(result)}`);
  return result;
}

describe("plain-text TEI labels", () => {
  const expected = {
    ok: true,
    syntax: "ata-text",
    partNumber: "123-456",
    serialNumber: "A1234",
    cage: "0CVA5",
    elements: [
      { id: "MFR", name: "manufacturer CAGE code", value: "0CVA5" },
      { id: "PNR", name: "part number", value: "123-456" },
      { id: "SER", name: "serial number", value: "A1234" },
    ],
  };

  it.each([
    ["slashes (the plate form)", "MFR 0CVA5/PNR 123-456/SER A1234"],
    ["spaced slashes", "MFR 0CVA5 / PNR 123-456 / SER A1234"],
    ["spaces", "MFR 0CVA5 PNR 123-456 SER A1234"],
    ["newlines", "MFR 0CVA5\nPNR 123-456\nSER A1234"],
    ["CRLF and extra blank lines", "MFR 0CVA5\r\n\r\nPNR 123-456\r\nSER A1234\r\n"],
    ["GS characters", "MFR 0CVA5\x1DPNR 123-456\x1DSER A1234"],
    ["GS control pictures", "MFR 0CVA5␝PNR 123-456␝SER A1234"],
    ["another order", "SER A1234 / MFR 0CVA5 / PNR 123-456"],
  ])("reads elements separated by %s", (_name, text) => {
    const r = reading(parseLabel(text));
    expect(r).toMatchObject({ ...expected, elements: expect.arrayContaining(expected.elements) });
  });

  it("keeps a slash that belongs to the part number", () => {
    expect(reading(parseLabel("MFR 0CVA5/PNR 123/456/SER A1234")).partNumber).toBe("123/456");
    expect(reading(parseLabel("MFR 0CVA5 / PNR 123/456 / SER A1/2")).serialNumber).toBe("A1/2");
  });

  it("reads TEIs in any letter case and keeps the values as written", () => {
    const r = reading(parseLabel("mfr 0CVA5 pnr ab-1 ser x9"));
    expect([r.partNumber, r.serialNumber, r.elements[0].id]).toEqual(["ab-1", "x9", "MFR"]);
  });

  it("prefers PNR over PNO and uses SEQ or UCN as serial", () => {
    expect(reading(parseLabel("CAG 0CVA5 PNO OLD-1 PNR NEW-2 SEQ 5")).partNumber).toBe("NEW-2");
    expect(reading(parseLabel("MFR 0CVA5 PNR NEW-2 UCN U5")).serialNumber).toBe("U5");
  });

  it("refuses the E1 elements as text for want of a part number; their UII is E1's (uidlaser.com, trade-facts 1.3)", () => {
    const r = refusalOf(parseLabel("MFR 0CVA5 SER 674A36458"));
    expect(r.code).toBe("missing_part_number");
    expect(r.message).toBe(
      "Found manufacturer CAGE code 0CVA5 (MFR) and serial number 674A36458 (SER) but no part number (PNR or PNO).",
    );
    expect(deriveUii(r.found)).toMatchObject({ ok: true, uii: "D0CVA5674A36458" });
  });

  it("refuses a CAGE that is not five characters", () => {
    const r = refusalOf(parseLabel("MFR 0CVA PNR 1 SER 2"));
    expect(r.code).toBe("malformed");
    expect(r.message).toContain("0CVA (MFR) is not a 5-character CAGE code");
  });

  it("refuses text after the elements that is no TEI, naming it", () => {
    const r = refusalOf(parseLabel("MFR 0CVA5 PNR 123-456 SER A1234 MADE 99"));
    expect(r.code).toBe("malformed");
    expect(r.message).toContain('"MADE 99" is not a known text element');
  });

  it("refuses two different serials", () => {
    expect(refusalOf(parseLabel("PNR 1 SER 2 SER 3")).code).toBe("contradictory");
  });
});
