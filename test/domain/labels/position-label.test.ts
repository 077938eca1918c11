// Position labels: Threadline's own syntax "TLPOS1 <registration> <position code>"
// (src/domain/labels/position-label.ts); no standard defines one, so the expected texts here are
// our own definition. Registrations, position codes and part data are invented.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  checkPositionLabel,
  claimsPositionLabel,
  encodeIso15434Format06,
  encodePositionLabel,
  LabelEncodingError,
  parseLabel,
  parsePositionLabel,
  readPositionStepLabel,
  type PositionLabelReading,
} from "@/domain/labels";
import { buildLayout, DEMO_TYPES } from "../../../seeds/lib/layout-data";

const ALNUM = [..."ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789"];
const registration = fc.string({ unit: fc.constantFrom(...ALNUM, "-"), minLength: 1, maxLength: 16 });
const positionCode = fc
  .tuple(fc.constantFrom(...ALNUM), fc.string({ unit: fc.constantFrom(...ALNUM, "-"), maxLength: 31 }))
  .map(([first, rest]) => first + rest);

const AIRCRAFT = { registration: "Q-FRBC", positionCodes: ["B2-EBA1", "B2-EBA2", "NLG-STEER"] };

function read(text: string): PositionLabelReading {
  const result = parsePositionLabel(text);
  if (!result.ok) throw new Error(result.message);
  return result;
}

describe("encodePositionLabel", () => {
  it("writes TLPOS1, the registration and the position code separated by single spaces", () => {
    expect(encodePositionLabel({ registration: "Q-FRBC", positionCode: "B2-EBA1" })).toBe("TLPOS1 Q-FRBC B2-EBA1");
  });

  it("refuses values that the syntax cannot carry", () => {
    expect(() => encodePositionLabel({ registration: "Q FRBC", positionCode: "B2-EBA1" })).toThrow(LabelEncodingError);
    expect(() => encodePositionLabel({ registration: "q-frbc", positionCode: "B2-EBA1" })).toThrow(/Registration/);
    expect(() => encodePositionLabel({ registration: "", positionCode: "B2-EBA1" })).toThrow(/Registration/);
    expect(() => encodePositionLabel({ registration: "Q-FRBC", positionCode: "-B2" })).toThrow(/Position code/);
    expect(() => encodePositionLabel({ registration: "Q-FRBC", positionCode: "B2/EBA1" })).toThrow(/Position code/);
    expect(() => encodePositionLabel({ registration: "Q-FRBC", positionCode: "X".repeat(33) })).toThrow(/1 to 32/);
    expect(() => encodePositionLabel({ registration: "Q".repeat(17), positionCode: "B2" })).toThrow(/1 to 16/);
  });

  it("round-trips every registration and position code the schemas allow", () => {
    fc.assert(
      fc.property(registration, positionCode, (reg, code) => {
        const reading = read(encodePositionLabel({ registration: reg, positionCode: code }));
        expect([reading.registration, reading.positionCode]).toEqual([reg, code]);
      }),
    );
  });

  it("round-trips every position of the demo layouts", () => {
    for (const type of DEMO_TYPES) {
      for (const { code } of buildLayout(type)) {
        expect(read(encodePositionLabel({ registration: "Q-FRAA", positionCode: code })).positionCode).toBe(code);
      }
    }
  });
});

describe("parsePositionLabel", () => {
  it("reads the label as printed", () => {
    expect(parsePositionLabel("TLPOS1 Q-FRBC B2-EBA1")).toEqual({
      ok: true,
      syntax: "threadline-position",
      version: 1,
      registration: "Q-FRBC",
      positionCode: "B2-EBA1",
      elements: [
        { id: "REG", name: "registration", value: "Q-FRBC" },
        { id: "POS", name: "position code", value: "B2-EBA1" },
      ],
    });
  });

  it("accepts what typing and wedge scanners add: case, extra spaces, tabs, line breaks, a symbology identifier", () => {
    for (const text of ["tlpos1 q-frbc b2-eba1", "  TLPOS1   Q-FRBC\tB2-EBA1\r\n", "TLPOS1\nQ-FRBC\nB2-EBA1", "]C0TLPOS1 Q-FRBC B2-EBA1", "]d1TLPOS1 Q-FRBC B2-EBA1"]) {
      const reading = read(text);
      expect([reading.registration, reading.positionCode], JSON.stringify(text)).toEqual(["Q-FRBC", "B2-EBA1"]);
    }
  });

  it("says what is missing", () => {
    expect(parsePositionLabel("TLPOS1")).toMatchObject({ ok: false, code: "missing_registration", found: [] });
    const noCode = parsePositionLabel("TLPOS1 Q-FRBC");
    expect(noCode).toMatchObject({ ok: false, code: "missing_position_code", found: [{ id: "REG", value: "Q-FRBC" }] });
    expect(!noCode.ok && noCode.message).toMatch(/registration Q-FRBC but no position code/);
  });

  it("refuses extra fields, bad characters and unknown versions, naming what it found", () => {
    const extra = parsePositionLabel("TLPOS1 Q-FRBC B2 EBA1");
    expect(extra).toMatchObject({ ok: false, code: "malformed" });
    expect(!extra.ok && extra.message).toMatch(/has 3 fields after TLPOS1; it should have two.*"EBA1"/);

    const slash = parsePositionLabel("TLPOS1 Q-FRBC B2/EBA1");
    expect(slash).toMatchObject({ ok: false, code: "malformed", found: [{ id: "REG" }, { id: "POS", value: "B2/EBA1" }] });
    expect(!slash.ok && slash.message).toMatch(/position code "B2\/EBA1" is not a position code/);

    expect(parsePositionLabel("TLPOS1 Q_FRBC B2")).toMatchObject({ ok: false, code: "malformed" });
    const v2 = parsePositionLabel("TLPOS2 Q-FRBC B2-EBA1");
    expect(v2).toMatchObject({ ok: false, code: "unsupported_version" });
    expect(!v2.ok && v2.message).toMatch(/version 2 .*reads version 1 only/);
    expect(parsePositionLabel("TLPOS Q-FRBC B2-EBA1")).toMatchObject({ ok: false, code: "unsupported_version" });
  });

  it("refuses text that is not a position label", () => {
    expect(parsePositionLabel("")).toMatchObject({ ok: false, code: "not_a_position_label" });
    expect(parsePositionLabel("TLPOSITION 1")).toMatchObject({ ok: false, code: "not_a_position_label" });
    expect(parsePositionLabel("P/N 123-456 S/N A1")).toMatchObject({ ok: false, code: "not_a_position_label" });
    expect(claimsPositionLabel("TLPOS1 anything")).toBe(true);
    expect(claimsPositionLabel("TLPOSX")).toBe(false);
  });
});

