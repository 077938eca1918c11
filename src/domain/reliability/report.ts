// The figures of a rates report for one part-number group (or ATA chapter) and period, from plain
// counts: monthly unit hours and the removals with their shop findings. The server gathers those
// from the ledger; everything computed from them is here, so each rule is a one-line test.
//
// The watched rate is UNSCHEDULED removals per 1,000 unit hours (scheduled removals are planned and
// say nothing about reliability). Each month is compared with an alert level of mean + k·SD of the
// 12 calendar months before it (markAlerts: common practice, from memory; see alert-levels.ts for
// the programme basis, FAA AC 120-17B). The report therefore takes 12 baseline months before the
// period as well, so even its first month has a level.

import { DomainInputError } from "../errors";
import { DEFAULT_BASELINE_MONTHS, markAlerts } from "./alert-levels";
import { mtbfConfidenceInterval } from "./mtbf-bounds";
import { removalRatePer1000, removalStatistics } from "./removal-stats";
import type { MonthWindow } from "./exposure";
import type { WeibullUnit } from "./weibull";

export type Finding = "confirmed_failure" | "no_fault_found" | "damage" | "modification";

export interface RemovalEvent {
  /** Removal instant, epoch ms. */
  at: number;
  unscheduled: boolean;
  /** The shop's finding on return from repair, when it is on file. */
  finding: Finding | null;
}

export interface ReportInput {
  /** Baseline months followed by the report's months, ascending, not overlapping. */
  windows: ReadonlyArray<MonthWindow>;
  /** Unit flight minutes per window (same order). */
  unitMinutes: ReadonlyArray<number>;
  removals: ReadonlyArray<RemovalEvent>;
  /** Start of the report's period (windows before it are the baseline only). */
  periodStart: number;
  /** Now: months ending at or before it are closed. */
  now: number;
  k: number;
  /** Baseline length in months; 12 by default. */
  baselineMonths?: number;
  /** Confidence of the two-sided MTBF interval; 0.90 by default. */
  confidence?: number;
}

export interface ReportMonth {
  month: string;
  closed: boolean;
  unitMinutes: number;
  removals: number;
  unscheduledRemovals: number;
  confirmedFailures: number;
  noFaultFound: number;
  rate: number | null;
  removalRate: number | null;
  alertLevel: number | null;
  priorMonths: number;
  aboveAlert: boolean | null;
}

export interface Report {
  months: ReportMonth[];
  unitMinutes: number;
  removals: number;
  unscheduledRemovals: number;
  confirmedFailures: number;
  noFaultFound: number;
  awaitingFinding: number;
  mtburHours: number | null;
  mtbfHours: number | null;
  mtbfInterval: { confidence: number; lowerHours: number; upperHours: number | null } | null;
  noFaultFoundRate: number | null;
  ratePer1000Hours: number | null;
  removalRatePer1000Hours: number | null;
  alertLevel: number | null;
  /** Closed months of the period whose rate is above their alert level. */
  monthsAboveAlert: string[];
}

interface Counts {
  removals: number;
  unscheduledRemovals: number;
  confirmedFailures: number;
  noFaultFound: number;
  awaitingFinding: number;
}

const emptyCounts = (): Counts => ({ removals: 0, unscheduledRemovals: 0, confirmedFailures: 0, noFaultFound: 0, awaitingFinding: 0 });

function add(counts: Counts, removal: RemovalEvent): void {
  counts.removals += 1;
  if (removal.finding === "confirmed_failure") counts.confirmedFailures += 1;
  if (removal.unscheduled) {
    counts.unscheduledRemovals += 1;
    // NFF is a share of unscheduled removals: a scheduled unit the shop passes is not a "no fault found".
    if (removal.finding === "no_fault_found") counts.noFaultFound += 1;
    if (removal.finding === null) counts.awaitingFinding += 1;
  }
}

/** Whole minutes for display and storage; fractions come from interpolation and are summed first. */
const wholeMinutes = (minutes: number) => Math.max(0, Math.round(minutes));

