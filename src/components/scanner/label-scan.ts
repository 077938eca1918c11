// What the scanner hands back, and how a scanned text is parsed depending on where it came from.
import { parseLabel, type LabelParseResult } from "@/domain/labels";

export type LabelScanSource = "camera" | "photo" | "typed";

export interface LabelScan {
  /** The text exactly as decoded or typed, control characters included. */
  raw: string;
  parsed: LabelParseResult;
  source: LabelScanSource;
  /** The symbology the decoder reported ("CODE_128", "DATA_MATRIX", "QR_CODE"); null when typed. */
  symbology: string | null;
}

export interface DecodedText {
  text: string;
  symbology: string | null;
  /** "zxing-js" for html5-qrcode's own decoder, "BarcodeDetector" for the browser's. */
  decoderName: string | null;
}

// Separators are "reliable" only where we have seen the decoder transmit every GS: html5-qrcode's
// ZXing decoder on Data Matrix and QR (FNC1 comes back as GS). Its Code 128 reader drops FNC1
// silently (stack.md, "Scanning with the camera"), the browser's BarcodeDetector is untested here,
// and a wedge scanner or a person typing may leave separators out: for those the parser is told
// separators may be missing, so it infers them or refuses instead of misreading.
const DECODERS_KEEPING_SEPARATORS = new Set(["zxing-js"]);
const SYMBOLOGIES_KEEPING_SEPARATORS = new Set(["DATA_MATRIX", "QR_CODE"]);

export function readDecodedLabel(decoded: DecodedText, source: Exclude<LabelScanSource, "typed">): LabelScan {
  const separatorsReliable =
    DECODERS_KEEPING_SEPARATORS.has(decoded.decoderName ?? "") && SYMBOLOGIES_KEEPING_SEPARATORS.has(decoded.symbology ?? "");
  return { raw: decoded.text, parsed: parseLabel(decoded.text, { separatorsReliable }), source, symbology: decoded.symbology };
}

export function readTypedLabel(text: string): LabelScan {
  return { raw: text, parsed: parseLabel(text), source: "typed", symbology: null };
}

export const SYMBOLOGY_NAMES: Record<string, string> = {
  CODE_128: "Code 128 barcode",
  DATA_MATRIX: "Data Matrix code",
  QR_CODE: "QR code",
};

export const SYNTAX_NAMES: Record<string, string> = {
  iso15434: "ISO/IEC 15434 message",
  "ata-text": "ATA Spec 2000 text elements",
  gs1: "GS1 element string",
  plain: "Plain P/N and S/N text",
};
