// ISO/IEC 15434 messages. Envelope bytes per trade-facts 1.1 (barcodesoft, Brady, IDAutomation);
// DIs per trade-facts 1.2, TEIs per 1.3. The inputs below are invented; what they check is
// Threadline's own reading rules (the brief's precedence and refusal rules), not published values.
import { describe, expect, it } from "vitest";
import { parseLabel, type LabelParseResult } from "@/domain/labels";

const GS = "\x1D";
const RS = "\x1E";
const EOT = "\x04";
const msg = (format: string, ...elements: string[]) => `[)>${RS}${format}${GS}${elements.join(GS)}${RS}${EOT}`;

function reading(result: LabelParseResult) {
  if (!result.ok) throw new Error(`expected a reading, got ${result.code}: ${result.message}`);
  return result;
}
function refusalOf(result: LabelParseResult) {
  if (result.ok) throw new Error(`expected a refusal, got ${JSON.stringify(result)}`);
  return result;
}

describe("format 06 (MH10.8.2 data identifiers)", () => {
  it("reads 17V, 1P and S", () => {
    expect(parseLabel(msg("06", "17V1XY23", "1PPN-1001", "SSN0042"))).toEqual({
      ok: true,
      syntax: "iso15434",
      format: "06",
      partNumber: "PN-1001",
      serialNumber: "SN0042",
      cage: "1XY23",
      elements: [
        { id: "17V", name: "CAGE code", value: "1XY23" },
        { id: "1P", name: "supplier part number", value: "PN-1001" },
        { id: "S", name: "serial number", value: "SN0042" },
      ],
    });
  });

  it("takes the part number from 1P, else 30P, else P, and reports all of them", () => {
    const all = reading(parseLabel(msg("06", "PCUST-1", "30PCURR-2", "1PSUPP-3", "S1")));
    expect(all.partNumber).toBe("SUPP-3");
    expect(all.elements.map((e) => e.id)).toEqual(["P", "30P", "1P", "S"]);
    expect(reading(parseLabel(msg("06", "PCUST-1", "30PCURR-2", "S1"))).partNumber).toBe("CURR-2");
    expect(reading(parseLabel(msg("06", "PCUST-1", "S1"))).partNumber).toBe("CUST-1");
  });

  it("derives serial and CAGE from 18S when there is no S or 17V", () => {
    const r = reading(parseLabel(msg("06", "1PPN-7", "18S1XY23A-998")));
    expect([r.serialNumber, r.cage]).toEqual(["A-998", "1XY23"]);
  });

  it("derives serial from 25S with issuing agency D (CAGE) or UN (DUNS)", () => {
    const d = reading(parseLabel(msg("06", "1PPN-7", "25SD1XY23A998")));
    expect([d.serialNumber, d.cage]).toEqual(["A998", "1XY23"]);
    const un = reading(parseLabel(msg("06", "1PPN-7", "25SUN123456789A998")));
    expect([un.serialNumber, un.cage]).toEqual(["A998", null]);
  });

  it("refuses a 25S whose serial cannot be separated from the enterprise ID, and says so", () => {
    const r = refusalOf(parseLabel(msg("06", "1PPN-7", "25S0614141A998")));
    expect(r.code).toBe("missing_serial_number");
    expect(r.message).toMatch(/25S 0614141A998 is a UII whose serial cannot be separated/);
  });

  it("accepts S and 18S that agree; refuses them when they differ", () => {
    expect(reading(parseLabel(msg("06", "1PPN-7", "SA998", "18S1XY23A998"))).serialNumber).toBe("A998");
    const r = refusalOf(parseLabel(msg("06", "1PPN-7", "SA998", "18S1XY23B111")));
    expect(r.code).toBe("contradictory");
    expect(r.message).toBe("Two different serial numbers: A998 (S) and B111 (18S).");
  });

  it("refuses a 17V that disagrees with the CAGE inside 18S", () => {
    const r = refusalOf(parseLabel(msg("06", "17V0AB12", "1PPN-7", "18S1XY23A998")));
    expect(r.code).toBe("contradictory");
    expect(r.message).toContain("0AB12 (17V) and 1XY23 (18S)");
  });

  it("refuses two different values for the same DI, accepts a repeated identical one", () => {
    expect(refusalOf(parseLabel(msg("06", "1PPN-7", "S1", "S2"))).code).toBe("contradictory");
    expect(reading(parseLabel(msg("06", "1PPN-7", "S1", "S1"))).serialNumber).toBe("1");
  });

  it("reads dates D (YYMMDD) and 12D/14D/16D (YYYYMMDD), and refuses impossible ones", () => {
    const r = reading(parseLabel(msg("06", "1PPN-7", "S1", "D240229", "12D20240101", "14D20301231", "16D20240131")));
    expect(r.elements.map((e) => e.id)).toEqual(["1P", "S", "D", "12D", "14D", "16D"]);
    expect(refusalOf(parseLabel(msg("06", "1PPN-7", "S1", "D230229"))).code).toBe("malformed");
    expect(refusalOf(parseLabel(msg("06", "1PPN-7", "S1", "16D2024013"))).message).toMatch(/YYYYMMDD/);
  });

  it("refuses a 17V that is not five characters, and a 12V that is not nine digits", () => {
    expect(refusalOf(parseLabel(msg("06", "17V1XY2", "1PPN-7", "S1"))).message).toMatch(/"1XY2" \(17V\) is not a 5-character CAGE code/);
    expect(refusalOf(parseLabel(msg("06", "12V12345", "1PPN-7", "S1"))).code).toBe("malformed");
  });

  it("keeps a DI it does not know as an element, without using it", () => {
    const r = reading(parseLabel(msg("06", "1PPN-7", "S1", "9KORDER-5")));
    expect(r.elements[2]).toEqual({ id: "9K", name: "unsupported data identifier", value: "ORDER-5" });
  });

  it("refuses an element that does not start with a data identifier", () => {
    expect(refusalOf(parseLabel(msg("06", "1PPN-7", "-123"))).code).toBe("malformed");
  });

  it("reads 12V DUNS, 18V, 1T and 30T as reported elements", () => {
    const r = reading(parseLabel(msg("06", "12V123456789", "18VLH0AB12", "1PPN-7", "S1", "1TLOT-4", "30TTR-9")));
    expect(r.elements.map((e) => e.name)).toEqual([
      "DUNS number",
      "issuing agency code + enterprise ID",
      "supplier part number",
      "serial number",
      "lot or batch number",
      "traceability number",
    ]);
    expect(r.cage).toBeNull();
  });
});

