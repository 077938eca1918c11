// The plain "P/N ... S/N ..." fallback. These forms are the brief's list of what operators type or
// read off tags; all values are invented and the checks cover Threadline's own rules.
import { describe, expect, it } from "vitest";
import { parseLabel, type LabelParseResult } from "@/domain/labels";

function reading(result: LabelParseResult) {
  if (!result.ok) throw new Error(`expected a reading, got ${result.code}: ${result.message}`);
  return result;
}
function refusalOf(result: LabelParseResult) {
  if (result.ok) throw new Error(`expected a refusal, got ${JSON.stringify(result)}`);
  return result;
}

describe("plain labels", () => {
  it.each([
    "P/N 123-456 S/N A1234",
    "PN: 123-456 SN: A1234",
    "P/N:123-456, S/N:A1234",
    "PART NO 123-456 SERIAL NO A1234",
    "PART NO. 123-456 SERIAL NO. A1234",
    "PART NUMBER: 123-456; SERIAL NUMBER: A1234",
    "PN 123-456 / SN A1234",
    "p/n 123-456 s/n A1234",
    "Part No 123-456\nSerial A1234",
    "S/N A1234 P/N 123-456",
    "P/N 123-456/S/N A1234",
    "PN#123-456 SN#A1234",
  ])("reads %j", (text) => {
    expect(parseLabel(text)).toMatchObject({ ok: true, syntax: "plain", partNumber: "123-456", serialNumber: "A1234", cage: null });
  });

  it("reads an optional CAGE or MFR code, upper-casing it", () => {
    expect(reading(parseLabel("P/N 123-456 S/N A1234 CAGE 0AB12")).cage).toBe("0AB12");
    expect(reading(parseLabel("MFR 0ab12, P/N 123-456, S/N A1234")).cage).toBe("0AB12");
    expect(reading(parseLabel("CAGE CODE: 0AB12 / PN 1 / SN 2")).cage).toBe("0AB12");
  });

  it("keeps slashes inside values", () => {
    const r = reading(parseLabel("P/N 123/456 S/N A/1"));
    expect([r.partNumber, r.serialNumber]).toEqual(["123/456", "A/1"]);
  });

  it("does not read PNR as PN", () => {
    expect(reading(parseLabel("PNR 123 SER 456")).syntax).toBe("ata-text");
  });

  it("refuses a CAGE that is not five characters, two different part numbers, and a missing serial", () => {
    expect(refusalOf(parseLabel("P/N 1 S/N 2 CAGE 0AB1")).code).toBe("malformed");
    expect(refusalOf(parseLabel("P/N 1 P/N 3 S/N 2")).code).toBe("contradictory");
    const r = refusalOf(parseLabel("P/N 123-456"));
    expect(r.code).toBe("missing_serial_number");
    expect(r.message).toBe("Found part number 123-456 (P/N) but no serial number (S/N).");
  });

  it("does not take free text for a label", () => {
    expect(refusalOf(parseLabel("PART 123 SERIAL")).code).toBe("unrecognised");
  });
});
