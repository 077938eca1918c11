// Checks on the ledger straight from the database: the chain, and the fitted projection rebuilt from it.
import { verifyChain } from "../../src/domain/ledger-hash";
import type { ChainedLedgerEntry } from "../../src/domain/ledger-types";
import { rowToEntry } from "../../src/lib/ledger-rows";
import { testDb } from "./api";

export async function ledgerRows(): Promise<ChainedLedgerEntry[]> {
  return (await testDb()("ledger_entries").orderBy("seq")).map(rowToEntry);
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