describe("format 12 and DD (text element identifiers)", () => {
  it("prefers PNR (current) over PNO (original) and reports both", () => {
    const r = reading(parseLabel(msg("12", "MFR 1XY23", "PNO OLD-1", "PNR NEW-2", "SER 77")));
    expect(r.partNumber).toBe("NEW-2");
    expect(r.elements.map((e) => [e.id, e.value])).toContainEqual(["PNO", "OLD-1"]);
    expect(reading(parseLabel(msg("12", "MFR 1XY23", "PNO OLD-1", "SER 77"))).partNumber).toBe("OLD-1");
  });

  it("takes the serial from SER, SEQ or UCN, and refuses two different ones", () => {
    expect(reading(parseLabel(msg("DD", "CAG 1XY23", "PNO P-1", "SEQ 5"))).serialNumber).toBe("5");
    expect(reading(parseLabel(msg("12", "MFR 1XY23", "PNR P-1", "UCN U-5"))).serialNumber).toBe("U-5");
    expect(refusalOf(parseLabel(msg("12", "MFR 1XY23", "PNR P-1", "SER 5", "SEQ 6"))).code).toBe("contradictory");
  });

  it("takes the CAGE from MFR or CAG; SPL only when neither is there", () => {
    expect(reading(parseLabel(msg("12", "SPL 2CD34", "MFR 1XY23", "PNR P-1", "SER 5"))).cage).toBe("1XY23");
    expect(reading(parseLabel(msg("12", "SPL 2CD34", "PNR P-1", "SER 5"))).cage).toBe("2CD34");
    const clash = refusalOf(parseLabel(msg("12", "MFR 1XY23", "CAG 2CD34", "PNR P-1", "SER 5")));
    expect(clash.message).toBe("Two different CAGE codes: 1XY23 (MFR) and 2CD34 (CAG).");
  });

  it("allows spaces inside a GS-separated value, and keeps unknown TEIs", () => {
    const r = reading(parseLabel(msg("12", "PNR P 1", "SER 5", "XYZ free text")));
    expect(r.partNumber).toBe("P 1");
    expect(r.elements[2]).toEqual({ id: "XYZ", name: "unsupported text element", value: "free text" });
  });

  it("refuses an invalid MFR value and an element without a TEI", () => {
    expect(refusalOf(parseLabel(msg("12", "MFR 1XY2345", "PNR P-1", "SER 5"))).code).toBe("malformed");
    expect(refusalOf(parseLabel(msg("12", "12345", "SER 5"))).code).toBe("malformed");
  });
});

