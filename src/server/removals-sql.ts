// The removal history's SQL as plain text: one FROM/WHERE shared by the Removals page, the CSV
// export and the benchmark's bare baseline (which must run exactly the SQL the app runs). No I/O
// here, so this module is not server-only.
import type { Knex } from "knex";
import type { RemovalFilters } from "@/lib/schemas/reliability";

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
/** The removal with the tables the filters name: all a count needs (the rest never adds or drops a row). */
export const REMOVALS_FILTERED_FROM = `
FROM ledger_entries r
JOIN aircraft a ON a.id = r.aircraft_id
JOIN aircraft_types t ON t.id = a.aircraft_type_id
JOIN stations st ON st.id = a.station_id
JOIN positions pos ON pos.id = r.position_id
JOIN parts p ON p.id = r.part_id
JOIN part_numbers pn ON pn.id = p.part_number_id`;

export const REMOVALS_FROM = `${REMOVALS_FILTERED_FROM}
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

export function removalsExportSql(filters: RemovalFilters): { sql: string; params: unknown[] } {
  const where = removalsWhere(filters);
  return {
    // FORCE INDEX (PRIMARY): read in seq order, so there is no sort to wait for before the first row.
    sql: `SELECT STRAIGHT_JOIN ${REMOVALS_COLUMNS} ${REMOVALS_FROM.replace("FROM ledger_entries r", "FROM ledger_entries r FORCE INDEX (PRIMARY)")} ${where.sql} ORDER BY r.seq`,
    params: where.params,
  };
}
