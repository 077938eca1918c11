// The printed label, read back: each symbol is rendered to PNG exactly as the label route renders it,
// decoded with the camera scanner's decoder (ZXing, as bundled by html5-qrcode) and parsed with
// parseLabel, and must give back the same P/N, S/N and CAGE.
import { describe, expect, it } from "vitest";
import { encodeIso15434Format06ForCode128, encodePositionLabel, parseLabel, parsePositionLabel } from "../../src/domain/labels";
import { labelMessage, renderLabelPng } from "../../src/server/label-symbols";
import { decodeSymbol } from "./label-print-decoder";

// Invented demo catalog data.
const UNITS = [
  { partNumber: "QF-3242-50", serialNumber: "EA01234", cage: "Q4B22" },
  { partNumber: "QF-2911-10", serialNumber: "HP01017", cage: "Q5P12" },
  { partNumber: "QF-3241-10/A", serialNumber: "MW-0042", cage: "Q4W17" },
];

describe("printed label symbols", () => {
  for (const unit of UNITS) {
    for (const symbology of ["datamatrix", "code128"] as const) {
      for (const scale of [2, 4]) {
        it(`${symbology} at ${scale} px per module reads back as P/N ${unit.partNumber} S/N ${unit.serialNumber}`, async () => {
          const message = labelMessage(unit);
          const png = await renderLabelPng(symbology, message, scale);
          const decoded = decodeSymbol(png, symbology);
          expect(decoded).toBe(message);
          const reading = parseLabel(decoded);
          expect(reading).toMatchObject({ ok: true, syntax: "iso15434", format: "06", partNumber: unit.partNumber, serialNumber: unit.serialNumber, cage: unit.cage });
        });
      }
    }
  }

  // Our Code 128 keeps GS as a literal character, which ZXing returns; a decoder that dropped it could
  // misread a serial such as HP01017 ("S H" + "P 01017"), so the label page points such units to the Data Matrix.
  it("knows which Code 128 labels survive a decoder that drops the separators", () => {
    expect(UNITS.map((unit) => encodeIso15434Format06ForCode128(unit).readableWithoutSeparators)).toEqual([true, false, true]);
  });
});

// Position labels (Threadline's own syntax) carry plain printable text in both symbols.
const POSITIONS = [
  { registration: "Q-FRBC", positionCode: "B2-EBA1" },
  { registration: "Q-FRAA", positionCode: "E2-STARTER" },
  { registration: "Q-FRBD", positionCode: "NLG-STEER" },
  // The longest the schemas allow: 16 and 32 characters.
  { registration: "QZ-ABCDEFGHIJKLM", positionCode: "LONG-POSITION-CODE-0123456789-AB" },
];

describe("printed position label symbols", () => {
  for (const position of POSITIONS) {
    for (const symbology of ["datamatrix", "code128"] as const) {
      it(`${symbology} reads back as ${position.registration} ${position.positionCode}`, async () => {
        const text = encodePositionLabel(position);
        const decoded = decodeSymbol(await renderLabelPng(symbology, text, 3), symbology);
        expect(decoded).toBe(text);
        expect(parsePositionLabel(decoded)).toMatchObject({ ok: true, ...position });
      });
    }
  }
});
