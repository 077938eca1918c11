// What the scanner hands back, and how a scanned text is parsed depending on where it came from
// and on what the step wants: a part label (standard syntaxes) or a position label (our own).
import {
  parseLabel,
  POSITION_LABEL_TAG,
  readPositionStepLabel,
  type LabelParseResult,
  type LabelReading,
  type ParseLabelOptions,
  type PositionLabelParseResult,
  type PositionLabelReading,
} from "@/domain/labels";

export type LabelScanSource = "camera" | "photo" | "typed";

/** What a step wants scanned. A position step names its aircraft and positions, to check the label against. */
export type ScanTarget =
  | { kind: "part" }
  | { kind: "position"; registration: string; positions: ReadonlyArray<{ code: string; label: string }> };

export const PART_LABEL_TARGET: ScanTarget = { kind: "part" };

/** A part label's reading, a position label's, or the refusal of either. */
export type ScanResult = LabelParseResult | PositionLabelParseResult;

export interface LabelScan {
  /** The text exactly as decoded or typed, control characters included. */
  raw: string;
  parsed: ScanResult;
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

export const isPositionReading = (parsed: ScanResult): parsed is PositionLabelReading =>
  parsed.ok && parsed.syntax === "threadline-position";
export const isPartReading = (parsed: ScanResult): parsed is LabelReading => parsed.ok && parsed.syntax !== "threadline-position";

function parseFor(text: string, target: ScanTarget, options: ParseLabelOptions): ScanResult {
  if (target.kind === "part") return parseLabel(text, options);
  return readPositionStepLabel(text, { registration: target.registration, positionCodes: target.positions.map((p) => p.code) }, options);
}

// Separators are "reliable" only where we have seen the decoder transmit every GS: html5-qrcode's
// ZXing decoder on Data Matrix and QR (FNC1 comes back as GS). Its Code 128 reader drops FNC1
// silently (stack.md, "Scanning with the camera"), the browser's BarcodeDetector is untested here,
// and a wedge scanner or a person typing may leave separators out: for those the parser is told
// separators may be missing, so it infers them or refuses instead of misreading.
const DECODERS_KEEPING_SEPARATORS = new Set(["zxing-js"]);
const SYMBOLOGIES_KEEPING_SEPARATORS = new Set(["DATA_MATRIX", "QR_CODE"]);

export function readDecodedLabel(decoded: DecodedText, source: Exclude<LabelScanSource, "typed">, target: ScanTarget = PART_LABEL_TARGET): LabelScan {
  const separatorsReliable =
    DECODERS_KEEPING_SEPARATORS.has(decoded.decoderName ?? "") && SYMBOLOGIES_KEEPING_SEPARATORS.has(decoded.symbology ?? "");
  return { raw: decoded.text, parsed: parseFor(decoded.text, target, { separatorsReliable }), source, symbology: decoded.symbology };
}

export function readTypedLabel(text: string, target: ScanTarget = PART_LABEL_TARGET): LabelScan {
  return { raw: text, parsed: parseFor(text, target, {}), source: "typed", symbology: null };
}

/** An example of what to type, for hints: a part label, or this aircraft's first position label. */
export function typingExample(target: ScanTarget): string {
  if (target.kind === "part") return "P/N 1234-56 S/N AB123";
  return `${POSITION_LABEL_TAG} ${target.registration} ${target.positions[0]?.code ?? "<position code>"}`;
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
  "threadline-position": "Threadline position label",
};
