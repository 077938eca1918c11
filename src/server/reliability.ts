import "server-only";
import { formatFlightTime } from "@/domain/flight-time";
import {
  flightMinutesBetween,
  monthStart,
  monthWindows,
  reliabilityReport,
  unitMinutesByWindow,
  weibullMedianRankRegression,
  weibullPlot,
  weibullSample,
  type FittedInterval,
  type MonthWindow,
  type Report,
  type TimeOnWing,
} from "@/domain/reliability";
import type { ReliabilityAnswer, ReliabilityQuery, WeibullAnswer, WeibullQuery } from "@/lib/schemas/reliability";
import { db } from "./db";
import { fittedIntervals, removalEvents, resolveSubject, utilizationSeries, type Subject } from "./reliability-data";

export { groupOf, loadInterchange, resolveSubject, type Subject } from "./reliability-data";

// The server side of the Rates page: it only gathers numbers from the ledger (fitted intervals,
// removals with their shop findings, utilisation) and hands them to src/domain/reliability.
// Subjects: a part number with its interchangeable alternates, or an ATA chapter (by position).

export const METHOD_NOTE =
  "Unit hours: for every installed→removed interval of a unit of the group (installed→now while still fitted), " +
  "the aircraft's flight minutes inside the month, from utilisation snapshots interpolated at the interval ends. " +
  "Rate: unscheduled removals per 1,000 unit hours. Alert level: mean + k·SD (sample SD) of the rates of the 12 calendar months " +
  "before each month; common practice, from memory, with the method to be set in the operator's reliability programme " +
  "(programme basis: FAA AC 120-17B, 12/19/18). MTBF counts shop-confirmed failures from the repaired entries.";

const DAY = 86_400_000;

export interface Period {
  from: number;
  to: number;
}

/** Defaults: the last 12 closed months; with only `from`, up to now; with only `to`, the 12 months before it. */
export function resolvePeriod(query: { from?: Date; to?: Date }, now: Date): Period {
  const nowMs = now.getTime();
  if (query.from && query.to) return { from: query.from.getTime(), to: query.to.getTime() };
  if (query.from) return { from: query.from.getTime(), to: Math.max(nowMs, query.from.getTime() + DAY) };
  if (query.to) return { from: monthStart(query.to.getTime() - 1, -11), to: query.to.getTime() };
  return { from: monthStart(nowMs, -12), to: monthStart(nowMs) };
}

/** The report's months, preceded by the 12 baseline months their alert levels are computed from. */
export function reportWindows(period: Period): MonthWindow[] {
  const baselineStart = monthStart(period.from, -12);
  return [...monthWindows(baselineStart, monthStart(period.from)), ...monthWindows(period.from, period.to)];
}

/** Gathers the numbers for one subject and period and computes the report. */
export async function computeReport(subject: Subject, period: Period, now: Date, k: number, confidence = 0.9): Promise<Report> {
  const windows = reportWindows(period);
  const start = windows[0].start;
  const end = period.to;
  const nowMs = now.getTime();
  const [intervals, removals] = await Promise.all([fittedIntervals(subject, start, end), removalEvents(subject, start, end)]);
  const utilization = await utilizationSeries([...new Set(intervals.map((i) => i.aircraftId))], start, end);
  const fitted: FittedInterval[] = intervals.map((i) => ({ aircraftId: i.aircraftId, from: i.installedAt, to: i.removedAt ?? Math.max(nowMs, end) }));
  const unitMinutes = unitMinutesByWindow(fitted, utilization, windows);
  return reliabilityReport({ windows, unitMinutes, removals, periodStart: period.from, now: nowMs, k, confidence });
}

const hm = (minutes: number | null) => (minutes === null ? null : formatFlightTime(Math.max(0, Math.round(minutes))));

export async function getReliability(query: ReliabilityQuery, now = new Date()): Promise<ReliabilityAnswer> {
  const subject = await resolveSubject(query);
  const period = resolvePeriod(query, now);
  const report = await computeReport(subject, period, now, query.k, query.confidence);
  return {
    subject: subject.kind === "partNumber" ? { kind: "partNumber", label: subject.partNumber } : { kind: "ataChapter", label: `ATA ${subject.ataChapter}` },
    partNumber: subject.kind === "partNumber" ? subject.partNumber : null,
    group: subject.kind === "partNumber" ? subject.group.map(({ partNumber, cage, description }) => ({ partNumber, cage, description })) : [],
    ataChapter: subject.kind === "ataChapter" ? subject.ataChapter : null,
    from: new Date(period.from).toISOString(),
    to: new Date(period.to).toISOString(),
    k: query.k,
    unitHours: formatFlightTime(report.unitMinutes),
    unitMinutes: report.unitMinutes,
    removals: report.removals,
    unscheduledRemovals: report.unscheduledRemovals,
    confirmedFailures: report.confirmedFailures,
    noFaultFound: report.noFaultFound,
    awaitingFinding: report.awaitingFinding,
    mtbur: hm(report.mtburHours === null ? null : report.mtburHours * 60),
    mtburHours: report.mtburHours,
    mtbf: hm(report.mtbfHours === null ? null : report.mtbfHours * 60),
    mtbfHours: report.mtbfHours,
    mtbfInterval: report.mtbfInterval,
    noFaultFoundRate: report.noFaultFoundRate,
    ratePer1000Hours: report.ratePer1000Hours,
    removalRatePer1000Hours: report.removalRatePer1000Hours,
    alertLevel: report.alertLevel,
    monthsAboveAlert: report.monthsAboveAlert,
    method: METHOD_NOTE,
    months: report.months.map((m) => ({ ...m, unitHours: formatFlightTime(m.unitMinutes) })),
  };
}

