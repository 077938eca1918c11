// A serialised unit's life: the times it carries from airframe to airframe (TSN/CSN, and
// TSO/CSO since its last overhaul), and how much of each life limit is left.
//
// TSN and CSN travel with the serial number, not with the aircraft (14 CFR 91.417(a)(2)(ii),
// AMC M.A.305). While fitted, the unit accrues exactly what its host accrues, so its times at
// any later snapshot follow from its times at installation plus the host's delta.

import { DomainInputError } from "./errors";
import { formatFlightTime, instantToEpochMs } from "./flight-time";

export interface LifeLimits {
  /** Flight-time limit in minutes, or null when the part number has none. */
  minutes: number | null;
  cycles: number | null;
  /** Calendar limit in days from manufacture (or first receipt when that is all we know). */
  days: number | null;
}

/** An aircraft's totals at one instant: a snapshot. */
export interface HostTotals {
  minutes: number;
  cycles: number;
}

/** A unit's own totals. TSO/CSO are null for a unit never overhauled (or not tracked). */
export interface PartTotals {
  tsnMinutes: number;
  csn: number;
  tsoMinutes: number | null;
  cso: number | null;
}

/** The unit's and its host's totals captured together at installation. */
export interface InstallSnapshot {
  part: PartTotals;
  host: HostTotals;
}

function count(value: number, field: string): number {
  if (!Number.isSafeInteger(value) || value < 0) {
    throw new DomainInputError(`${field} must be a whole, non-negative number, got ${value}.`, field);
  }
  return value;
}

function checkHost(host: HostTotals, field: string): void {
  count(host.minutes, `${field}.minutes`);
  count(host.cycles, `${field}.cycles`);
}

function checkPart(part: PartTotals, field: string): void {
  count(part.tsnMinutes, `${field}.tsnMinutes`);
  count(part.csn, `${field}.csn`);
  if (part.tsoMinutes !== null) count(part.tsoMinutes, `${field}.tsoMinutes`);
  if (part.cso !== null) count(part.cso, `${field}.cso`);
}

/**
 * Time and cycles on wing: the host's totals at removal (or now) minus at installation.
 * Aircraft totals never decrease, so a negative delta is a time regression in the records
 * and is refused rather than quietly taken as zero.
 */
export function onWingTime(atInstall: HostTotals, atEnd: HostTotals): HostTotals {
  checkHost(atInstall, "atInstall");
  checkHost(atEnd, "atEnd");
  if (atEnd.minutes < atInstall.minutes) {
    throw new DomainInputError(
      `Time regression: aircraft hours ${formatFlightTime(atEnd.minutes)} are lower than ${formatFlightTime(atInstall.minutes)} at installation.`,
      "aircraftMinutes",
    );
  }
  if (atEnd.cycles < atInstall.cycles) {
    throw new DomainInputError(
      `Time regression: aircraft cycles ${atEnd.cycles} are lower than ${atInstall.cycles} at installation.`,
      "aircraftCycles",
    );
  }
  return { minutes: atEnd.minutes - atInstall.minutes, cycles: atEnd.cycles - atInstall.cycles };
}

/**
 * Carry-over: the unit's totals at a later host snapshot (a removal, or the latest one):
 * TSN at removal = TSN at installation + (host total at removal - host total at installation),
 * and the same for CSN, TSO and CSO. A null TSO/CSO stays null.
 */
export function carryOver(install: InstallSnapshot, hostLater: HostTotals): PartTotals {
  checkPart(install.part, "install.part");
  const delta = onWingTime(install.host, hostLater);
  const { part } = install;
  return {
    tsnMinutes: safeSum(part.tsnMinutes, delta.minutes, "tsnMinutes"),
    csn: safeSum(part.csn, delta.cycles, "csn"),
    tsoMinutes: part.tsoMinutes === null ? null : safeSum(part.tsoMinutes, delta.minutes, "tsoMinutes"),
    cso: part.cso === null ? null : safeSum(part.cso, delta.cycles, "cso"),
  };
}

/** Totals at removal: carry-over from the installation snapshot to the removal snapshot. */
export function totalsAtRemoval(install: InstallSnapshot, hostAtRemoval: HostTotals): PartTotals {
  return carryOver(install, hostAtRemoval);
}

/** Current totals of a fitted unit: carry-over to the aircraft's latest snapshot. */
export function currentTotals(install: InstallSnapshot, latestHost: HostTotals): PartTotals {
  return carryOver(install, latestHost);
}

function safeSum(a: number, b: number, field: string): number {
  const sum = a + b;
  if (!Number.isSafeInteger(sum)) throw new DomainInputError(`${field} total is too large.`, field);
  return sum;
}

