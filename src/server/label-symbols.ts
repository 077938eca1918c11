import "server-only";
import bwipjs from "bwip-js/node";
import { encodeIso15434Format06, type PartLabelFields } from "@/domain/labels";

export const LABEL_SYMBOLS = ["datamatrix", "code128"] as const;
export type LabelSymbol = (typeof LABEL_SYMBOLS)[number];

/**
 * The one message both symbols of our label carry: ISO/IEC 15434 format 06 with 17V (CAGE), 1P (P/N)
 * and S (S/N). Code 128 carries RS, GS and EOT as literal set-A characters, never FNC1, because
 * decoders drop FNC1 separators (see the shared stack notes).
 */
export function labelMessage(fields: Pick<PartLabelFields, "partNumber" | "serialNumber" | "cage">): string {
  return encodeIso15434Format06({ partNumber: fields.partNumber, serialNumber: fields.serialNumber, cage: fields.cage });
}

function symbolOptions(symbol: LabelSymbol, text: string, scale: number) {
  return symbol === "datamatrix"
    ? // Two modules of quiet zone; one is the minimum [from memory: ISO/IEC 16022].
      { bcid: "datamatrix", text, scale, padding: 2, backgroundcolor: "FFFFFF" }
    : // Ten modules of quiet zone each side, the Code 128 minimum [from memory: ISO/IEC 15417]; bars 12 mm high.
      { bcid: "code128", text, scale, height: 12, paddingwidth: 10, paddingheight: 2, backgroundcolor: "FFFFFF", includetext: false };
}

/** The symbol as PNG, `scale` pixels per module. */
export function renderLabelPng(symbol: LabelSymbol, text: string, scale = 4): Promise<Buffer> {
  return bwipjs.toBuffer(symbolOptions(symbol, text, scale));
}

/** The symbol as SVG markup (vector, so it prints sharp at any size). */
export function renderLabelSvg(symbol: LabelSymbol, text: string): string {
  return bwipjs.toSVG(symbolOptions(symbol, text, 1));
}
