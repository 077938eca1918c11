// Part-label syntaxes: parsing scanned label text and encoding the labels we print.
export type {
  LabelElement,
  LabelFailureCode,
  LabelParseResult,
  LabelReading,
  LabelRefusal,
  LabelSyntax,
  ParseLabelOptions,
} from "./types";
export { parseLabel } from "./parse-label";
export { parseGs1ElementString, type Gs1ElementStringResult } from "./gs1-element-string";
export { gs1CheckDigit, isValidGtin } from "./gs1-check-digit";
export { deriveUii, type UiiDerivation } from "./uii";
export {
  encodeAtaTextElements,
  encodeIso15434Format06,
  encodeIso15434Format06ForCode128,
  LabelEncodingError,
  type AtaTextOptions,
  type Code128LabelData,
  type PartLabelFields,
} from "./encode-labels";
export { EOT, GS, RS, normaliseControlCharacters, showControlCharacters } from "./control-characters";
