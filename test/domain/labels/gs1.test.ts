// GS1 element strings. AI facts: trade-facts 1.4 (gs1.dk for AI 10/11/17, MIL-STD-130N for 8004;
// others from memory, marked). GTIN 04912345123459 is the qrcode2 example's (trade-facts 1.4);
// serials, lots and other values are invented and check Threadline's reading rules.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { gs1CheckDigit, isValidGtin, parseGs1ElementString, parseLabel, type LabelParseResult } from "@/domain/labels";

const GS = "\x1D";
const GTIN = "04912345123459";

function reading(result: LabelParseResult) {
  if (!result.ok) throw new Error(`expected a reading, got ${result.code}: ${result.message}`);
  return result;
}
function refusalOf(result: LabelParseResult) {
  if (result.ok) throw new Error(`expected a refusal, got ${JSON.stringify(result)}`);
  return result;
}

describe("reading GS1 element strings", () => {
  it("takes the GTIN as part number and AI 21 as serial; no CAGE", () => {
    expect(parseLabel(`01${GTIN}21SN-77${GS}10L1`)).toEqual({
      ok: true,
      syntax: "gs1",
      partNumber: GTIN,
      serialNumber: "SN-77",
      cage: null,
      elements: [
        { id: "01", name: "GTIN", value: GTIN },
        { id: "21", name: "serial number", value: "SN-77" },
        { id: "10", name: "batch or lot number", value: "L1" },
      ],
    });
  });

  it("prefers AI 240 over the GTIN for the part number", () => {
    expect(reading(parseLabel(`01${GTIN}240PN-1001${GS}21SN-77`)).partNumber).toBe("PN-1001");
  });

  it("reads the human-readable form with parentheses, with or without spaces", () => {
    const compact = reading(parseLabel(`(01)${GTIN}(21)ABC`));
    expect([compact.partNumber, compact.serialNumber]).toEqual([GTIN, "ABC"]);
    expect(parseLabel(`(01) ${GTIN} (21) ABC`)).toEqual(compact);
  });

  it("needs no separator after predefined-length AIs (01, 11, 17) [from memory: GS1 General Specifications]", () => {
    const r = reading(parseLabel(`01${GTIN}11240115172612311010${GS}21X`));
    expect(r.elements.map((e) => [e.id, e.value])).toEqual([
      ["01", GTIN],
      ["11", "240115"],
      ["17", "261231"],
      ["10", "10"],
      ["21", "X"],
    ]);
  });

  it('accepts day "00" in a YYMMDD date, meaning end of month (gs1.dk, trade-facts 1.4: "990800")', () => {
    const r = reading(parseLabel(`(01)${GTIN}(17)990800(21)X`));
    expect(r.elements[1]).toEqual({ id: "17", name: "expiration date", value: "990800" });
    expect(refusalOf(parseLabel(`(01)${GTIN}(17)991300(21)X`)).code).toBe("malformed");
  });

  it("limits AI 10 to 20 characters (gs1.dk, trade-facts 1.4) and AI 8004 to 30 (MIL-STD-130N Table VI note 13)", () => {
    expect(reading(parseLabel(`01${GTIN}10${"L".repeat(20)}${GS}21X`)).elements[1].value).toHaveLength(20);
    expect(refusalOf(parseLabel(`01${GTIN}10${"L".repeat(21)}${GS}21X`)).code).toBe("malformed");
    expect(parseGs1ElementString(`8004${"A".repeat(30)}`).ok).toBe(true);
    expect(parseGs1ElementString(`8004${"A".repeat(31)}`).ok).toBe(false);
  });

  it("refuses letters in the numeric AI 30 and points at a possibly missing separator", () => {
    const r = refusalOf(parseLabel(`01${GTIN}3012AB${GS}21X`));
    expect(r.code).toBe("malformed");
    expect(r.message).toMatch(/AI 30 .*digits.*separator may be missing/);
  });

  it("refuses an AI we do not support, in either form", () => {
    expect(refusalOf(parseLabel(`01${GTIN}${GS}7003123`)).code).toBe("malformed");
    expect(refusalOf(parseLabel(`(01)${GTIN}(7003)123`)).message).toContain("(7003)");
  });

  it("refuses two different values for one AI", () => {
    expect(refusalOf(parseLabel(`(01)${GTIN}(21)A(21)B`)).code).toBe("contradictory");
  });
});

