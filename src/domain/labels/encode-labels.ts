// Encoders for the labels we print ourselves.
//
// Element order of our format 06 message is fixed: 17V, 16D, 14D, 1P, S, 1T.
// Fixed-length elements (CAGE, dates) come first so that, if a decoder drops the GS separators,
// no variable-length value can swallow them; 1P comes before S so that the reading "1P swallows
// S" leaves no serial and is discarded (split-readings.ts). With a lot (1T) last, S could swallow
// it, so such a message always needs its separators.
import { isValidYyyymmdd } from "./calendar-dates";
import { EOT, GS, RS } from "./control-characters";
import { LabelEncodingError } from "./encoding-error";
import { parseLabel } from "./parse-label";
import type { LabelElement } from "./types";
import { isCage } from "./value-formats";

export interface PartLabelFields {
  partNumber: string;
  serialNumber: string;
  /** CAGE code of the manufacturer, 5 characters. */
  cage: string;
  lot?: string;
  /** ISO date YYYY-MM-DD, encoded as 16D. */
  productionDate?: string;
  /** ISO date YYYY-MM-DD, encoded as 14D. */
  expiryDate?: string;
}

export { LabelEncodingError };

// Printable ASCII without leading or trailing spaces: what every decoder returns unchanged.
const PRINTABLE = /^[\x21-\x7E](?:[\x20-\x7E]*[\x21-\x7E])?$/;

function checkText(what: string, value: string): string {
  if (!PRINTABLE.test(value)) throw new LabelEncodingError(`${what} "${value}" must be printable ASCII without outer spaces.`);
  return value;
}

function checkCage(cage: string): string {
  if (!isCage(cage)) throw new LabelEncodingError(`CAGE code "${cage}" must be 5 characters A-Z or 0-9.`);
  return cage;
}

function compactDate(what: string, isoDate: string): string {
  const compact = /^\d{4}-\d{2}-\d{2}$/.test(isoDate) ? isoDate.replaceAll("-", "") : "";
  if (!isValidYyyymmdd(compact)) throw new LabelEncodingError(`${what} "${isoDate}" must be a calendar date YYYY-MM-DD.`);
  return compact;
}

/** The exact ISO/IEC 15434 format 06 message, control characters as real characters. */
export function encodeIso15434Format06(fields: PartLabelFields): string {
  const elements = [`17V${checkCage(fields.cage)}`];
  if (fields.productionDate !== undefined) elements.push(`16D${compactDate("Production date", fields.productionDate)}`);
  if (fields.expiryDate !== undefined) elements.push(`14D${compactDate("Expiry date", fields.expiryDate)}`);
  elements.push(`1P${checkText("Part number", fields.partNumber)}`, `S${checkText("Serial number", fields.serialNumber)}`);
  if (fields.lot !== undefined) elements.push(`1T${checkText("Lot", fields.lot)}`);
  return `[)>${RS}06${GS}${elements.join(GS)}${RS}${EOT}`;
}

export interface Code128LabelData {
  /** Characters to encode; RS, GS and EOT stay literal ASCII 30, 29, 4 (Code 128 set A), never FNC1. */
  data: string;
  /**
   * Whether parseLabel reads the same fields back when a decoder drops every GS. When false,
   * print a Data Matrix instead, or accept that such decoders will get an "ambiguous" refusal.
   */
  readableWithoutSeparators: boolean;
}

const sameElements = (a: readonly LabelElement[], b: readonly LabelElement[]) =>
  a.length === b.length && a.every((e, i) => e.id === b[i].id && e.value === b[i].value);

/** Format 06 message for our Code 128 path. */
export function encodeIso15434Format06ForCode128(fields: PartLabelFields): Code128LabelData {
  const data = encodeIso15434Format06(fields);
  const separated = parseLabel(data);
  const stripped = parseLabel(data.replaceAll(GS, ""));
  const readableWithoutSeparators =
    separated.ok && stripped.ok && sameElements(stripped.elements, separated.elements);
  return { data, readableWithoutSeparators };
}

export interface AtaTextOptions {
  /** Between elements; " / " by default, "/" gives the compact plate form. */
  separator?: " / " | "/" | "\n";
}

/** Human-readable line "MFR 0CVA5 / PNR 123-456 / SER A1234". Values may not contain spaces. */
export function encodeAtaTextElements(
  fields: Pick<PartLabelFields, "cage" | "partNumber" | "serialNumber">,
  options: AtaTextOptions = {},
): string {
  const noSpaces = (what: string, value: string) => {
    if (/\s/.test(checkText(what, value))) throw new LabelEncodingError(`${what} "${value}" must not contain spaces in a text-element line.`);
    return value;
  };
  return [
    `MFR ${checkCage(fields.cage)}`,
    `PNR ${noSpaces("Part number", fields.partNumber)}`,
    `SER ${noSpaces("Serial number", fields.serialNumber)}`,
  ].join(options.separator ?? " / ");
}
