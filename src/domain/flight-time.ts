// Flight time as integer minutes. Both "H:MM" and decimal hours are in everyday use
// (practice, not regulation), so we accept both on input and store only whole minutes:
// integers add up exactly, where repeated decimal-hour sums drift.
// The strict ISO 8601 instant parsing the ledger and the life calculations share is at the end.

import { DomainInputError } from "./errors";

const MAX_MINUTES = BigInt(Number.MAX_SAFE_INTEGER);
const HHMM = /^(\d+):(\d+)$/;
const DECIMAL = /^(\d*)(?:\.(\d+))?$/;

/**
 * Parses "H:MM" (hours any number of digits, minutes exactly two digits 00-59) or decimal
 * hours (a number, or a string of digits with an optional fraction: "1234.5", ".5").
 *
 * Rounding: decimal hours are rounded to the nearest whole minute, an exact half minute
 * upwards (0.025 h = 1.5 min -> 2 min). The arithmetic is exact on the decimal digits, so
 * the number 0.1 and the string "0.1" both give 6 minutes with no floating-point noise.
 */
export function parseFlightTime(input: string | number, field = "flightTime"): number {
  if (typeof input === "number") return parseDecimalHoursNumber(input, field);
  if (typeof input !== "string") {
    throw new DomainInputError(`Flight time must be "H:MM" or decimal hours, got ${typeof input}.`, field);
  }
  const text = input.trim();
  if (text === "") throw new DomainInputError("Flight time is empty.", field);
  if (text.startsWith("-")) throw new DomainInputError(`Flight time must not be negative: "${input}".`, field);

  const hhmm = HHMM.exec(text);
  if (hhmm) {
    const mm = hhmm[2];
    if (mm.length !== 2) {
      throw new DomainInputError(`Flight time "${input}": minutes must be exactly two digits (00 to 59).`, field);
    }
    if (Number(mm) > 59) {
      throw new DomainInputError(`Flight time "${input}": minutes must be 00 to 59.`, field);
    }
    return checkedMinutes(BigInt(hhmm[1]) * 60n + BigInt(mm), input, field);
  }

  const decimal = DECIMAL.exec(text);
  if (decimal && (decimal[1] !== "" || decimal[2] !== undefined)) {
    return decimalHoursToMinutes(decimal[1], decimal[2] ?? "", input, field);
  }
  throw new DomainInputError(`Flight time "${input}" is neither "H:MM" nor decimal hours.`, field);
}

function parseDecimalHoursNumber(hours: number, field: string): number {
  if (!Number.isFinite(hours)) throw new DomainInputError(`Flight time must be a finite number, got ${hours}.`, field);
  if (hours < 0) throw new DomainInputError(`Flight time must not be negative: ${hours}.`, field);
  // String() gives the shortest decimal that round-trips, i.e. the digits the caller meant.
  const text = String(hours);
  if (text.includes("e")) {
    // Exponent form only appears below 1e-6 h (far under half a minute) or at 1e21 h and above.
    if (hours < 1) return 0;
    throw new DomainInputError(`Flight time ${hours} h is too large.`, field);
  }
  const [whole, fraction = ""] = text.split(".");
  return decimalHoursToMinutes(whole, fraction, text, field);
}

function decimalHoursToMinutes(whole: string, fraction: string, input: string, field: string): number {
  const wholeMinutes = BigInt(whole === "" ? "0" : whole) * 60n;
  if (fraction === "") return checkedMinutes(wholeMinutes, input, field);
  // fraction/10^k hours = 60*fraction/10^k minutes; add half the divisor to round half up.
  const scale = 10n ** BigInt(fraction.length);
  const fractionMinutes = (BigInt(fraction) * 60n * 2n + scale) / (2n * scale);
  return checkedMinutes(wholeMinutes + fractionMinutes, input, field);
}

function checkedMinutes(minutes: bigint, input: string, field: string): number {
  if (minutes > MAX_MINUTES) {
    throw new DomainInputError(`Flight time "${input}" is too large (over ${Number.MAX_SAFE_INTEGER} minutes).`, field);
  }
  return Number(minutes);
}

/** Throws unless `minutes` is a whole, non-negative, exactly representable number of minutes. */
export function assertMinutes(minutes: number, field = "minutes"): number {
  if (!Number.isSafeInteger(minutes) || minutes < 0) {
    throw new DomainInputError(`${field} must be a whole, non-negative number of minutes, got ${minutes}.`, field);
  }
  return minutes;
}

/** Integer minutes -> "H:MM", hours unpadded and unbounded: 0 -> "0:00", 61 -> "1:01". */
export function formatFlightTime(minutes: number): string {
  assertMinutes(minutes);
  const mm = minutes % 60;
  return `${(minutes - mm) / 60}:${mm < 10 ? "0" : ""}${mm}`;
}

