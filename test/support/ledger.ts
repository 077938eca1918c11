// Checks on the ledger straight from the database: the chain, and the fitted projection rebuilt from it.
import { verifyChain } from "../../src/domain/ledger-hash";
import type { ChainedLedgerEntry } from "../../src/domain/ledger-types";
import { testDb } from "./api";

export async function ledgerRows(): Promise<ChainedLedgerEntry[]> {
  const rows = await testDb()("ledger_entries").orderBy("seq");
  return rows.map((row) => ({
    seq: Number(row.seq),
    kind: row.kind,
    partId: row.part_id,
    aircraftId: row.aircraft_id,
    positionId: row.position_id,
    occurredAt: new Date(row.occurred_at).toISOString(),
    recordedAt: new Date(row.recorded_at).toISOString(),
    recordedBy: row.recorded_by,
    aircraftMinutes: row.aircraft_minutes === null ? null : Number(row.aircraft_minutes),
    aircraftCycles: row.aircraft_cycles,
    tsnMinutes: row.tsn_minutes === null ? null : Number(row.tsn_minutes),
    csn: row.csn,
    tsoMinutes: row.tso_minutes === null ? null : Number(row.tso_minutes),
    cso: row.cso,
    removalType: row.removal_type,
    reason: row.reason,
    workOrder: row.work_order,
    taskReference: row.task_reference,
    testResult: row.test_result,
    documentId: row.document_id,
    correctsSeq: row.corrects_seq === null ? null : Number(row.corrects_seq),
    details: row.details ? JSON.parse(row.details) : null,
    prevHash: row.prev_hash,
    hash: row.hash,
  }));
}

export async function verifyLedger() {
  return verifyChain(await ledgerRows());
}

/** What is fitted where, replayed from the installed and removed entries alone. */
export async function fittedRebuiltFromLedger(): Promise<Set<string>> {
  const where = new Map<number, string>();
  for (const entry of await ledgerRows()) {
    if (entry.kind === "installed") where.set(entry.partId, `${entry.aircraftId}:${entry.positionId}:${entry.partId}:${entry.seq}`);
    if (entry.kind === "removed") where.delete(entry.partId);
  }
  return new Set(where.values());
}

export async function fittedProjection(): Promise<Set<string>> {
  const rows = await testDb()("fitted").select("aircraft_id", "position_id", "part_id", "installed_seq");
  return new Set(rows.map((r) => `${r.aircraft_id}:${r.position_id}:${r.part_id}:${r.installed_seq}`));
}
