import "server-only";
import { formatFlightTime } from "@/domain/flight-time";
import { monthOf, monthStart } from "@/domain/reliability";
import { db } from "./db";
import { serverEnv } from "./env";
import { kickOutbox, queueMail } from "./mail";
import { computeReport, groupOf, loadInterchange, type Subject } from "./reliability";

// When a month closes with a part-number group's unscheduled removal rate above its alert level,
// the active reliability engineers are mailed once for that group and month. "Once" is the unique
// key (part_number_id, month) of reliability_alerts: the row and the mail are written in one
// transaction, so two app processes checking at the same moment send one mail between them.
//
// Nothing runs on a timer: the check is made lazily by the rates API and after each unscheduled
// removal. It looks back over the last few closed months, so a month is still caught when nobody
// opened the rates page or recorded a removal on the day it closed.

/**
 * The k for mailed alerts (the Rates page may show other k values; they do not mail). k = 2 is
 * common practice [from memory]; the operator's reliability programme sets its own.
 */
export const ALERT_K = 2;
export const LOOKBACK_MONTHS = 3;
/**
 * THREADLINE'S OWN RULE, not from AC 120-17B or any published alert method: a closed month above its
 * alert level is mailed only when it had at least this many unscheduled removals. Mean + k·SD of
 * twelve quiet months is zero for a part that rarely comes off, so its first removal in a year
 * would "cross" it: on the demo fleet that was 7 of 12 alerts. The month is still marked above its
 * level on the Rates page, and the page's "How the alert level is computed" note states this rule
 * (AlertMethodNote, fed from this constant). Alerting rules belong to the operator's reliability
 * programme; where its programme document says otherwise, this value must follow it.
 */
export const ALERT_MIN_UNSCHEDULED = 2;
/** A full check (every part number) is repeated at most this often per process; a targeted one always runs. */
const FULL_CHECK_INTERVAL_MS = 10 * 60_000;

const globalForAlerts = globalThis as unknown as { threadlineAlertCheck?: { closedThrough: string; at: number } };

/** Which part numbers to check: by id, by the units just removed, or (neither) every one with a recent unscheduled removal. */
export interface AlertCheckScope {
  partNumberIds?: number[];
  partIds?: number[];
  partNumbers?: string[];
}

export interface AlertRaised {
  partNumber: string;
  month: string;
  rate: number;
  alertLevel: number;
}

/**
 * Checks the closed months of the lookback window and mails the alerts not yet sent. With a scope,
 * only those part numbers' groups are checked (after a removal); without, every part number with an
 * unscheduled removal in the window.
 */
export async function checkClosedMonthAlerts(now: Date = new Date(), options: AlertCheckScope = {}): Promise<AlertRaised[]> {
  const nowMs = now.getTime();
  const periodEnd = monthStart(nowMs);
  const periodStart = monthStart(nowMs, -LOOKBACK_MONTHS);
  const closedThrough = monthOf(periodEnd - 1);
  const memo = globalForAlerts.threadlineAlertCheck;
  const scoped = Boolean(options.partNumberIds || options.partIds || options.partNumbers);
  if (!scoped) {
    if (memo && memo.closedThrough === closedThrough && nowMs - memo.at < FULL_CHECK_INTERVAL_MS) return [];
    globalForAlerts.threadlineAlertCheck = { closedThrough, at: nowMs };
  }

  const candidates = await candidatePartNumberIds(options, periodStart, periodEnd);
  if (candidates.length === 0) return [];

  // Alternates share one group: a two-way pair is checked (and mailed) once, under the lowest part
  // number id whose own group is that same set.
  const interchange = await loadInterchange();
  const groups = new Map<string, { representative: number; ids: number[] }>();
  for (const id of candidates) {
    const ids = groupOf([id], interchange);
    const key = ids.join(",");
    if (groups.has(key)) continue;
    const representative = ids.find((member) => groupOf([member], interchange).join(",") === key) ?? id;
    groups.set(key, { representative, ids });
  }

  const partNumbers = await db()("part_numbers").whereIn("id", [...new Set([...groups.values()].flatMap((g) => g.ids))]).select("id", "part_number", "cage");
  const nameOf = new Map(partNumbers.map((p) => [Number(p.id), p.part_number as string]));
  const raised: AlertRaised[] = [];
  for (const group of groups.values()) {
    const subject: Subject = {
      kind: "partNumber",
      partNumber: nameOf.get(group.representative) ?? String(group.representative),
      partNumberIds: group.ids,
      group: [],
    };
    const report = await computeReport(subject, { from: periodStart, to: periodEnd }, now, ALERT_K);
    for (const month of report.months) {
      if (!month.closed || month.aboveAlert !== true || month.rate === null || month.alertLevel === null) continue;
      if (month.unscheduledRemovals < ALERT_MIN_UNSCHEDULED) continue;
      const alternates = group.ids.filter((id) => id !== group.representative).map((id) => nameOf.get(id) ?? String(id));
      const sent = await recordAlert({
        partNumberId: group.representative,
        partNumber: subject.partNumber,
        alternates,
        month: month.month,
        rate: month.rate,
        alertLevel: month.alertLevel,
        unscheduledRemovals: month.unscheduledRemovals,
        unitMinutes: month.unitMinutes,
        priorMonths: month.priorMonths,
        now,
      });
      if (sent) raised.push({ partNumber: subject.partNumber, month: month.month, rate: month.rate, alertLevel: month.alertLevel });
    }
  }
  if (raised.length) kickOutbox();
  return raised;
}

