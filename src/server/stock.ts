import "server-only";
import { formatFlightTime } from "@/domain/flight-time";
import type { PartStatus } from "@/domain/ledger-types";
import { STOCK_STATUSES, type StockQuery } from "@/lib/schemas/stock";
import { db, type Trx } from "./db";
import { notFound } from "./errors";

export interface LastMovement {
  seq: number;
  kind: string;
  occurredAt: string;
  workOrder: string | null;
  reason: string | null;
  details: Record<string, string> | null;
}

export interface StockUnit {
  id: number;
  partNumber: string;
  cage: string;
  serialNumber: string;
  description: string;
  status: PartStatus;
  bin: string | null;
  tsn: string;
  csn: number;
  tso: string | null;
  cso: number | null;
  /** Set while the unit is out of its bin on issue to a work order or technician. */
  issuedTo: string | null;
  lastMovement: LastMovement | null;
}

export interface StockPage {
  units: StockUnit[];
  total: number;
  page: number;
  pageSize: number;
  counts: Record<(typeof STOCK_STATUSES)[number], number>;
}

const escapeLike = (text: string) => text.replace(/[%_\\]/g, (c) => `\\${c}`);

function stockFilters(trx: Trx, query: Omit<StockQuery, "page" | "pageSize">, withStatus: boolean) {
  const q = trx("parts as pt").join("part_numbers as pn", "pn.id", "pt.part_number_id");
  if (withStatus && query.status) q.where("pt.status", query.status);
  else if (withStatus) q.whereIn("pt.status", STOCK_STATUSES.filter((s) => s !== "scrapped"));
  else q.whereIn("pt.status", STOCK_STATUSES);
  if (query.partNumber) q.where("pn.part_number", "like", `${escapeLike(query.partNumber)}%`);
  if (query.bin) q.where("pt.bin", "like", `${escapeLike(query.bin)}%`);
  if (query.q) q.where("pt.serial_number", "like", `${escapeLike(query.q)}%`);
  return q;
}

/** The most recent ledger entry of each of the given units. */
export async function lastMovements(partIds: number[], trx: Trx = db()): Promise<Map<number, LastMovement>> {
  if (partIds.length === 0) return new Map();
  const rows = await trx("ledger_entries as e")
    .join(trx("ledger_entries").whereIn("part_id", partIds).groupBy("part_id").select("part_id").max({ seq: "seq" }).as("latest"), "latest.seq", "e.seq")
    .select("e.seq", "e.part_id", "e.kind", "e.occurred_at", "e.work_order", "e.reason", "e.details");
  return new Map(
    rows.map((r) => [
      Number(r.part_id),
      {
        seq: Number(r.seq),
        kind: r.kind,
        occurredAt: new Date(r.occurred_at).toISOString(),
        workOrder: r.work_order ?? null,
        reason: r.reason ?? null,
        details: r.details ? JSON.parse(r.details) : null,
      },
    ]),
  );
}

export function issuedToOf(last: LastMovement | null | undefined): string | null {
  if (!last || last.kind !== "issued") return null;
  return [last.workOrder, last.details?.issuedTo].filter(Boolean).join(" · ") || "issued";
}

/**
 * Units held by stores or away at a repair shop, filtered by status, P/N, bin and serial, one page at a
 * time, with the count of each status under the same filters. Installed units are on aircraft and
 * are not stock; scrapped units show only when asked for.
 */
export async function listStock(query: StockQuery, trx: Trx = db()): Promise<StockPage> {
  const offset = (query.page - 1) * query.pageSize;
  const [rows, [{ total }], countRows] = await Promise.all([
    stockFilters(trx, query, true)
      .orderByRaw("FIELD(pt.status, 'quarantined', 'unserviceable', 'in_repair', 'serviceable', 'scrapped')")
      .orderBy([{ column: "pn.part_number" }, { column: "pt.bin" }, { column: "pt.serial_number" }])
      .limit(query.pageSize)
      .offset(offset)
      .select("pt.id", "pt.serial_number", "pt.status", "pt.bin", "pt.tsn_minutes", "pt.csn", "pt.tso_minutes", "pt.cso", "pn.part_number", "pn.cage", "pn.description"),
    stockFilters(trx, query, true).count({ total: "*" }),
    stockFilters(trx, query, false).groupBy("pt.status").select("pt.status").count({ n: "*" }),
  ]);
  const latest = await lastMovements(rows.map((r) => Number(r.id)), trx);
  const counts = Object.fromEntries(STOCK_STATUSES.map((s) => [s, 0])) as StockPage["counts"];
  for (const row of countRows as Array<{ status: string; n: number | string }>) counts[row.status as keyof StockPage["counts"]] = Number(row.n);
  return {
    units: rows.map((r) => {
      const last = latest.get(Number(r.id)) ?? null;
      return {
        id: Number(r.id),
        partNumber: r.part_number,
        cage: r.cage,
        serialNumber: r.serial_number,
        description: r.description,
        status: r.status,
        bin: r.bin,
        tsn: formatFlightTime(Number(r.tsn_minutes)),
        csn: Number(r.csn),
        tso: r.tso_minutes === null ? null : formatFlightTime(Number(r.tso_minutes)),
        cso: r.cso === null ? null : Number(r.cso),
        issuedTo: issuedToOf(last),
        lastMovement: last,
      };
    }),
    total: Number(total),
    page: query.page,
    pageSize: query.pageSize,
    counts,
  };
}

export interface PartLabel {
  id: number;
  partNumber: string;
  serialNumber: string;
  cage: string;
  description: string;
  ataChapter: string;
  status: PartStatus;
  bin: string | null;
  manufacturedOn: string | null;
}

/** What a unit's printed label shows. */
export async function getPartLabel(partId: number, trx: Trx = db()): Promise<PartLabel> {
  const row = await trx("parts as pt")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .where("pt.id", partId)
    .first("pt.id", "pt.serial_number", "pt.status", "pt.bin", "pt.manufactured_on", "pn.part_number", "pn.cage", "pn.description", "pn.ata_chapter");
  if (!row) throw notFound(`Part ${partId}`);
  return {
    id: Number(row.id),
    partNumber: row.part_number,
    serialNumber: row.serial_number,
    cage: row.cage,
    description: row.description,
    ataChapter: row.ata_chapter,
    status: row.status,
    bin: row.bin,
    manufacturedOn: row.manufactured_on ? new Date(row.manufactured_on).toISOString().slice(0, 10) : null,
  };
}
