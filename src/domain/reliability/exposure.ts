// Unit flight time ("unit hours") of a part-number group, from the ledger's actual fitted time.
//
// Method: each installed→removed interval of a unit of the group (or installed→now for a unit still
// fitted) is an interval of time on one aircraft. The flight minutes the unit flew inside a window
// (a month, or the whole period) are the aircraft's total minutes at the clipped interval's end
// minus its total minutes at the clipped start. Aircraft totals at an instant come from the
// utilisation snapshots (never decreasing), interpolated linearly between the two snapshots around
// the instant; before the first snapshot the first value holds and after the last the last value
// holds, so time with no record adds no flight time rather than a guess.
//
// Summing over every fitted interval gives fleet flight hours × positions fitted with the group
// (QPA) without assuming a QPA: a position left empty, or fitted with a part number outside the
// group, adds nothing for that time.

import { DomainInputError } from "../errors";
import { monthIndex } from "./validate";

/** Aircraft total flight minutes as of an instant (epoch ms). */
export interface UtilizationPoint {
  at: number;
  minutes: number;
}

/** One unit's time on one aircraft, [from, to) in epoch ms. */
export interface FittedInterval {
  aircraftId: number;
  from: number;
  to: number;
}

export interface MonthWindow {
  /** "YYYY-MM" */
  month: string;
  start: number;
  end: number;
}

/**
 * Aircraft total minutes at an instant, interpolated between the snapshots around it (see the file
 * comment). The series must be in ascending time order. Fractional minutes are kept: they are
 * summed before anything is rounded.
 */
export function aircraftMinutesAt(series: ReadonlyArray<UtilizationPoint>, at: number): number {
  if (series.length === 0) return 0;
  if (at <= series[0].at) return series[0].minutes;
  const last = series[series.length - 1];
  if (at >= last.at) return last.minutes;
  let lo = 0;
  let hi = series.length - 1;
  // Invariant: series[lo].at < at <= series[hi].at
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (series[mid].at < at) lo = mid;
    else hi = mid;
  }
  const a = series[lo];
  const b = series[hi];
  if (b.at === at) return b.minutes;
  return a.minutes + ((b.minutes - a.minutes) * (at - a.at)) / (b.at - a.at);
}

/** "YYYY-MM" of an instant, in UTC. */
export function monthOf(at: number): string {
  const date = new Date(at);
  return `${date.getUTCFullYear()}-${String(date.getUTCMonth() + 1).padStart(2, "0")}`;
}

/** Start of the UTC month of an instant, plus `add` months. */
export function monthStart(at: number, add = 0): number {
  const date = new Date(at);
  return Date.UTC(date.getUTCFullYear(), date.getUTCMonth() + add, 1);
}

/** Start of a "YYYY-MM" month in epoch ms (UTC). */
export function startOfMonth(month: string): number {
  const index = monthIndex("startOfMonth", month);
  return Date.UTC(Math.floor(index / 12), index % 12, 1);
}

/**
 * The calendar months (UTC) that a period [from, to) touches, each clipped to the period: a period
 * starting mid-month gives a short first month.
 */
export function monthWindows(from: number, to: number): MonthWindow[] {
  if (!Number.isFinite(from) || !Number.isFinite(to)) throw new DomainInputError("monthWindows: from and to must be instants", "from");
  if (to <= from) throw new DomainInputError("monthWindows: the period must end after it starts", "to");
  const windows: MonthWindow[] = [];
  for (let start = monthStart(from); start < to; start = monthStart(start, 1)) {
    windows.push({ month: monthOf(start), start: Math.max(start, from), end: Math.min(monthStart(start, 1), to) });
    if (windows.length > 1200) throw new DomainInputError("monthWindows: a period of at most 100 years", "to");
  }
  return windows;
}

/**
 * Flight minutes the group's units flew in each window, from their fitted intervals and each
 * aircraft's utilisation series (keyed by aircraft id, ascending). Windows must not overlap.
 */
export function unitMinutesByWindow(
  intervals: ReadonlyArray<FittedInterval>,
  utilization: ReadonlyMap<number, ReadonlyArray<UtilizationPoint>>,
  windows: ReadonlyArray<MonthWindow>,
): number[] {
  const totals = windows.map(() => 0);
  if (windows.length === 0) return totals;
  for (const interval of intervals) {
    if (!(interval.to > interval.from)) continue;
    const series = utilization.get(interval.aircraftId) ?? [];
    if (series.length === 0) continue;
    for (let i = 0; i < windows.length; i++) {
      const w = windows[i];
      if (w.end <= interval.from) continue;
      if (w.start >= interval.to) break;
      const start = Math.max(w.start, interval.from);
      const end = Math.min(w.end, interval.to);
      if (end > start) totals[i] += aircraftMinutesAt(series, end) - aircraftMinutesAt(series, start);
    }
  }
  return totals;
}

/** Flight minutes one unit flew on its aircraft between two instants (time on wing so far). */
export function flightMinutesBetween(series: ReadonlyArray<UtilizationPoint>, from: number, to: number): number {
  if (!(to > from)) return 0;
  return aircraftMinutesAt(series, to) - aircraftMinutesAt(series, from);
}