describe("envelope handling", () => {
  const full = msg("06", "17V1XY23", "1PPN-1001", "SSN0042");

  it("tolerates a missing RS after [)>, a missing trailer, a symbology identifier and a trailing newline", () => {
    const expected = reading(parseLabel(full));
    expect(parseLabel(full.replace(`[)>${RS}`, "[)>"))).toEqual(expected);
    expect(parseLabel(full.replace(`${RS}${EOT}`, ""))).toEqual(expected);
    expect(parseLabel(`]d1${full}\r\n`)).toEqual(expected);
  });

  it("refuses an EOT inside the message, an unknown format and an empty envelope", () => {
    expect(refusalOf(parseLabel(`[)>${RS}06${GS}1PPN-7${EOT}${GS}S1${RS}${EOT}`)).code).toBe("malformed");
    const unknown = refusalOf(parseLabel(msg("07", "hello")));
    expect(unknown.code).toBe("unrecognised");
    expect(unknown.message).toContain("format 07 is not supported");
    expect(refusalOf(parseLabel(`[)>${RS}06${GS}${RS}${EOT}`)).code).toBe("malformed");
  });

  it("reads several envelopes together and checks them against each other", () => {
    const two = `[)>${RS}06${GS}17V1XY23${GS}1PPN-7${RS}12${GS}SER 5${RS}${EOT}`;
    expect(reading(parseLabel(two))).toMatchObject({ format: "06+12", partNumber: "PN-7", serialNumber: "5", cage: "1XY23" });
    const clash = `[)>${RS}06${GS}17V1XY23${GS}1PPN-7${GS}S5${RS}12${GS}MFR 2CD34${RS}${EOT}`;
    expect(refusalOf(parseLabel(clash)).message).toBe("Two different CAGE codes: 1XY23 (17V) and 2CD34 (MFR).");
  });
});

describe("visible stand-ins for the separators", () => {
  const real = msg("06", "17V1XY23", "1PPN-1001", "SSN0042");
  const variants: Array<[string, string]> = [
    ["Unicode control pictures", real.replaceAll(GS, "\u241D").replaceAll(RS, "\u241E").replaceAll(EOT, "\u2404")],
    ["caret notation", real.replaceAll(GS, "^]").replaceAll(RS, "^^").replaceAll(EOT, "^D")],
    ["<GS> tokens", real.replaceAll(GS, "<GS>").replaceAll(RS, "<RS>").replaceAll(EOT, "<EOT>")],
    ["{gs} tokens in lower case", real.replaceAll(GS, "{gs}").replaceAll(RS, "{rs}").replaceAll(EOT, "{eot}")],
    ["mixed", real.replaceAll(GS, "<Gs>").replace(RS, "^^").replace(`${RS}${EOT}`, "\u241E{EOT}")],
  ];
  it.each(variants)("%s read like the control characters", (_name, text) => {
    expect(parseLabel(text)).toEqual(parseLabel(real));
  });

  it('does not take "^d" (lower case) for EOT', () => {
    expect(reading(parseLabel(msg("06", "1PPN^d", "S1"))).partNumber).toBe("PN^d");
  });
});

describe("messages without GS separators", () => {
  it("refuses the brief's example as ambiguous and shows both readings", () => {
    const r = refusalOf(parseLabel(`[)>${RS}061PABC-123S9876517VAB123`));
    expect(r.code).toBe("ambiguous");
    expect(r.message).toContain("no GS separators");
    expect(r.message).toContain("1P ABC-123 + S 98765 + 17V AB123");
    expect(r.message).toContain("1P ABC-123 + S 9876517VAB123");
    expect(r.found).toEqual([{ id: "1P", name: "supplier part number", value: "ABC-123" }]);
  });

  it("reads our own element order when only one split is complete, and flags it", () => {
    const r = reading(parseLabel(`[)>${RS}0617V0CVA51PABC-123S98765${RS}${EOT}`));
    expect(r).toMatchObject({ partNumber: "ABC-123", serialNumber: "98765", cage: "0CVA5", inferredSeparators: true });
  });

  it("splits fixed-length fields without any guess", () => {
    const r = refusalOf(parseLabel(`[)>${RS}0617V0CVA5D240131`));
    expect(r.code).toBe("missing_part_number");
    expect(r.found.map((e) => [e.id, e.value])).toEqual([
      ["17V", "0CVA5"],
      ["D", "240131"],
    ]);
  });

  it("keeps a GS after the format indicator as proof that separators are sent: one element per field", () => {
    const r = refusalOf(parseLabel(`[)>${RS}06${GS}1PABCS123${RS}${EOT}`));
    expect(r.code).toBe("missing_serial_number");
    expect(r.found).toEqual([{ id: "1P", name: "supplier part number", value: "ABCS123" }]);
  });

  it("reads by the standard rule when the caller says separators are reliable", () => {
    const r = refusalOf(parseLabel(`[)>${RS}061PABCS123`, { separatorsReliable: true }));
    expect(r.found.map((e) => e.value)).toEqual(["ABCS123"]);
  });

  it("splits a format 12 message at the TEI-and-space markers", () => {
    const r = reading(parseLabel(`[)>${RS}12MFR 0CVA5PNR 123-456SER A1234${RS}${EOT}`));
    expect(r).toMatchObject({ cage: "0CVA5", partNumber: "123-456", serialNumber: "A1234", format: "12" });
  });

  it("refuses text that cannot be split into known identifiers", () => {
    expect(refusalOf(parseLabel(`[)>${RS}06XYZ`)).code).toBe("malformed");
  });
});
