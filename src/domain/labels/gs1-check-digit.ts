// GS1 mod-10 check digit (gs1.org, trade-facts 1.4): weights 3,1,3,... from the rightmost
// data digit; the check digit brings the sum up to the next multiple of ten.

/** Check digit for `digits` (the data digits, without a check digit). Throws on non-digits. */
export function gs1CheckDigit(digits: string): number {
  if (!/^\d+$/.test(digits)) throw new RangeError(`gs1CheckDigit needs digits only, got "${digits}"`);
  let sum = 0;
  let weight = 3;
  for (let i = digits.length - 1; i >= 0; i--) {
    sum += Number(digits[i]) * weight;
    weight = 4 - weight;
  }
  return (10 - (sum % 10)) % 10;
}

/** True for a GTIN-8, -12, -13 or -14 whose last digit is the right check digit. */
export function isValidGtin(gtin: string): boolean {
  if (!/^(?:\d{8}|\d{12,14})$/.test(gtin)) return false;
  return gs1CheckDigit(gtin.slice(0, -1)) === Number(gtin[gtin.length - 1]);
}