/** At overhaul, TSO and CSO restart from zero; TSN and CSN carry on. */
export function resetAtOverhaul(totals: PartTotals): PartTotals {
  checkPart(totals, "totals");
  return { ...totals, tsoMinutes: 0, cso: 0 };
}

const DAY_MS = 86_400_000;
const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;

function toEpochMs(value: string | Date, field: string): number {
  if (value instanceof Date) {
    const ms = value.getTime();
    if (Number.isNaN(ms)) throw new DomainInputError(`${field} is an invalid date.`, field);
    return ms;
  }
  // A date alone ("2019-06-14", as printed on a data plate) means midnight UTC that day.
  return instantToEpochMs(DATE_ONLY.test(value) ? `${value}T00:00:00.000Z` : value, field);
}

/**
 * Whole calendar days elapsed from `since` (manufacture, or first receipt) to `now`, counted
 * in UTC: 2020-01-01 to 2020-01-02T00:00Z is 1 day, to 2020-01-01T23:59Z is 0. The clock is
 * passed in; this never reads the system time.
 */
export function ageInDays(since: string | Date, now: string | Date): number {
  const from = toEpochMs(since, "since");
  const to = toEpochMs(now, "now");
  if (to < from) throw new DomainInputError("now is earlier than the date the age counts from.", "now");
  return Math.floor((to - from) / DAY_MS);
}

// ---------------------------------------------------------------------------------------
// Remaining life

export type LifeStatus = "ok" | "near" | "exceeded";

/**
 * Our own default, not a published figure: a limit is "near" when what is left is 10% of
 * the limit or less. Operators set their own planning margins; pass nearFraction to change it.
 */
export const DEFAULT_NEAR_FRACTION = 0.1;

export interface LimitState {
  limit: number;
  used: number;
  /** limit - used; negative once the limit is overrun. */
  remaining: number;
  status: LifeStatus;
}

export interface LifeUsage {
  tsnMinutes: number;
  csn: number;
  /** Calendar age in days, or null when no start date is known. */
  ageDays: number | null;
}

export interface RemainingLife {
  minutes: LimitState | null;
  cycles: LimitState | null;
  days: LimitState | null;
  /** The worst of the three; "ok" when the part number has no limits. */
  status: LifeStatus;
}

const SEVERITY: Record<LifeStatus, number> = { ok: 0, near: 1, exceeded: 2 };

export function worstStatus(statuses: Iterable<LifeStatus>): LifeStatus {
  let worst: LifeStatus = "ok";
  for (const s of statuses) if (SEVERITY[s] > SEVERITY[worst]) worst = s;
  return worst;
}

function checkNearFraction(nearFraction: number): void {
  if (!(nearFraction >= 0 && nearFraction <= 1)) {
    throw new DomainInputError(`nearFraction must be between 0 and 1, got ${nearFraction}.`, "nearFraction");
  }
}

/**
 * One limit against its usage. Reaching the limit means no life remains, so remaining <= 0 is
 * "exceeded" (the unit may not be fitted or flown further); remaining within nearFraction of
 * the limit (inclusive) is "near".
 */
export function limitState(limit: number, used: number, nearFraction = DEFAULT_NEAR_FRACTION, field = "limit"): LimitState {
  if (!Number.isSafeInteger(limit) || limit <= 0) {
    throw new DomainInputError(`${field} must be a whole number above zero, got ${limit}.`, field);
  }
  count(used, `${field} usage`);
  checkNearFraction(nearFraction);
  const remaining = limit - used;
  const status: LifeStatus = remaining <= 0 ? "exceeded" : remaining <= limit * nearFraction ? "near" : "ok";
  return { limit, used, remaining, status };
}

/** Each life limit the part number has, against the unit's TSN, CSN and calendar age. */
export function remainingLife(
  limits: LifeLimits,
  usage: LifeUsage,
  options: { nearFraction?: number } = {},
): RemainingLife {
  const near = options.nearFraction ?? DEFAULT_NEAR_FRACTION;
  checkNearFraction(near);
  const minutes = limits.minutes === null ? null : limitState(limits.minutes, usage.tsnMinutes, near, "minutes");
  const cycles = limits.cycles === null ? null : limitState(limits.cycles, usage.csn, near, "cycles");
  let days: LimitState | null = null;
  if (limits.days !== null) {
    if (usage.ageDays === null) {
      // Unknown age against a calendar limit must not pass as "ok".
      throw new DomainInputError("The part number has a calendar limit but the unit's age is unknown.", "ageDays");
    }
    days = limitState(limits.days, usage.ageDays, near, "days");
  }
  const status = worstStatus([minutes, cycles, days].flatMap((s) => (s ? [s.status] : [])));
  return { minutes, cycles, days, status };
}
