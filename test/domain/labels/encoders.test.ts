// Encoders for our own labels. Envelope bytes: header "[)>" RS, "06" GS, GS between elements,
// RS EOT trailer (IDAutomation ISO/IEC 15434 format table; trade-facts 1.1). Element order is our
// own choice (src/domain/labels/encode-labels.ts). Values are invented round-trip inputs.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  encodeAtaTextElements,
  encodeIso15434Format06,
  encodeIso15434Format06ForCode128,
  LabelEncodingError,
  parseLabel,
  type PartLabelFields,
} from "@/domain/labels";
import { cageCode, digitsAndDash, isoDate, partOrSerial } from "./arbitraries";

const GS = "\x1D";
const base: PartLabelFields = { partNumber: "ABC-123", serialNumber: "98765", cage: "0CVA5" };

describe("encodeIso15434Format06", () => {
  it("writes [)> RS 06 GS 17V.. GS 1P.. GS S.. RS EOT", () => {
    expect(encodeIso15434Format06(base)).toBe("[)>\x1E06\x1D17V0CVA5\x1D1PABC-123\x1DS98765\x1E\x04");
  });

  it("puts dates after the CAGE and the lot last", () => {
    const text = encodeIso15434Format06({ ...base, lot: "L-7", productionDate: "2024-01-31", expiryDate: "2030-12-31" });
    expect(text).toBe("[)>\x1E06\x1D17V0CVA5\x1D16D20240131\x1D14D20301231\x1D1PABC-123\x1DS98765\x1D1TL-7\x1E\x04");
  });

  it("refuses values it cannot encode faithfully", () => {
    expect(() => encodeIso15434Format06({ ...base, cage: "0CVA" })).toThrow(LabelEncodingError);
    expect(() => encodeIso15434Format06({ ...base, partNumber: "" })).toThrow(/Part number/);
    expect(() => encodeIso15434Format06({ ...base, serialNumber: `1${GS}2` })).toThrow(LabelEncodingError);
    expect(() => encodeIso15434Format06({ ...base, serialNumber: " 12" })).toThrow(LabelEncodingError);
    expect(() => encodeIso15434Format06({ ...base, productionDate: "2023-02-29" })).toThrow(/calendar date/);
  });
});

describe("encodeIso15434Format06ForCode128", () => {
  it("keeps RS, GS and EOT as literal ASCII characters", () => {
    const { data } = encodeIso15434Format06ForCode128(base);
    expect(data).toBe(encodeIso15434Format06(base));
    expect([...data].every((c) => c.charCodeAt(0) < 128)).toBe(true);
  });

  it("says whether the message survives a decoder that drops GS", () => {
    expect(encodeIso15434Format06ForCode128(base).readableWithoutSeparators).toBe(true);
    expect(encodeIso15434Format06ForCode128({ ...base, partNumber: "ABS-1" }).readableWithoutSeparators).toBe(false);
    expect(encodeIso15434Format06ForCode128({ ...base, lot: "7" }).readableWithoutSeparators).toBe(false);
  });
});

describe("encodeAtaTextElements", () => {
  it('writes "MFR x / PNR y / SER z", or with the separator asked for', () => {
    expect(encodeAtaTextElements(base)).toBe("MFR 0CVA5 / PNR ABC-123 / SER 98765");
    expect(encodeAtaTextElements(base, { separator: "/" })).toBe("MFR 0CVA5/PNR ABC-123/SER 98765");
    expect(encodeAtaTextElements(base, { separator: "\n" })).toBe("MFR 0CVA5\nPNR ABC-123\nSER 98765");
  });

  it("refuses spaces inside values", () => {
    expect(() => encodeAtaTextElements({ ...base, partNumber: "ABC 123" })).toThrow(LabelEncodingError);
  });
});

describe("round trips (property-based)", () => {
  const fields = fc.record({ partNumber: partOrSerial, serialNumber: partOrSerial, cage: cageCode });

  it("parseLabel(encodeIso15434Format06(x)) gives x back", () => {
    fc.assert(
      fc.property(fields, (x) => {
        expect(parseLabel(encodeIso15434Format06(x))).toMatchObject({ ok: true, syntax: "iso15434", format: "06", ...x });
      }),
      { numRuns: 500 },
    );
  });

  it("optional lot and dates come back as elements", () => {
    fc.assert(
      fc.property(fields, partOrSerial, isoDate, isoDate, (x, lot, made, expires) => {
        const result = parseLabel(encodeIso15434Format06({ ...x, lot, productionDate: made, expiryDate: expires }));
        if (!result.ok) throw new Error(result.message);
        expect(result.elements.map((e) => [e.id, e.value])).toEqual([
          ["17V", x.cage],
          ["16D", made.replaceAll("-", "")],
          ["14D", expires.replaceAll("-", "")],
          ["1P", x.partNumber],
          ["S", x.serialNumber],
          ["1T", lot],
        ]);
      }),
      { numRuns: 300 },
    );
  });

  it("with every GS removed: the same reading when flagged readable, otherwise 'ambiguous', never a wrong reading", () => {
    let readable = 0;
    fc.assert(
      fc.property(fields, (x) => {
        const { data, readableWithoutSeparators } = encodeIso15434Format06ForCode128(x);
        const stripped = parseLabel(data.replaceAll(GS, ""));
        if (readableWithoutSeparators) {
          readable++;
          expect(stripped).toMatchObject({ ok: true, inferredSeparators: true, ...x });
        } else {
          expect(stripped).toMatchObject({ ok: false, code: "ambiguous" });
        }
      }),
      { numRuns: 1000 },
    );
    expect(readable).toBeGreaterThan(300); // most realistic values survive; see encode-labels.ts
  });

  it("with every GS removed, values of digits and dashes always read back", () => {
    fc.assert(
      fc.property(fc.record({ partNumber: digitsAndDash, serialNumber: digitsAndDash, cage: cageCode }), (x) => {
        expect(encodeIso15434Format06ForCode128(x).readableWithoutSeparators).toBe(true);
        expect(parseLabel(encodeIso15434Format06(x).replaceAll(GS, ""))).toMatchObject({ ok: true, ...x });
      }),
      { numRuns: 300 },
    );
  });

  it("reads back through a keyboard wedge's stand-ins", () => {
    const standIns = fc.constantFrom<[string, string, string]>(["^]", "^^", "^D"], ["<GS>", "<RS>", "<EOT>"], ["␝", "␞", "␄"], ["{gs}", "{rs}", "{eot}"]);
    fc.assert(
      fc.property(fields, standIns, (x, [gs, rs, eot]) => {
        const typed = encodeIso15434Format06(x).replaceAll("\x1D", gs).replaceAll("\x1E", rs).replaceAll("\x04", eot);
        expect(parseLabel(typed)).toMatchObject({ ok: true, ...x });
      }),
      { numRuns: 300 },
    );
  });

  it("parseLabel(encodeAtaTextElements(x)) gives x back with each separator", () => {
    fc.assert(
      fc.property(fields, fc.constantFrom<" / " | "/" | "\n">(" / ", "/", "\n"), (x, separator) => {
        expect(parseLabel(encodeAtaTextElements(x, { separator }))).toMatchObject({ ok: true, syntax: "ata-text", ...x });
      }),
      { numRuns: 500 },
    );
  });
});
