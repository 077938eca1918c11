import "server-only";
import type { Knex } from "knex";
import { chainEntry, ChainVerifier } from "@/domain/ledger-hash";
import type { ChainedLedgerEntry, LedgerEntryFields } from "@/domain/ledger-types";
import { entryToRow } from "@/lib/ledger-rows";
import { db } from "./db";
import { asSql, type Sql } from "./sql";

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
export async function appendLedgerEntries(trx: Knex.Transaction | Sql, entries: NewLedgerEntry[]): Promise<AppendedEntry[]> {
  if (entries.length === 0) return [];
  const sql = asSql(trx);
  const [head] = await sql.rows<{ last_seq: number | string; last_hash: string }>("SELECT last_seq, last_hash FROM ledger_head WHERE id = 1 FOR UPDATE");
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
  const rows = chained.map(entryToRow);
  const columns = Object.keys(rows[0]);
  const placeholders = `(${columns.map(() => "?").join(", ")})`;
  await sql.run(`INSERT INTO ledger_entries (${columns.join(", ")}) VALUES ${rows.map(() => placeholders).join(", ")}`, rows.flatMap((row) => Object.values(row)));
  await sql.run("UPDATE ledger_head SET last_seq = ?, last_hash = ? WHERE id = 1", [seq, prevHash]);
  return chained.map((entry) => ({ seq: entry.seq, kind: entry.kind, hash: entry.hash }));
}

export { entryToRow, rowToEntry } from "@/lib/ledger-rows";
export type { Knex };
export { ChainVerifier, db };
