// Input checks shared by the reliability functions. Each throws a DomainInputError
// (an Error; see ../errors) whose message names the function and the argument,
// and whose `field` is the argument, so a bad figure coming out of the ledger
// (say, negative unit hours after a botched correction) is easy to trace.

import { DomainInputError } from "../errors";

export function requireFiniteNonNegative(where: string, name: string, value: number): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new DomainInputError(`${where}: ${name} must be a finite number (got ${String(value)})`, name);
  }
  if (value < 0) {
    throw new DomainInputError(`${where}: ${name} must not be negative (got ${value})`, name);
  }
}

export function requireFinitePositive(where: string, name: string, value: number): void {
  requireFiniteNonNegative(where, name, value);
  if (value === 0) {
    throw new DomainInputError(`${where}: ${name} must be greater than zero (got 0)`, name);
  }
}

export function requireNonNegativeInteger(where: string, name: string, value: number): void {
  requireFiniteNonNegative(where, name, value);
  if (!Number.isInteger(value)) {
    throw new DomainInputError(`${where}: ${name} must be a whole number (got ${value})`, name);
  }
}

export function requirePositiveInteger(where: string, name: string, value: number): void {
  requireNonNegativeInteger(where, name, value);
  if (value === 0) {
    throw new DomainInputError(`${where}: ${name} must be at least 1 (got 0)`, name);
  }
}

/** A probability strictly between 0 and 1, e.g. a confidence level such as 0.90. */
export function requireOpenProbability(where: string, name: string, value: number): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0 || value >= 1) {
    throw new DomainInputError(`${where}: ${name} must be strictly between 0 and 1 (got ${String(value)})`, name);
  }
}

/** "YYYY-MM" with a month 01–12. */
const MONTH_PATTERN = /^(\d{4})-(0[1-9]|1[0-2])$/;

/** Parses "YYYY-MM" into a month count (year × 12 + month − 1) so gaps can be measured. */
export function monthIndex(where: string, month: string): number {
  const match = typeof month === "string" ? MONTH_PATTERN.exec(month) : null;
  if (!match) {
    throw new DomainInputError(
      `${where}: month must be "YYYY-MM" with a month 01-12 (got ${JSON.stringify(month)})`,
      "month",
    );
  }
  return Number(match[1]) * 12 + Number(match[2]) - 1;
}