/** Sums minutes exactly; refuses a non-integer item or a total past Number.MAX_SAFE_INTEGER. */
export function sumFlightTimes(minutesList: Iterable<number>): number {
  let total = 0;
  let index = 0;
  for (const minutes of minutesList) {
    assertMinutes(minutes, `minutes[${index}]`);
    total += minutes;
    // Both addends are safe integers, so the sum is exact unless it passes the safe range.
    if (!Number.isSafeInteger(total)) {
      throw new DomainInputError(`Flight time total is too large at item ${index}.`, "minutes");
    }
    index++;
  }
  return total;
}

/**
 * Minutes -> decimal hours rounded to `places` decimals (half up), for display and export:
 * 74070 -> 1234.5. Integer arithmetic first, one division last, so no drift accumulates.
 */
export function minutesToDecimalHours(minutes: number, places = 1): number {
  assertMinutes(minutes);
  if (!Number.isInteger(places) || places < 0 || places > 10) {
    throw new DomainInputError(`Decimal places must be a whole number from 0 to 10, got ${places}.`, "places");
  }
  const scale = 10n ** BigInt(places);
  const scaled = (BigInt(minutes) * scale * 2n + 60n) / 120n;
  return Number(scaled) / Number(scale);
}

// ---------------------------------------------------------------------------------------
// Instants
//
// Kept here, beside the durations, rather than in ledger-hash.ts: life.ts and continuity.ts
// need them too, and may end up in client bundles, where ledger-hash's node:crypto cannot go.

// YYYY-MM-DDTHH:MM[:SS[.fff]] followed by Z or +HH:MM / -HH:MM. A zone is required: a bare
// local time would hash differently on machines in different time zones.
const INSTANT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,3}))?)?(Z|([+-])(\d{2}):(\d{2}))$/;
const CANONICAL_INSTANT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/;
const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

/**
 * Parses an ISO 8601 instant with an explicit zone into epoch milliseconds, checking every
 * field's range (Date.parse quietly rolls 30 February over into March). More precision than
 * milliseconds is refused, since the database stores DATETIME(3).
 */
export function instantToEpochMs(value: string, field = "instant"): number {
  const m = typeof value === "string" ? INSTANT.exec(value) : null;
  if (!m) {
    throw new DomainInputError(
      `${field} must be an ISO 8601 instant with a zone, like 2026-03-01T10:15:00.000Z; got ${JSON.stringify(value)}.`,
      field,
    );
  }
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  const hour = Number(m[4]);
  const minute = Number(m[5]);
  const second = m[6] === undefined ? 0 : Number(m[6]);
  const millis = m[7] === undefined ? 0 : Number(m[7].padEnd(3, "0"));
  const monthDays = month === 2 && isLeapYear(year) ? 29 : DAYS_IN_MONTH[month - 1];
  const offsetHours = m[10] === undefined ? 0 : Number(m[10]);
  const offsetMinutes = m[11] === undefined ? 0 : Number(m[11]);
  if (
    month < 1 || month > 12 || day < 1 || day > monthDays ||
    hour > 23 || minute > 59 || second > 59 || offsetHours > 23 || offsetMinutes > 59
  ) {
    throw new DomainInputError(`${field} is not a real instant: ${JSON.stringify(value)}.`, field);
  }
  const offset = (m[9] === "-" ? -1 : 1) * (offsetHours * 60 + offsetMinutes) * 60_000;
  // Date.UTC maps years 0-99 to 1900-1999; setting the full year avoids that.
  const date = new Date(Date.UTC(2000, month - 1, day, hour, minute, second, millis));
  date.setUTCFullYear(year);
  return date.getTime() - offset;
}

/** Any accepted instant -> "2026-03-01T10:15:00.000Z" (UTC, milliseconds). */
export function normaliseInstant(value: string, field = "instant"): string {
  // Fast path for the common case, straight from the database: already canonical and a real
  // date. It reads digits in place, because verifying a million rows makes allocation count.
  if (typeof value === "string" && CANONICAL_INSTANT.test(value) && canonicalFieldsInRange(value)) return value;
  const text = new Date(instantToEpochMs(value, field)).toISOString();
  if (text.length !== 24) throw new DomainInputError(`${field} is outside years 0000-9999: ${value}.`, field);
  return text;
}

function digits2(text: string, at: number): number {
  return (text.charCodeAt(at) - 48) * 10 + (text.charCodeAt(at + 1) - 48);
}

/** Range check of a string already shaped like YYYY-MM-DDTHH:MM:SS.fffZ. */
function canonicalFieldsInRange(text: string): boolean {
  const year = digits2(text, 0) * 100 + digits2(text, 2);
  const month = digits2(text, 5);
  const day = digits2(text, 8);
  if (month < 1 || month > 12 || day < 1) return false;
  const monthDays = month === 2 && isLeapYear(year) ? 29 : DAYS_IN_MONTH[month - 1];
  return day <= monthDays && digits2(text, 11) <= 23 && digits2(text, 14) <= 59 && digits2(text, 17) <= 59;
}