describe("check digits", () => {
  it("refuses a GTIN with a wrong check digit, naming expected and given digits", () => {
    const r = refusalOf(parseLabel(`01${GTIN.slice(0, -1)}421X`));
    expect(r.code).toBe("bad_check_digit");
    expect(r.message).toBe("GTIN 04912345123454 (AI 01) ends in check digit 4, but the GS1 check digit of 0491234512345 is 9.");
    expect(refusalOf(parseLabel(`(01)${GTIN.slice(0, -1)}0(21)X`)).code).toBe("bad_check_digit");
  });

  it("checks the SSCC (AI 00) too", () => {
    const body = "00061414100000001";
    const sscc = body + String(gs1CheckDigit(body));
    expect(parseGs1ElementString(`00${sscc}`).ok).toBe(true);
    const wrong = body + String((gs1CheckDigit(body) + 1) % 10);
    expect(parseGs1ElementString(`00${wrong}`)).toMatchObject({ ok: false, code: "bad_check_digit" });
  });

  it("isValidGtin accepts lengths 8, 12, 13, 14 only", () => {
    expect(isValidGtin(GTIN)).toBe(true);
    expect(isValidGtin(GTIN.slice(1))).toBe(true); // the same GTIN-13 without its leading zero
    expect(isValidGtin("0491234512345")).toBe(false);
    expect(isValidGtin("12345")).toBe(false);
    expect(isValidGtin("0491234512345X")).toBe(false);
  });

  it("gs1CheckDigit refuses non-digits", () => {
    expect(() => gs1CheckDigit("12A")).toThrow(RangeError);
    expect(() => gs1CheckDigit("")).toThrow(RangeError);
  });

  it("property: a body plus its check digit is a valid GTIN, any other last digit is not", () => {
    const body = fc.constantFrom(7, 11, 12, 13).chain((n) => fc.string({ unit: fc.constantFrom(..."0123456789"), minLength: n, maxLength: n }));
    fc.assert(
      fc.property(body, fc.integer({ min: 1, max: 9 }), (digits, shift) => {
        const check = gs1CheckDigit(digits);
        expect(isValidGtin(digits + check)).toBe(true);
        expect(isValidGtin(digits + ((check + shift) % 10))).toBe(false);
      }),
    );
  });
});

describe("symbology identifiers and FNC1", () => {
  const body = `01${GTIN}21X10Y`;
  it.each(["]d2", "]C1", "]Q3"])("%s announces GS1 data and is reported [from memory: AIM identifiers]", (id) => {
    const r = parseGs1ElementString(id + body);
    expect(r).toMatchObject({ ok: true, symbologyId: id });
    expect(reading(parseLabel(id + body)).serialNumber).toBe("X10Y");
  });

  it("treats a leading GS as FNC1 in first position (ISO/IEC 16022 §5.2.4.6, trade-facts 1.4)", () => {
    expect(reading(parseLabel(GS + body)).serialNumber).toBe("X10Y");
  });
});

describe("GS1 strings without any separator", () => {
  it("reads a fixed-length GTIN followed by one variable field with no guess", () => {
    const r = reading(parseLabel(`01${GTIN}21ABC`));
    expect(r.serialNumber).toBe("ABC");
    expect(r.inferredSeparators).toBeUndefined();
  });

  it("refuses as ambiguous when a serial may hide a lot (21X10Y: serial X10Y, or serial X + lot Y)", () => {
    const r = refusalOf(parseLabel(`01${GTIN}21X10Y`));
    expect(r.code).toBe("ambiguous");
    expect(r.message).toContain("no GS (FNC1) separators");
    expect(r.found).toEqual([{ id: "01", name: "GTIN", value: GTIN }]);
  });

  it("uses the standard reading when the caller says separators are reliable", () => {
    expect(reading(parseLabel(`01${GTIN}21X10Y`, { separatorsReliable: true })).serialNumber).toBe("X10Y");
  });

  it("accepts the one complete split and flags it", () => {
    const r = reading(parseLabel(`01${GTIN}10ABC21XYZ`));
    expect(r).toMatchObject({ serialNumber: "XYZ", inferredSeparators: true });
    expect(r.elements[1]).toMatchObject({ id: "10", value: "ABC" });
  });

  it("takes a bare number for no label at all, saying why GS1 did not fit", () => {
    const r = refusalOf(parseLabel("12345"));
    expect(r.code).toBe("unrecognised");
    expect(r.message).toContain("As GS1 data: ");
  });

  it("parseGs1ElementString refuses an empty string", () => {
    expect(parseGs1ElementString("  ")).toMatchObject({ ok: false, code: "malformed" });
  });
});