describe("checkPositionLabel", () => {
  it("passes a label of this aircraft and one of its positions", () => {
    expect(checkPositionLabel(read("TLPOS1 Q-FRBC NLG-STEER"), AIRCRAFT)).toMatchObject({ ok: true, positionCode: "NLG-STEER" });
  });

  it("refuses a label of another aircraft, naming both", () => {
    const result = checkPositionLabel(read("TLPOS1 Q-FRBD B2-EBA1"), AIRCRAFT);
    expect(result).toMatchObject({ ok: false, code: "other_aircraft" });
    expect(!result.ok && result.message).toMatch(/for aircraft Q-FRBD \(position B2-EBA1\); this swap is on Q-FRBC/);
  });

  it("refuses a position the aircraft's layout does not have", () => {
    const result = checkPositionLabel(read("TLPOS1 Q-FRBC B9-EBA7"), AIRCRAFT);
    expect(result).toMatchObject({ ok: false, code: "unknown_position", found: [{ id: "REG" }, { id: "POS", value: "B9-EBA7" }] });
    expect(!result.ok && result.message).toMatch(/Q-FRBC has no position B9-EBA7/);
  });
});

describe("the two steps refuse each other's labels", () => {
  const partLabel = encodeIso15434Format06({ cage: "1QTL5", partNumber: "QX-4471-02", serialNumber: "TL58213" });

  it("a part label at the position step", () => {
    const result = readPositionStepLabel(partLabel, AIRCRAFT);
    expect(result).toMatchObject({ ok: false, code: "not_a_position_label" });
    expect(!result.ok && result.message).toMatch(/This is a part label \(P\/N QX-4471-02, S\/N TL58213\), not a position label/);
    expect(!result.ok && result.found.map((e) => e.id)).toEqual(["17V", "1P", "S"]);
  });

  it("an incomplete part label or stray text at the position step", () => {
    const incomplete = readPositionStepLabel("P/N QX-4471-02", AIRCRAFT);
    expect(!incomplete.ok && incomplete.message).toMatch(/looks like a part label \(it carries part number QX-4471-02 \(P\/N\)\)/);
    const stray = readPositionStepLabel("hello", AIRCRAFT);
    expect(!stray.ok && stray.message).toMatch(/"hello" is not a position label\. Position labels read "TLPOS1 <registration> <position code>", like "TLPOS1 Q-FRBC B2-EBA1"/);
    expect(readPositionStepLabel("  ", AIRCRAFT)).toMatchObject({ ok: false, code: "not_a_position_label" });
  });

  it("position labels at the position step are read and checked", () => {
    expect(readPositionStepLabel("TLPOS1 Q-FRBC B2-EBA2", AIRCRAFT)).toMatchObject({ ok: true, registration: "Q-FRBC", positionCode: "B2-EBA2" });
    expect(readPositionStepLabel("TLPOS1 Q-FRBD B2-EBA2", AIRCRAFT)).toMatchObject({ ok: false, code: "other_aircraft" });
    expect(readPositionStepLabel("TLPOS1 Q-FRBC", AIRCRAFT)).toMatchObject({ ok: false, code: "missing_position_code" });
  });

  it("a position label where a part label is wanted", () => {
    const result = parseLabel("TLPOS1 Q-FRBC B2-EBA1");
    expect(result).toMatchObject({ ok: false, code: "not_a_part_label", found: [{ id: "REG", value: "Q-FRBC" }, { id: "POS", value: "B2-EBA1" }] });
    expect(!result.ok && result.message).toMatch(/^This is a position label \(aircraft Q-FRBC, position B2-EBA1\), not a part label\. Scan the label on the unit itself/);
    expect(parseLabel("TLPOS1 Q-FRBC")).toMatchObject({ ok: false, code: "not_a_part_label" });
    expect(parseLabel("]C0TLPOS1 Q-FRBC B2-EBA1")).toMatchObject({ ok: false, code: "not_a_part_label" });
  });
});
