import "server-only";
import type { Knex } from "knex";
import type { Finding, RemovalEvent, UtilizationPoint } from "@/domain/reliability";
import { SHOP_FINDINGS } from "@/lib/schemas/reliability";
import { db } from "./db";
import { AppError } from "./errors";

// What the rates and Weibull reports are computed from, gathered from the ledger: the subject (a
// part number with its alternates, or an ATA chapter by position), the fitted intervals of its
// units, its removals with their shop findings, and the utilisation of the aircraft involved.

export type Subject =
  | { kind: "partNumber"; partNumber: string; partNumberIds: number[]; group: Array<{ id: number; partNumber: string; cage: string; description: string }> }
  | { kind: "ataChapter"; ataChapter: string };


/** Which part numbers may stand in for each one: its own alternates, and the two-way links that name it. */
export async function loadInterchange(trx: Knex = db()): Promise<Map<number, Set<number>>> {
  const rows = await trx("part_interchange").select("part_number_id", "alternate_part_number_id", "two_way");
  const map = new Map<number, Set<number>>();
  const link = (from: number, to: number) => {
    if (!map.has(from)) map.set(from, new Set());
    map.get(from)!.add(to);
  };
  for (const row of rows) {
    link(Number(row.part_number_id), Number(row.alternate_part_number_id));
    if (row.two_way) link(Number(row.alternate_part_number_id), Number(row.part_number_id));
  }
  return map;
}

/** A part number's group: itself and the alternates that may be fitted in its place. */
export function groupOf(partNumberIds: number[], interchange: Map<number, Set<number>>): number[] {
  const ids = new Set(partNumberIds);
  for (const id of partNumberIds) for (const alternate of interchange.get(id) ?? []) ids.add(alternate);
  return [...ids].sort((a, b) => a - b);
}

export async function resolveSubject(query: { partNumber?: string; ataChapter?: string }): Promise<Subject> {
  if (query.ataChapter) return { kind: "ataChapter", ataChapter: query.ataChapter };
  const own = await db()("part_numbers").where({ part_number: query.partNumber }).select("id");
  if (own.length === 0) {
    throw new AppError("not_found", `Part number ${query.partNumber} is not in the catalog. Check the spelling, or look it up in the catalog.`, "not_found", {
      partNumber: "is not in the catalog",
    });
  }
  const ids = groupOf(own.map((r) => Number(r.id)), await loadInterchange());
  const group = await db()("part_numbers").whereIn("id", ids).orderBy("part_number").select("id", "part_number", "cage", "description");
  return {
    kind: "partNumber",
    partNumber: query.partNumber!,
    partNumberIds: ids,
    group: group.map((g) => ({ id: Number(g.id), partNumber: g.part_number, cage: g.cage, description: g.description })),
  };
}

function subjectWhere(subject: Subject, alias: { part: string; position: string }): { sql: string; params: Knex.Value[] } {
  if (subject.kind === "partNumber") {
    return { sql: `${alias.part}.part_number_id IN (${subject.partNumberIds.map(() => "?").join(",")})`, params: subject.partNumberIds };
  }
  return { sql: `(${alias.position}.ata_chapter = ? OR ${alias.position}.ata_chapter LIKE ?)`, params: [subject.ataChapter, `${subject.ataChapter}-%`] };
}

const FINDING_SQL = `(
  SELECT JSON_VALUE(f.details, '$.shopFinding') FROM ledger_entries f
  WHERE f.part_id = r.part_id AND f.kind = 'repaired' AND f.seq > r.seq AND JSON_VALUE(f.details, '$.removalSeq') = CAST(r.seq AS CHAR)
  ORDER BY f.seq LIMIT 1)`;

const asFinding = (value: unknown): Finding | null => ((SHOP_FINDINGS as readonly unknown[]).includes(value) ? (value as Finding) : null);
const ms = (value: unknown) => (value instanceof Date ? value.getTime() : new Date(String(value)).getTime());

export interface IntervalRow {
  aircraftId: number;
  installedAt: number;
  installedMinutes: number;
  /** Null while the unit is still fitted. */
  removedAt: number | null;
  removedMinutes: number | null;
  removalType: "scheduled" | "unscheduled" | null;
  finding: Finding | null;
}

