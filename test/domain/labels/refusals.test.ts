// Every refusal code, with the wording of its message, plus robustness against arbitrary input.
// Inputs are invented; the wording is Threadline's own (the brief's example message for the first).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseLabel, type LabelParseResult } from "@/domain/labels";

const msg06 = (...elements: string[]) => `[)>\x1E06\x1D${elements.join("\x1D")}\x1E\x04`;

function refusalOf(result: LabelParseResult) {
  if (result.ok) throw new Error(`expected a refusal, got ${JSON.stringify(result)}`);
  return result;
}

describe("refusals", () => {
  it("missing_part_number names what was found and where a part number would be", () => {
    const r = refusalOf(parseLabel(msg06("S12345")));
    expect(r).toEqual({
      ok: false,
      code: "missing_part_number",
      message: "Found serial number 12345 (S) but no part number (1P, P or 30P).",
      found: [{ id: "S", name: "serial number", value: "12345" }],
    });
  });

  it("names both gaps when part and serial are missing", () => {
    const r = refusalOf(parseLabel(msg06("17V1XY23")));
    expect(r.code).toBe("missing_part_number");
    expect(r.message).toBe("Found CAGE code 1XY23 (17V) but no part number (1P, P or 30P) and no serial number (S, 18S or 25S).");
  });

  it("missing_serial_number", () => {
    const r = refusalOf(parseLabel(msg06("17V1XY23", "1PPN-7")));
    expect(r.code).toBe("missing_serial_number");
    expect(r.message).toBe("Found CAGE code 1XY23 (17V) and supplier part number PN-7 (1P) but no serial number (S, 18S or 25S).");
  });

  it("contradictory", () => {
    const r = refusalOf(parseLabel(msg06("1PPN-7", "S1", "S2")));
    expect(r.code).toBe("contradictory");
    expect(r.message).toBe("Two different values for serial number (S): 1 and 2.");
    expect(r.found).toHaveLength(3);
  });

  it("ambiguous", () => {
    expect(refusalOf(parseLabel("[)>\x1E061PABC-123S9876517VAB123")).code).toBe("ambiguous");
  });

  it("bad_check_digit", () => {
    expect(refusalOf(parseLabel("(01)04912345123450(21)X")).message).toContain("is 9");
  });

  it("malformed", () => {
    expect(refusalOf(parseLabel(msg06("17V1XY2", "1PPN-7", "S1"))).code).toBe("malformed");
    expect(refusalOf(parseLabel("P/N 1 ".repeat(1000))).message).toMatch(/at most 4000/);
  });

  it("unrecognised lists the syntaxes tried", () => {
    const r = refusalOf(parseLabel("hello world"));
    expect(r.code).toBe("unrecognised");
    for (const name of ["ISO/IEC 15434", "GS1", "ATA Spec 2000", "P/N"]) expect(r.message).toContain(name);
    expect(refusalOf(parseLabel("   \r\n")).code).toBe("unrecognised");
  });
});

describe("robustness", () => {
  const labelish = fc.string({
    unit: fc.constantFrom(..."[)>0123456789PSVTDNRMFCAGE /:-\x1D\x1E\x04␝^]<>()".split(""), "1P", "17V", "SER ", "MFR ", "PNR ", "(01)"),
    maxLength: 80,
  });

  it("never throws and always returns a well-formed result", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 200 }), labelish, labelish.map((s) => `[)>\x1E06${s}`)), (text) => {
        const result = parseLabel(text);
        if (result.ok) {
          expect(result.partNumber.length).toBeGreaterThan(0);
          expect(result.serialNumber.length).toBeGreaterThan(0);
        } else {
          expect(result.message.length).toBeGreaterThan(0);
          expect(Array.isArray(result.found)).toBe(true);
        }
      }),
      { numRuns: 2000 },
    );
  });
});
