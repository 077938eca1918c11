import "server-only";
import { formatFlightTime } from "@/domain/flight-time";
import type { RemovalFilters, RemovalListAnswer, RemovalListQuery, RemovalRow, RemovalSort, ShopFinding } from "@/lib/schemas/reliability";
import { SHOP_FINDINGS } from "@/lib/schemas/reliability";
import { db } from "./db";
import { REMOVALS_COLUMNS, REMOVALS_FILTERED_FROM, REMOVALS_FROM, removalsWhere, SHOP_FINDING_COLUMN } from "./removals-sql";

// The removal history: every `removed` ledger entry with its aircraft, position, unit, the
// matching installed entry (for time on wing) and the unit fitted in its place (through swaps).
// The report page and the CSV export share one FROM/WHERE, so a filter means the same in both.
//
// Hours and cycles on wing are the aircraft's totals at the removal minus those at the unit's last
// installation before it, and only when that installation was on the same aircraft and position
// (otherwise the thread has a gap, which the continuity check reports; no figure is invented here).

const SORT_COLUMNS: Record<RemovalSort, string> = {
  removedAt: "r.occurred_at",
  registration: "a.registration",
  partNumber: "pn.part_number",
  serialNumber: "p.serial_number",
  ataChapter: "pos.ata_chapter",
  removalType: "r.removal_type",
  hoursOnWing: "minutes_on_wing",
  cyclesOnWing: "cycles_on_wing",
};

export type RemovalDbRow = Record<string, unknown>;

const numberOrNull = (value: unknown) => (value === null || value === undefined ? null : Number(value));
const minutesText = (value: unknown) => {
  const minutes = numberOrNull(value);
  return minutes === null || minutes < 0 ? null : formatFlightTime(minutes);
};
const isoOf = (value: unknown) => (value instanceof Date ? value : new Date(String(value))).toISOString();

export function toRemovalRow(row: RemovalDbRow): RemovalRow {
  const finding = row.shop_finding as string | null | undefined;
  return {
    seq: Number(row.seq),
    partId: Number(row.part_id),
    registration: String(row.registration),
    aircraftType: String(row.aircraft_type),
    station: String(row.station),
    positionCode: String(row.position_code),
    positionLabel: String(row.position_label),
    ataChapter: String(row.ata_chapter),
    partNumber: String(row.part_number),
    cage: String(row.cage),
    serialNumber: String(row.serial_number),
    removedAt: isoOf(row.removed_at),
    removalType: (row.removal_type as RemovalRow["removalType"]) ?? null,
    reason: (row.reason as string | null) ?? null,
    workOrder: (row.work_order as string | null) ?? null,
    aircraftHours: minutesText(row.aircraft_minutes),
    aircraftCycles: numberOrNull(row.aircraft_cycles),
    hoursOnWing: minutesText(row.minutes_on_wing),
    cyclesOnWing: numberOrNull(row.cycles_on_wing),
    partTsn: minutesText(row.tsn_minutes),
    partCsn: numberOrNull(row.csn),
    installedPartNumber: (row.installed_part_number as string | null) ?? null,
    installedSerialNumber: (row.installed_serial_number as string | null) ?? null,
    recordedBy: String(row.recorded_by),
    shopFinding: finding && (SHOP_FINDINGS as readonly string[]).includes(finding) ? (finding as ShopFinding) : null,
  };
}

/** One page of the removal history with its counts, sorted on the server. */
export async function listRemovals(filters: RemovalFilters, page: RemovalListQuery): Promise<RemovalListAnswer> {
  const where = removalsWhere(filters);
  const order = `${SORT_COLUMNS[page.sort]} ${page.dir === "asc" ? "ASC" : "DESC"}, r.seq ${page.dir === "asc" ? "ASC" : "DESC"}`;
  const offset = (page.page - 1) * page.pageSize;
  const [[rows], [[counts]]] = (await Promise.all([
    db().raw(`SELECT ${REMOVALS_COLUMNS}, ${SHOP_FINDING_COLUMN} ${REMOVALS_FROM} ${where.sql} ORDER BY ${order} LIMIT ? OFFSET ?`, [...where.params, page.pageSize, offset]),
    // Counting needs none of the LEFT JOINs: they never add or drop a removal.
    db().raw(
      `SELECT COUNT(*) AS total, COALESCE(SUM(r.removal_type = 'unscheduled'), 0) AS unscheduled ${REMOVALS_FILTERED_FROM} ${where.sql}`,
      where.params,
    ),
  ])) as [[RemovalDbRow[]], [[{ total: number; unscheduled: number }]]];
  return {
    removals: rows.map(toRemovalRow),
    total: Number(counts.total),
    unscheduled: Number(counts.unscheduled),
    page: page.page,
    pageSize: page.pageSize,
    sort: page.sort,
    dir: page.dir,
  };
}

/** What the filter lists offer: aircraft, types, stations and the ATA chapters of positions. */
export async function removalFilterOptions() {
  const [aircraft, types, stations, chapters] = await Promise.all([
    db()("aircraft").orderBy("registration").pluck("registration"),
    db()("aircraft_types").orderBy("code").select("code", "name"),
    db()("stations").orderBy("code").select("code", "name"),
    db()("positions").distinct("ata_chapter").orderBy("ata_chapter").pluck("ata_chapter"),
  ]);
  return { aircraft: aircraft as string[], types: types as Array<{ code: string; name: string }>, stations: stations as Array<{ code: string; name: string }>, chapters: chapters as string[] };
}
export type RemovalFilterOptions = Awaited<ReturnType<typeof removalFilterOptions>>;
