import "server-only";
import { formatFlightTime } from "@/domain/flight-time";
import type { RemovalFilters, RemovalListAnswer, RemovalListQuery, RemovalRow, RemovalSort, ShopFinding } from "@/lib/schemas/reliability";
import { SHOP_FINDINGS } from "@/lib/schemas/reliability";
import type { Knex } from "knex";
import { db } from "./db";

// The removal history: every `removed` ledger entry with its aircraft, position, unit, the
// matching installed entry (for time on wing) and the unit fitted in its place (through swaps).
// The report page and the CSV export share one FROM/WHERE, so a filter means the same in both.
//
// Hours and cycles on wing are the aircraft's totals at the removal minus those at the unit's last
// installation before it, and only when that installation was on the same aircraft and position
// (otherwise the thread has a gap, which the continuity check reports; no figure is invented here).

export interface SqlPart {
  sql: string;
  params: Knex.Value[];
}

/** Filters as SQL over the aliases of REMOVALS_FROM. Everything goes through placeholders. */
export function removalsWhere(filters: RemovalFilters): SqlPart {
  const clauses = ["r.kind = 'removed'"];
  const params: Knex.Value[] = [];
  if (filters.from) {
    clauses.push("r.occurred_at >= ?");
    params.push(filters.from);
  }
  if (filters.to) {
    clauses.push("r.occurred_at < ?");
    params.push(filters.to);
  }
  if (filters.partNumber) {
    clauses.push("pn.part_number = ?");
    params.push(filters.partNumber);
  }
  if (filters.ataChapter) {
    // A chapter (32) matches every section under it; a section (32-42) matches itself and its subjects.
    clauses.push("(pos.ata_chapter = ? OR pos.ata_chapter LIKE ?)");
    params.push(filters.ataChapter, `${filters.ataChapter}-%`);
  }
  if (filters.registration) {
    clauses.push("a.registration = ?");
    params.push(filters.registration);
  }
  if (filters.aircraftType) {
    clauses.push("t.code = ?");
    params.push(filters.aircraftType);
  }
  if (filters.station) {
    clauses.push("st.code = ?");
    params.push(filters.station);
  }
  if (filters.removalType) {
    clauses.push("r.removal_type = ?");
    params.push(filters.removalType);
  }
  return { sql: `WHERE ${clauses.join(" AND ")}`, params };
}

/**
 * Driven from ledger_entries: with STRAIGHT_JOIN and the primary key the export reads removals in
 * seq order with no sort (the optimizer's own join order ran 2x slower in the shared performance
 * notes). Every other table is an eq_ref lookup; the last installation before the removal comes from
 * the (part_id, seq) index, the replacement from swaps.removed_seq.
 */
export const REMOVALS_FROM = `
FROM ledger_entries r
JOIN aircraft a ON a.id = r.aircraft_id
JOIN aircraft_types t ON t.id = a.aircraft_type_id
JOIN stations st ON st.id = a.station_id
JOIN positions pos ON pos.id = r.position_id
JOIN parts p ON p.id = r.part_id
JOIN part_numbers pn ON pn.id = p.part_number_id
JOIN users u ON u.id = r.recorded_by
LEFT JOIN ledger_entries ie ON ie.seq = (
  SELECT MAX(x.seq) FROM ledger_entries x WHERE x.part_id = r.part_id AND x.kind = 'installed' AND x.seq < r.seq
)
LEFT JOIN swaps sw ON sw.removed_seq = r.seq
LEFT JOIN ledger_entries ins ON ins.seq = sw.installed_seq
LEFT JOIN parts ip ON ip.id = ins.part_id
LEFT JOIN part_numbers ipn ON ipn.id = ip.part_number_id`;

const SAME_FIT = "ie.aircraft_id = r.aircraft_id AND ie.position_id = r.position_id";

/** The columns both the page and the export read. */
export const REMOVALS_COLUMNS = `
  r.seq,
  r.part_id,
  a.registration,
  t.code AS aircraft_type,
  st.code AS station,
  pos.code AS position_code,
  pos.label AS position_label,
  pos.ata_chapter,
  pn.part_number,
  pn.cage,
  p.serial_number,
  r.occurred_at AS removed_at,
  r.removal_type,
  r.reason,
  r.work_order,
  r.aircraft_minutes,
  r.aircraft_cycles,
  CASE WHEN ${SAME_FIT} THEN CAST(r.aircraft_minutes AS SIGNED) - CAST(ie.aircraft_minutes AS SIGNED) END AS minutes_on_wing,
  CASE WHEN ${SAME_FIT} THEN CAST(r.aircraft_cycles AS SIGNED) - CAST(ie.aircraft_cycles AS SIGNED) END AS cycles_on_wing,
  r.tsn_minutes,
  r.csn,
  ipn.part_number AS installed_part_number,
  ip.serial_number AS installed_serial_number,
  u.name AS recorded_by`;

/**
 * The shop's finding on the unit's return from repair: the `repaired` entry that names this removal
 * in details.removalSeq (both the stores movement route and the demo seed write it).
 */
export const SHOP_FINDING_COLUMN = `(
  SELECT JSON_VALUE(f.details, '$.shopFinding') FROM ledger_entries f
  WHERE f.part_id = r.part_id AND f.kind = 'repaired' AND f.seq > r.seq AND JSON_VALUE(f.details, '$.removalSeq') = CAST(r.seq AS CHAR)
  ORDER BY f.seq LIMIT 1
) AS shop_finding`;

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
      `SELECT COUNT(*) AS total, COALESCE(SUM(r.removal_type = 'unscheduled'), 0) AS unscheduled
       FROM ledger_entries r
       JOIN aircraft a ON a.id = r.aircraft_id
       JOIN aircraft_types t ON t.id = a.aircraft_type_id
       JOIN stations st ON st.id = a.station_id
       JOIN positions pos ON pos.id = r.position_id
       JOIN parts p ON p.id = r.part_id
       JOIN part_numbers pn ON pn.id = p.part_number_id
       ${where.sql}`,
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
