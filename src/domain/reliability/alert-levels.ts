// Monthly removal rates and the alert levels a reliability programme compares
// them with.
//
// Programme basis: FAA AC 120-17B, "Reliability Program Methods – Standards for
// Determining Time Limitations" (12/19/18). The AC leaves the alert method to
// the operator's programme document, and different methods give slightly
// different levels, so every method here takes its constants as parameters:
//  - mean + k·SD of the previous 12 months, k = 2 by default. This is common
//    industry practice (k = 2 or 3), recalled from memory, not quoted from a
//    published source; set k to what the programme document says.
//  - Transport Canada AMA 571.101/1 Appendix A, Example 1: 1.3 × the mean of
//    the 3-month running-average rate over the sample period.
//  - A Poisson test on the month's count (see poisson-alert.ts).

import { DomainInputError } from "../errors";
import { removalRatePer1000 } from "./removal-stats";
import {
  monthIndex,
  requireFiniteNonNegative,
  requireNonNegativeInteger,
  requirePositiveInteger,
} from "./validate";

export interface MonthlyCounts {
  /** Calendar month, "YYYY-MM". */
  month: string;
  /** Unit hours flown in the month by the P/N group (fleet FH × QPA). */
  unitHours: number;
  /** All removals in the month, scheduled and unscheduled. */
  removals: number;
  unscheduledRemovals: number;
}

export interface MonthlyRate extends MonthlyCounts {
  /** All removals per 1,000 unit hours; null for a month with no unit hours. */
  removalRate: number | null;
  /** Unscheduled removals per 1,000 unit hours; null for a month with no unit hours. */
  unscheduledRemovalRate: number | null;
}

/** One month's value of whichever rate is being watched. */
export interface MonthlyValue {
  month: string;
  /** Rate per 1,000 unit hours, or null when the month has no data (no unit hours). */
  rate: number | null;
}

export interface MonthlyAlert extends MonthlyValue {
  /** Alert level from the prior window, or null when too few prior months had a rate. */
  alertLevel: number | null;
  /** How many prior months' rates the alert level was computed from. */
  priorMonths: number;
  /** rate > alertLevel (strictly); null when either is null. */
  aboveAlert: boolean | null;
}

/** Calendar months before a month whose rates make its alert level (mean + k·SD): common practice [from memory]. */
export const DEFAULT_BASELINE_MONTHS = 12;
/**
 * Fewest earlier months with a rate for a month to get an alert level. Threadline's own rule, not a
 * published one: mean + k·SD of a handful of months is too unsteady to act on.
 */
export const DEFAULT_MIN_PRIOR_MONTHS = 6;

/** Rejects duplicate or out-of-order months; gaps are allowed (the window handles them). */
function requireAscendingMonths(where: string, months: ReadonlyArray<{ month: string }>): number[] {
  const indices = months.map((m, i) => monthIndex(`${where} [${i}]`, m.month));
  for (let i = 1; i < indices.length; i++) {
    if (indices[i] <= indices[i - 1]) {
      throw new DomainInputError(
        `${where}: months must be in ascending order without repeats (${months[i - 1].month} then ${months[i].month})`,
        "month",
      );
    }
  }
  return indices;
}

/** Per-month removal rates per 1,000 unit hours (both all and unscheduled removals). */
export function monthlyRates(months: ReadonlyArray<MonthlyCounts>): MonthlyRate[] {
  requireAscendingMonths("monthlyRates", months);
  return months.map((m) => {
    const where = `monthlyRates (${m.month})`;
    requireFiniteNonNegative(where, "unitHours", m.unitHours);
    requireNonNegativeInteger(where, "removals", m.removals);
    requireNonNegativeInteger(where, "unscheduledRemovals", m.unscheduledRemovals);
    if (m.unscheduledRemovals > m.removals) {
      throw new DomainInputError(
        `${where}: unscheduledRemovals (${m.unscheduledRemovals}) cannot exceed removals (${m.removals})`,
        "unscheduledRemovals",
      );
    }
    return {
      month: m.month,
      unitHours: m.unitHours,
      removals: m.removals,
      unscheduledRemovals: m.unscheduledRemovals,
      removalRate: removalRatePer1000(m.removals, m.unitHours),
      unscheduledRemovalRate: removalRatePer1000(m.unscheduledRemovals, m.unitHours),
    };
  });
}

function requireRates(where: string, rates: ReadonlyArray<number>): void {
  rates.forEach((r, i) => requireFiniteNonNegative(where, `rates[${i}]`, r));
}

/**
 * Alert level = mean + k·SD of the given monthly rates.
 *
 * SD is the SAMPLE standard deviation (divisor n − 1): the months are a sample
 * of the component's behaviour, and n − 1 avoids understating the spread (and
 * so the alert level) over a short 12-month baseline. Needs at least 2 rates.
 */
