// fast-check generators for invented label data (round-trip and property inputs only).
import fc from "fast-check";

const UII_CHARACTERS = [..."ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789-/"];
const ALPHANUMERIC = [..."ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789"];

/** Part or serial number: A-Z, 0-9, "-" and "/", 1-30 characters, at least one letter or digit. */
export const partOrSerial = fc
  .string({ unit: fc.constantFrom(...UII_CHARACTERS), minLength: 1, maxLength: 30 })
  .filter((s) => /[A-Z0-9]/.test(s));

/** Digits and "-" only: no letter, so no data identifier can hide inside the value. */
export const digitsAndDash = fc
  .string({ unit: fc.constantFrom(..."0123456789-"), minLength: 1, maxLength: 30 })
  .filter((s) => /\d/.test(s));

export const cageCode = fc.string({ unit: fc.constantFrom(...ALPHANUMERIC), minLength: 5, maxLength: 5 });

/** A calendar date as YYYY-MM-DD (day capped at 28 so every month has it). */
export const isoDate = fc
  .record({ y: fc.integer({ min: 2000, max: 2099 }), m: fc.integer({ min: 1, max: 12 }), d: fc.integer({ min: 1, max: 28 }) })
  .map(({ y, m, d }) => `${y}-${String(m).padStart(2, "0")}-${String(d).padStart(2, "0")}`);
