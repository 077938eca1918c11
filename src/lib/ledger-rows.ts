// The mapping between a ledger_entries row and the fields its hash covers. Plain code shared by the
// server, the demo seed and the tests, so all three read and write the chain exactly alike.
import type { ChainedLedgerEntry, LedgerEntryFields } from "@/domain/ledger-types";

/** Every column of ledger_entries, in the order the ledger check streams them as arrays. */
export const LEDGER_ENTRY_COLUMNS = [
  "seq", "kind", "part_id", "aircraft_id", "position_id", "occurred_at", "recorded_at", "recorded_by",
  "aircraft_minutes", "aircraft_cycles", "tsn_minutes", "csn", "tso_minutes", "cso", "removal_type", "reason",
  "work_order", "task_reference", "test_result", "document_id", "corrects_seq", "details", "prev_hash", "hash",
] as const;

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

