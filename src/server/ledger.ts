import "server-only";
import type { Knex } from "knex";
import { chainEntry, ChainVerifier } from "@/domain/ledger-hash";
import type { ChainedLedgerEntry, LedgerEntryFields } from "@/domain/ledger-types";
import { db } from "./db";

/** A ledger entry as the caller describes it; seq, recordedAt and the hashes are the ledger's to assign. */
export type NewLedgerEntry = Omit<LedgerEntryFields, "seq" | "recordedAt"> & { recordedAt?: Date };

export interface AppendedEntry {
  seq: number;
  kind: LedgerEntryFields["kind"];
  hash: string;
}

/**
 * Appends entries to the chain inside the caller's transaction. The head row is locked last and
 * held only for the hashing and one multi-row insert, so concurrent writers queue as briefly as
 * possible (every round trip under this lock lowers the ceiling on appends per second).
 */
export async function appendLedgerEntries(trx: Knex.Transaction, entries: NewLedgerEntry[]): Promise<AppendedEntry[]> {
  if (entries.length === 0) return [];
  const head = await trx("ledger_head").where({ id: 1 }).forUpdate().first("last_seq", "last_hash");
  if (!head) throw new Error("the ledger head row is missing; run the migrations");
  let seq = Number(head.last_seq);
  let prevHash: string = head.last_hash;
  const recordedAt = new Date();
  const chained: ChainedLedgerEntry[] = entries.map((entry) => {
    seq += 1;
    const fields: LedgerEntryFields = { ...entry, seq, recordedAt: (entry.recordedAt ?? recordedAt).toISOString() };
    const withHash = chainEntry(prevHash, fields);
    prevHash = withHash.hash;
    return withHash;
  });
  await trx("ledger_entries").insert(chained.map(entryToRow));
  await trx("ledger_head").where({ id: 1 }).update({ last_seq: seq, last_hash: prevHash });
  return chained.map((entry) => ({ seq: entry.seq, kind: entry.kind, hash: entry.hash }));
}

export function entryToRow(entry: ChainedLedgerEntry) {
  return {
    seq: entry.seq,
    kind: entry.kind,
    part_id: entry.partId,
    aircraft_id: entry.aircraftId,
    position_id: entry.positionId,
    occurred_at: new Date(entry.occurredAt),
    recorded_at: new Date(entry.recordedAt),
    recorded_by: entry.recordedBy,
    aircraft_minutes: entry.aircraftMinutes,
    aircraft_cycles: entry.aircraftCycles,
    tsn_minutes: entry.tsnMinutes,
    csn: entry.csn,
    tso_minutes: entry.tsoMinutes,
    cso: entry.cso,
    removal_type: entry.removalType,
    reason: entry.reason,
    work_order: entry.workOrder,
    task_reference: entry.taskReference,
    test_result: entry.testResult,
    document_id: entry.documentId,
    corrects_seq: entry.correctsSeq,
    details: entry.details ? JSON.stringify(entry.details) : null,
    prev_hash: entry.prevHash,
    hash: entry.hash,
  };
}

type Nullable<T> = T | null;
const num = (value: unknown): Nullable<number> => (value === null || value === undefined ? null : Number(value));
const iso = (value: Date | string) => (value instanceof Date ? value : new Date(value)).toISOString();

/** A ledger_entries row back into the fields the hash covers. */
export function rowToEntry(row: Record<string, unknown>): ChainedLedgerEntry {
  return {
    seq: Number(row.seq),
    kind: row.kind as LedgerEntryFields["kind"],
    partId: Number(row.part_id),
    aircraftId: num(row.aircraft_id),
    positionId: num(row.position_id),
    occurredAt: iso(row.occurred_at as Date),
    recordedAt: iso(row.recorded_at as Date),
    recordedBy: String(row.recorded_by),
    aircraftMinutes: num(row.aircraft_minutes),
    aircraftCycles: num(row.aircraft_cycles),
    tsnMinutes: num(row.tsn_minutes),
    csn: num(row.csn),
    tsoMinutes: num(row.tso_minutes),
    cso: num(row.cso),
    removalType: (row.removal_type as LedgerEntryFields["removalType"]) ?? null,
    reason: (row.reason as string) ?? null,
    workOrder: (row.work_order as string) ?? null,
    taskReference: (row.task_reference as string) ?? null,
    testResult: (row.test_result as string) ?? null,
    documentId: num(row.document_id),
    correctsSeq: num(row.corrects_seq),
    details: row.details ? (JSON.parse(String(row.details)) as Record<string, string>) : null,
    prevHash: String(row.prev_hash),
    hash: String(row.hash),
  };
}

export type { Knex };
export { ChainVerifier, db };