/**
 * Weibull of time on wing for a part-number group: each installation that ended in the period, and
 * each unit still fitted at its end (a suspension at its time on wing so far). Default period: the
 * whole history up to now.
 */
export async function getWeibull(query: WeibullQuery, now = new Date()): Promise<WeibullAnswer> {
  const subject = await resolveSubject({ partNumber: query.partNumber });
  if (subject.kind !== "partNumber") throw new Error("unreachable");
  const from = query.from?.getTime() ?? 0;
  const to = Math.min(query.to?.getTime() ?? now.getTime(), now.getTime());
  const intervals = await fittedIntervals(subject, from, to);
  const stillFitted = intervals.filter((i) => i.removedAt === null || i.removedAt >= to);
  const utilization = await utilizationSeries([...new Set(stillFitted.map((i) => i.aircraftId))], from, to);
  const items: TimeOnWing[] = intervals.map((i) => {
    if (i.removedAt === null || i.removedAt >= to) {
      return { hours: flightMinutesBetween(utilization.get(i.aircraftId) ?? [], i.installedAt, to) / 60, ended: "still_fitted", finding: null };
    }
    const minutes = i.removedMinutes === null ? 0 : i.removedMinutes - i.installedMinutes;
    return { hours: minutes / 60, ended: i.removalType === "unscheduled" ? "unscheduled" : "scheduled", finding: i.finding };
  });
  const sample = weibullSample(items, { confirmedOnly: query.confirmedOnly, scheduledAsSuspensions: query.scheduledAsSuspensions });
  const base = {
    partNumber: subject.partNumber,
    group: subject.group.map((g) => g.partNumber),
    failures: sample.failures,
    suspensions: sample.suspensions,
    confirmedOnly: query.confirmedOnly,
    scheduledAsSuspensions: query.scheduledAsSuspensions,
  };
  const distinctFailureTimes = new Set(sample.units.filter((u) => u.failed).map((u) => u.time)).size;
  if (sample.failures < 2 || distinctFailureTimes < 2) {
    return {
      ...base,
      fit: null,
      message: `A Weibull line needs at least 2 failures at different times on wing; this selection has ${sample.failures}.`,
      points: [],
      suspensionHours: sample.units.filter((u) => !u.failed).map((u) => u.time).sort((a, b) => a - b),
      line: null,
    };
  }
  const fit = weibullMedianRankRegression(sample.units);
  const plot = weibullPlot(fit);
  return {
    ...base,
    fit: { beta: fit.beta, eta: fit.eta, r2: fit.r2 },
    message: null,
    points: plot.points.map((p) => ({ hours: p.time, medianRank: p.medianRank, x: p.x, y: p.y })),
    suspensionHours: plot.suspensionTimes,
    line: { start: { hours: plot.line.start.time, y: plot.line.start.y }, end: { hours: plot.line.end.time, y: plot.line.end.y } },
  };
}

/** What the Rates form offers, and the part numbers with the most unscheduled removals in the last 12 closed months. */
export async function rateSubjectOptions(now = new Date()) {
  const from = new Date(monthStart(now.getTime(), -12));
  const to = new Date(monthStart(now.getTime()));
  const [partNumbers, chapters, busiest] = await Promise.all([
    db()("part_numbers").distinct("part_number").orderBy("part_number").pluck("part_number"),
    db()("positions").distinct("ata_chapter").orderBy("ata_chapter").pluck("ata_chapter"),
    db()("ledger_entries as r")
      .join("parts as p", "p.id", "r.part_id")
      .join("part_numbers as pn", "pn.id", "p.part_number_id")
      .where({ "r.kind": "removed", "r.removal_type": "unscheduled" })
      .andWhere("r.occurred_at", ">=", from)
      .andWhere("r.occurred_at", "<", to)
      .groupBy("pn.part_number", "pn.description")
      .orderBy([{ column: "unscheduled", order: "desc" }, { column: "pn.part_number" }])
      .limit(8)
      .select("pn.part_number", "pn.description", db().raw("COUNT(*) AS unscheduled")),
  ]);
  const chapterList = [...new Set((chapters as string[]).flatMap((c) => [c.slice(0, 2), c]))].sort();
  return {
    partNumbers: partNumbers as string[],
    chapters: chapterList,
    busiest: busiest.map((b: { part_number: string; description: string; unscheduled: number }) => ({ partNumber: b.part_number, description: b.description, unscheduled: Number(b.unscheduled) })),
  };
}
