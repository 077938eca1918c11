// ANSI MH10.8.2 Data Identifiers used in ISO/IEC 15434 format 06 (trade-facts 1.2).
import { isValidYymmdd, isValidYyyymmdd } from "./calendar-dates";
import type { FieldSpec } from "./split-readings";
import { isCage, isDuns, isPrintable, isUiiText } from "./value-formats";

export interface DataIdentifier {
  id: string;
  name: string;
  fixedLength?: number;
  accepts(value: string): boolean;
  /** Format in words, for messages. */
  format: string;
}

const any = { accepts: isPrintable, format: "printable text" };

export const DATA_IDENTIFIERS: readonly DataIdentifier[] = [
  { id: "1P", name: "supplier part number", ...any },
  { id: "30P", name: "first-level part number", ...any },
  { id: "P", name: "customer part number", ...any },
  { id: "S", name: "serial number", ...any },
  {
    id: "18S",
    name: "CAGE code + serial number",
    accepts: (v) => isCage(v.slice(0, 5)) && v.length > 5 && isUiiText(v),
    format: "a 5-character CAGE code followed by a serial (A-Z, 0-9, - and /)",
  },
  {
    id: "25S",
    name: "issuing agency code + enterprise ID + serial number",
    accepts: isUiiText,
    format: "a UII (A-Z, 0-9, - and /, at most 50 characters)",
  },
  { id: "17V", name: "CAGE code", fixedLength: 5, accepts: isCage, format: "a 5-character CAGE code" },
  {
    id: "18V",
    name: "issuing agency code + enterprise ID",
    accepts: (v) => /^[A-Z0-9]{2,}$/.test(v),
    format: "letters and digits",
  },
  { id: "12V", name: "DUNS number", fixedLength: 9, accepts: isDuns, format: "a 9-digit DUNS number" },
  { id: "1T", name: "lot or batch number", ...any },
  { id: "30T", name: "traceability number", ...any },
  { id: "D", name: "date (YYMMDD)", fixedLength: 6, accepts: (v) => isValidYymmdd(v, false), format: "a YYMMDD date" },
  { id: "12D", name: "date (YYYYMMDD)", fixedLength: 8, accepts: isValidYyyymmdd, format: "a YYYYMMDD date" },
  { id: "14D", name: "expiration date (YYYYMMDD)", fixedLength: 8, accepts: isValidYyyymmdd, format: "a YYYYMMDD date" },
  { id: "16D", name: "production date (YYYYMMDD)", fixedLength: 8, accepts: isValidYyyymmdd, format: "a YYYYMMDD date" },
];

const BY_ID = new Map(DATA_IDENTIFIERS.map((di) => [di.id, di]));

export function findDataIdentifier(id: string): DataIdentifier | undefined {
  return BY_ID.get(id);
}

/** Split specs for messages whose GS separators were dropped. */
export const DATA_IDENTIFIER_SPECS: readonly FieldSpec[] = DATA_IDENTIFIERS.map((di) => ({
  id: di.id,
  marker: di.id,
  fixedLength: di.fixedLength,
  accepts: di.accepts,
}));

/** A DI is up to three digits and one letter (MH10.8.2 structure) [from memory]. */
export function splitDataIdentifier(segment: string): { id: string; value: string } | null {
  const match = /^(\d{0,3}[A-Z])([\s\S]*)$/.exec(segment);
  return match ? { id: match[1], value: match[2] } : null;
}