export function alertLevel(previousMonthlyRates: ReadonlyArray<number>, k = 2): number {
  requireRates("alertLevel", previousMonthlyRates);
  requireFiniteNonNegative("alertLevel", "k", k);
  const n = previousMonthlyRates.length;
  if (n < 2) {
    throw new DomainInputError(
      `alertLevel: needs at least 2 monthly rates for a sample standard deviation (got ${n})`,
      "previousMonthlyRates",
    );
  }
  const mean = previousMonthlyRates.reduce((sum, r) => sum + r, 0) / n;
  const sumSquares = previousMonthlyRates.reduce((sum, r) => sum + (r - mean) ** 2, 0);
  return mean + k * Math.sqrt(sumSquares / (n - 1));
}

/**
 * Marks each month against an alert level computed from the months BEFORE it
 * (the month itself is never in its own baseline).
 *
 * The baseline is the calendar window of `window` months before the month
 * (for 2026-01 with window 12: 2025-01 to 2025-12); months
 * missing from the series or with a null rate are simply not in it. A month
 * whose window holds fewer than `minPriorMonths` rates (default
 * DEFAULT_MIN_PRIOR_MONTHS = 6, or the window if smaller; our own rule) gets a
 * null alert level, because mean + k·SD from a handful of months is too
 * unstable to act on.
 */
export function markAlerts(
  series: ReadonlyArray<MonthlyValue>,
  k = 2,
  window = DEFAULT_BASELINE_MONTHS,
  minPriorMonths = Math.min(DEFAULT_MIN_PRIOR_MONTHS, window),
): MonthlyAlert[] {
  const indices = requireAscendingMonths("markAlerts", series);
  requireFiniteNonNegative("markAlerts", "k", k);
  requirePositiveInteger("markAlerts", "window", window);
  requirePositiveInteger("markAlerts", "minPriorMonths", minPriorMonths);
  if (minPriorMonths < 2 || minPriorMonths > window) {
    throw new DomainInputError(
      `markAlerts: minPriorMonths must be between 2 and window (${window}) (got ${minPriorMonths})`,
      "minPriorMonths",
    );
  }
  series.forEach((m) => {
    if (m.rate !== null) requireFiniteNonNegative(`markAlerts (${m.month})`, "rate", m.rate);
  });

  return series.map((m, i) => {
    const prior: number[] = [];
    for (let j = i - 1; j >= 0 && indices[j] >= indices[i] - window; j--) {
      const rate = series[j].rate;
      if (rate !== null) prior.push(rate);
    }
    const level = prior.length >= minPriorMonths ? alertLevel(prior, k) : null;
    return {
      month: m.month,
      rate: m.rate,
      alertLevel: level,
      priorMonths: prior.length,
      aboveAlert: level === null || m.rate === null ? null : m.rate > level,
    };
  });
}

/**
 * Transport Canada AMA 571.101/1 Appendix A, Example 1: alert level =
 * factor (1.3) × the mean of the 3-month running-average rate over the sample
 * period.
 *
 * With n monthly rates there are n − span + 1 running averages (each of months
 * i − 2, i − 1, i within the sample; none reach outside it). Each running
 * average is the plain mean of the monthly rates. A programme that instead
 * pools the counts and hours of the three months gets a slightly different
 * figure when monthly hours differ; its programme document must say which.
 *
 * Against the published text (TC AMA 571.101/1 App. A, Example 1 "Pireps - 1.3
 * Mean Alert Level"): the three-month running-average PIREP rate per 1,000 hours
 * is averaged over the sample operating period (the mean) and multiplied by
 * 1.3. That is what this computes. The text leaves open the two choices above
 * (mean of monthly rates or pooled; running averages only inside the sample),
 * and it is written for PIREP rates: using it on removal rates is our
 * adaptation. Its Figure 1 numbers were not available to check against, so the
 * unit tests use hand-computed values.
 */
export function alertLevelRunningAverage(
  rates: ReadonlyArray<number>,
  factor = 1.3,
  span = 3,
): number {
  requireRates("alertLevelRunningAverage", rates);
  requireFiniteNonNegative("alertLevelRunningAverage", "factor", factor);
  requirePositiveInteger("alertLevelRunningAverage", "span", span);
  if (rates.length < span) {
    throw new DomainInputError(
      `alertLevelRunningAverage: needs at least ${span} monthly rates for one ${span}-month running average (got ${rates.length})`,
      "rates",
    );
  }
  const runningAverages: number[] = [];
  for (let end = span - 1; end < rates.length; end++) {
    let sum = 0;
    for (let j = end - span + 1; j <= end; j++) sum += rates[j];
    runningAverages.push(sum / span);
  }
  const meanOfAverages = runningAverages.reduce((s, r) => s + r, 0) / runningAverages.length;
  return factor * meanOfAverages;
}