/** Installed→removed intervals of the subject's units that overlap [from, to). */
export async function fittedIntervals(subject: Subject, from: number, to: number): Promise<IntervalRow[]> {
  const where = subjectWhere(subject, { part: "p", position: "pos" });
  const [rows] = (await db().raw(
    `SELECT i.aircraft_id, i.occurred_at AS installed_at, i.aircraft_minutes AS installed_minutes,
            r.occurred_at AS removed_at, r.aircraft_minutes AS removed_minutes, r.removal_type, ${FINDING_SQL} AS finding
     FROM ledger_entries i
     JOIN parts p ON p.id = i.part_id
     JOIN positions pos ON pos.id = i.position_id
     LEFT JOIN ledger_entries r ON r.seq = (
       SELECT MIN(x.seq) FROM ledger_entries x WHERE x.part_id = i.part_id AND x.kind = 'removed' AND x.seq > i.seq
     )
     WHERE i.kind = 'installed' AND i.occurred_at < ? AND (r.seq IS NULL OR r.occurred_at > ?) AND ${where.sql}`,
    [new Date(to), new Date(from), ...where.params],
  )) as [Array<Record<string, unknown>>];
  return rows.map((row) => ({
    aircraftId: Number(row.aircraft_id),
    installedAt: ms(row.installed_at),
    installedMinutes: Number(row.installed_minutes ?? 0),
    removedAt: row.removed_at ? ms(row.removed_at) : null,
    removedMinutes: row.removed_minutes === null || row.removed_minutes === undefined ? null : Number(row.removed_minutes),
    removalType: (row.removal_type as IntervalRow["removalType"]) ?? null,
    finding: asFinding(row.finding),
  }));
}

/** The subject's removals in [from, to) with the shop finding of each, when one is on file. */
export async function removalEvents(subject: Subject, from: number, to: number): Promise<RemovalEvent[]> {
  const where = subjectWhere(subject, { part: "p", position: "pos" });
  const [rows] = (await db().raw(
    `SELECT r.occurred_at, r.removal_type, ${FINDING_SQL} AS finding
     FROM ledger_entries r
     JOIN parts p ON p.id = r.part_id
     JOIN positions pos ON pos.id = r.position_id
     WHERE r.kind = 'removed' AND r.occurred_at >= ? AND r.occurred_at < ? AND ${where.sql}`,
    [new Date(from), new Date(to), ...where.params],
  )) as [Array<Record<string, unknown>>];
  return rows.map((row) => ({ at: ms(row.occurred_at), unscheduled: row.removal_type === "unscheduled", finding: asFinding(row.finding) }));
}

/**
 * Utilisation of the given aircraft covering [from, to]: the snapshots inside it plus the last one
 * at or before `from` and the first at or after `to`, so every instant inside can be interpolated.
 */
export async function utilizationSeries(aircraftIds: number[], from: number, to: number): Promise<Map<number, UtilizationPoint[]>> {
  const series = new Map<number, UtilizationPoint[]>();
  if (aircraftIds.length === 0) return series;
  const [rows] = (await db().raw(
    `SELECT u.aircraft_id, u.as_of, u.total_minutes FROM utilization u
     WHERE u.aircraft_id IN (${aircraftIds.map(() => "?").join(",")})
       AND u.as_of >= COALESCE((SELECT MAX(b.as_of) FROM utilization b WHERE b.aircraft_id = u.aircraft_id AND b.as_of <= ?), '1000-01-01')
       AND u.as_of <= COALESCE((SELECT MIN(c.as_of) FROM utilization c WHERE c.aircraft_id = u.aircraft_id AND c.as_of >= ?), '9999-12-31')
     ORDER BY u.aircraft_id, u.as_of`,
    [...aircraftIds, new Date(from), new Date(to)],
  )) as [Array<Record<string, unknown>>];
  for (const row of rows) {
    const id = Number(row.aircraft_id);
    if (!series.has(id)) series.set(id, []);
    series.get(id)!.push({ at: ms(row.as_of), minutes: Number(row.total_minutes) });
  }
  return series;
}