export function reliabilityReport(input: ReportInput): Report {
  const { windows, unitMinutes, removals, periodStart, now, k } = input;
  const baselineMonths = input.baselineMonths ?? DEFAULT_BASELINE_MONTHS;
  const confidence = input.confidence ?? 0.9;
  if (windows.length !== unitMinutes.length) {
    throw new DomainInputError(`reliabilityReport: ${windows.length} windows but ${unitMinutes.length} unit-minute figures`, "unitMinutes");
  }
  const perWindow = windows.map(emptyCounts);
  for (const removal of removals) {
    const i = windows.findIndex((w) => removal.at >= w.start && removal.at < w.end);
    if (i >= 0) add(perWindow[i], removal);
  }

  const marked = markAlerts(
    windows.map((w, i) => ({ month: w.month, rate: removalRatePer1000(perWindow[i].unscheduledRemovals, unitMinutes[i] / 60) })),
    k,
    baselineMonths,
  );

  const months: ReportMonth[] = [];
  const total = emptyCounts();
  let totalMinutes = 0;
  windows.forEach((w, i) => {
    if (w.start < periodStart) return;
    const c = perWindow[i];
    total.removals += c.removals;
    total.unscheduledRemovals += c.unscheduledRemovals;
    total.confirmedFailures += c.confirmedFailures;
    total.noFaultFound += c.noFaultFound;
    total.awaitingFinding += c.awaitingFinding;
    totalMinutes += unitMinutes[i];
    months.push({
      month: w.month,
      // A month is closed once its calendar month is over (a period cut short mid-month still waits for the month's end).
      closed: nextMonthStart(w.start) <= now,
      unitMinutes: wholeMinutes(unitMinutes[i]),
      removals: c.removals,
      unscheduledRemovals: c.unscheduledRemovals,
      confirmedFailures: c.confirmedFailures,
      noFaultFound: c.noFaultFound,
      rate: marked[i].rate,
      removalRate: removalRatePer1000(c.removals, unitMinutes[i] / 60),
      alertLevel: marked[i].alertLevel,
      priorMonths: marked[i].priorMonths,
      aboveAlert: marked[i].aboveAlert,
    });
  });

  const unitHours = wholeMinutes(totalMinutes) / 60;
  const stats = removalStatistics({
    unitHours,
    removals: total.removals,
    unscheduledRemovals: total.unscheduledRemovals,
    confirmedFailures: total.confirmedFailures,
    noFaultFound: total.noFaultFound,
  });
  const interval = unitHours > 0 ? mtbfConfidenceInterval(unitHours, total.confirmedFailures, confidence, "time") : null;
  return {
    months,
    unitMinutes: wholeMinutes(totalMinutes),
    ...total,
    mtburHours: stats.mtbur,
    mtbfHours: stats.mtbf,
    mtbfInterval: interval ? { confidence, lowerHours: interval.lower, upperHours: interval.upper } : null,
    noFaultFoundRate: stats.noFaultFoundRate,
    ratePer1000Hours: stats.unscheduledRemovalRatePer1000,
    removalRatePer1000Hours: stats.removalRatePer1000,
    alertLevel: months.length ? months[months.length - 1].alertLevel : null,
    monthsAboveAlert: months.filter((m) => m.closed && m.aboveAlert === true).map((m) => m.month),
  };
}

function nextMonthStart(at: number): number {
  const date = new Date(at);
  return Date.UTC(date.getUTCFullYear(), date.getUTCMonth() + 1, 1);
}

/** A unit's time on wing at the end of a fitted interval, and how the interval ended. */
export interface TimeOnWing {
  hours: number;
  ended: "unscheduled" | "scheduled" | "still_fitted";
  finding: Finding | null;
}

export interface WeibullSample {
  units: WeibullUnit[];
  failures: number;
  suspensions: number;
  /** Intervals left out: scheduled removals not counted, or no flight time on wing. */
  excluded: number;
}

/**
 * Failures and suspensions for a Weibull fit of time on wing: unscheduled removals fail (or, with
 * confirmedOnly, only those the shop confirmed; the rest were removed while still working, so they
 * are suspensions); units still fitted are suspensions; scheduled removals are suspensions when the
 * engineer says so, otherwise left out. A time of zero cannot go on Weibull paper and is left out.
 */
export function weibullSample(items: ReadonlyArray<TimeOnWing>, options: { confirmedOnly: boolean; scheduledAsSuspensions: boolean }): WeibullSample {
  const units: WeibullUnit[] = [];
  let excluded = 0;
  for (const item of items) {
    if (!(item.hours > 0) || !Number.isFinite(item.hours)) {
      excluded += 1;
      continue;
    }
    if (item.ended === "still_fitted") units.push({ time: item.hours, failed: false });
    else if (item.ended === "scheduled") {
      if (options.scheduledAsSuspensions) units.push({ time: item.hours, failed: false });
      else excluded += 1;
    } else units.push({ time: item.hours, failed: options.confirmedOnly ? item.finding === "confirmed_failure" : true });
  }
  const failures = units.filter((u) => u.failed).length;
  return { units, failures, suspensions: units.length - failures, excluded };
}
