// Label syntaxes: parsing scanned label text and encoding the labels we print. Part labels follow
// published standards; position labels are Threadline's own syntax (position-label.ts).
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
export {
  checkPositionLabel,
  claimsPositionLabel,
  encodePositionLabel,
  parsePositionLabel,
  POSITION_CODE_MAX,
  POSITION_LABEL_FORM,
  POSITION_LABEL_PREFIX,
  POSITION_LABEL_TAG,
  POSITION_LABEL_VERSION,
  REGISTRATION_MAX,
  type PositionLabelContext,
  type PositionLabelFields,
  type PositionLabelParseResult,
  type PositionLabelReading,
} from "./position-label";
export { readPositionStepLabel } from "./position-step";