/**
 * The part numbers to check. A scoped check takes its part numbers whatever happened in the window
 * (after a removal, the removed unit's closed months may not have been checked yet in this process);
 * a full check takes every part number with an unscheduled removal in the window.
 */
async function candidatePartNumberIds(scope: AlertCheckScope, periodStart: number, periodEnd: number): Promise<number[]> {
  if (scope.partIds) return (await db()("parts").whereIn("id", scope.partIds).distinct("part_number_id").pluck("part_number_id")).map(Number);
  if (scope.partNumbers) return (await db()("part_numbers").whereIn("part_number", scope.partNumbers).pluck("id")).map(Number);
  if (scope.partNumberIds) return scope.partNumberIds;
  const ids = await db()("ledger_entries as r")
    .join("parts as p", "p.id", "r.part_id")
    .where("r.kind", "removed")
    .andWhere("r.removal_type", "unscheduled")
    .andWhere("r.occurred_at", ">=", new Date(periodStart))
    .andWhere("r.occurred_at", "<", new Date(periodEnd))
    .distinct("p.part_number_id")
    .pluck("p.part_number_id");
  return ids.map(Number);
}

async function recordAlert(alert: {
  partNumberId: number;
  partNumber: string;
  alternates: string[];
  month: string;
  rate: number;
  alertLevel: number;
  unscheduledRemovals: number;
  unitMinutes: number;
  priorMonths: number;
  now: Date;
}): Promise<boolean> {
  return db().transaction(async (trx) => {
    const engineers = await trx("users").where({ role: "reliability", status: "active" }).select("email", "name");
    // INSERT IGNORE: a second checker waits on the key, then finds it taken and sends nothing.
    const [result] = (await trx.raw(
      `INSERT IGNORE INTO reliability_alerts (part_number_id, month, rate_per_1000, alert_level, k, unscheduled_removals, unit_minutes, recipients, created_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      [alert.partNumberId, alert.month, alert.rate, alert.alertLevel, ALERT_K, alert.unscheduledRemovals, alert.unitMinutes, engineers.length, alert.now],
    )) as [{ affectedRows: number }];
    if (result.affectedRows !== 1) return false;
    const group = alert.alternates.length ? `${alert.partNumber} (with alternates ${alert.alternates.join(", ")})` : alert.partNumber;
    const lastDayOfMonth = new Date(monthStart(Date.parse(`${alert.month}-01T00:00:00Z`), 1) - 86_400_000).toISOString().slice(0, 10);
    const link = `${serverEnv().APP_URL.replace(/\/$/, "")}/rates?partNumber=${encodeURIComponent(alert.partNumber)}&to=${lastDayOfMonth}`;
    await queueMail(
      trx,
      engineers.map((engineer) => ({
        to: engineer.email,
        subject: `Alert level crossed: ${alert.partNumber} unscheduled removals in ${alert.month}`,
        text: [
          `${engineer.name},`,
          ``,
          `The unscheduled removal rate of ${group} closed ${alert.month} above its alert level.`,
          ``,
          `Rate: ${alert.rate.toFixed(3)} unscheduled removals per 1,000 unit hours (${alert.unscheduledRemovals} removals in ${formatFlightTime(alert.unitMinutes)} unit hours)`,
          `Alert level: ${alert.alertLevel.toFixed(3)} (mean + ${ALERT_K} SD of the ${alert.priorMonths} months before it)`,
          ``,
          `Rates page: ${link}`,
          ``,
          `The alert method (mean + k·SD of the previous 12 months) is common practice recalled from memory; your reliability programme document (programme basis FAA AC 120-17B) sets the method and k.`,
          `Any maintenance action that follows is done to the maintenance manual, local regulations and licensed judgement.`,
        ].join("\n"),
      })),
    );
    return true;
  });
}

/** For hooks that must not fail the request that triggered them (a recorded removal). */
export function checkClosedMonthAlertsLater(now: Date = new Date(), options: AlertCheckScope = {}): void {
  setImmediate(() => void checkClosedMonthAlerts(now, options).catch((error) => console.error("reliability alert check", error)));
}
