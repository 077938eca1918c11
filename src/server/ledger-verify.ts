import "server-only";
import type { PoolConnection } from "mysql2";
import { ChainVerifier, type ChainBreakReason } from "@/domain/ledger-hash";
import type { ChainedLedgerEntry, LedgerEntryFields } from "@/domain/ledger-types";
import { isoFromDatetime } from "@/lib/datetime-text";
import { LEDGER_ENTRY_COLUMNS } from "@/lib/ledger-rows";
import { pool } from "./db";

// The ledger check: recompute the hash chain over every entry, in seq order, straight from
// MariaDB. Rows are streamed (as arrays, the cheapest shape mysql2 produces) and fed to the
// verifier one at a time, so memory stays flat however long the ledger grows. The read runs in
// one consistent snapshot with the head row, so entries appended meanwhile neither break the
// check nor slip into it half-way.

export interface LedgerIntact {
  ok: true;
  entries: number;
  /** Hash of the last entry (the chain's head). */
  head: string;
  headSeq: number;
  checkedAt: string;
  durationMs: number;
}

export interface LedgerBroken {
  ok: false;
  /** The first seq at which the chain no longer holds. */
  brokenAt: number;
  reason: ChainBreakReason | "head_mismatch";
  /** Entries verified intact before the break. */
  entries: number;
  foundSeq: number;
  message: string;
  detail?: string;
  checkedAt: string;
  durationMs: number;
}

export type LedgerVerification = LedgerIntact | LedgerBroken;

const nullableNumber = (value: unknown) => (value === null ? null : Number(value));
// DATETIME(3) columns are read as text (dateStrings) and rewritten as the ISO instants the hash covers.
const isoOf = (value: unknown) => isoFromDatetime(value as Date | string);

/** Fills `into` from one array row (columns in LEDGER_ENTRY_COLUMNS order); the verifier keeps no reference, so one object serves every row. */
function fillEntry(into: ChainedLedgerEntry, row: unknown[]): ChainedLedgerEntry {
  into.seq = Number(row[0]);
  into.kind = row[1] as LedgerEntryFields["kind"];
  into.partId = Number(row[2]);
  into.aircraftId = nullableNumber(row[3]);
  into.positionId = nullableNumber(row[4]);
  into.occurredAt = isoOf(row[5]);
  into.recordedAt = isoOf(row[6]);
  into.recordedBy = String(row[7]);
  into.aircraftMinutes = nullableNumber(row[8]);
  into.aircraftCycles = nullableNumber(row[9]);
  into.tsnMinutes = nullableNumber(row[10]);
  into.csn = nullableNumber(row[11]);
  into.tsoMinutes = nullableNumber(row[12]);
  into.cso = nullableNumber(row[13]);
  into.removalType = (row[14] as LedgerEntryFields["removalType"]) ?? null;
  into.reason = (row[15] as string | null) ?? null;
  into.workOrder = (row[16] as string | null) ?? null;
  into.taskReference = (row[17] as string | null) ?? null;
  into.testResult = (row[18] as string | null) ?? null;
  into.documentId = nullableNumber(row[19]);
  into.correctsSeq = nullableNumber(row[20]);
  into.details = row[21] === null ? null : (JSON.parse(String(row[21])) as Record<string, string>);
  into.prevHash = String(row[22]);
  into.hash = String(row[23]);
  return into;
}

const BREAK_WORDS: Record<LedgerBroken["reason"], string> = {
  hash_mismatch: "its stored contents no longer match its hash: the entry was altered after it was written",
  prev_hash_mismatch: "it does not point at the hash of the entry before it: an entry before it was altered, removed or reordered",
  seq_gap: "the sequence skips here: an entry is missing",
  head_mismatch: "the last entry does not match the ledger head: entries at the end were removed or replaced",
};

function getConnection(): Promise<PoolConnection> {
  return new Promise((resolve, reject) => pool().pool.getConnection((error, connection) => (error ? reject(error) : resolve(connection))));
}

function query<T = unknown>(connection: PoolConnection, sql: string): Promise<T> {
  return new Promise((resolve, reject) => connection.query(sql, (error, rows) => (error ? reject(error) : resolve(rows as T))));
}

/** Recomputes the whole chain and says where it first breaks. */
export async function verifyLedger(): Promise<LedgerVerification> {
  const started = performance.now();
  const checkedAt = new Date().toISOString();
  const connection = await getConnection();
  // A connection left mid-stream or inside a transaction must not go back to the pool.
  let reusable = false;
  try {
    await query(connection, "START TRANSACTION WITH CONSISTENT SNAPSHOT, READ ONLY");
    const [head] = await query<Array<{ last_seq: number | string; last_hash: string }>>(connection, "SELECT last_seq, last_hash FROM ledger_head WHERE id = 1");
    const headSeq = Number(head?.last_seq ?? 0);
    const verifier = new ChainVerifier();
    const scratch = {} as ChainedLedgerEntry;
    let lastSeq = 0;
    // Rows are checked in mysql2's own row callback, synchronously: no promise per row (each one is
    // dear under the framework's async hooks), and the socket is read no faster than rows are checked.
    const broken = await new Promise<boolean>((resolve, reject) => {
      let settled = false;
      const select = connection.query({ sql: `SELECT ${LEDGER_ENTRY_COLUMNS.join(", ")} FROM ledger_entries WHERE seq <= ? ORDER BY seq`, values: [headSeq], rowsAsArray: true, dateStrings: true });
      select.on("result", (row) => {
        if (settled) return;
        const pushed = verifier.push(fillEntry(scratch, row as unknown as unknown[]));
        lastSeq = scratch.seq;
        if (!pushed.ok) {
          settled = true;
          resolve(true); // the rest stays unread: the connection is destroyed below, not reused
        }
      });
      select.on("error", (error) => {
        if (!settled) reject(error);
        settled = true;
      });
      select.on("end", () => {
        if (!settled) resolve(false);
        settled = true;
      });
    });
    if (!broken) {
      await query(connection, "COMMIT");
      reusable = true;
    }
    const durationMs = Math.round((performance.now() - started) * 10) / 10;
    const result = verifier.result();
    if (!result.ok) {
      return {
        ok: false,
        brokenAt: result.brokenAt,
        reason: result.reason,
        entries: result.entries,
        foundSeq: result.foundSeq,
        message: `The chain breaks at seq ${result.brokenAt}: ${BREAK_WORDS[result.reason]}.`,
        ...(result.detail ? { detail: result.detail } : {}),
        checkedAt,
        durationMs,
      };
    }
    if (!broken && (lastSeq !== headSeq || result.head !== (head?.last_hash ?? result.head))) {
      const brokenAt = Math.min(lastSeq + 1, headSeq);
      return {
        ok: false,
        brokenAt,
        reason: "head_mismatch",
        entries: result.entries,
        foundSeq: lastSeq,
        message: `The chain breaks at seq ${brokenAt}: ${BREAK_WORDS.head_mismatch}.`,
        checkedAt,
        durationMs,
      };
    }
    return { ok: true, entries: result.entries, head: result.head, headSeq, checkedAt, durationMs };
  } finally {
    if (reusable) connection.release();
    else connection.destroy();
  }
}

/** The ledger head now: the last seq and its hash, as a printed report quotes them. */
export async function getLedgerHead(): Promise<{ seq: number; hash: string }> {
  const [rows] = await pool().query("SELECT last_seq, last_hash FROM ledger_head WHERE id = 1");
  const head = (rows as Array<{ last_seq: number | string; last_hash: string }>)[0];
  return { seq: Number(head?.last_seq ?? 0), hash: head?.last_hash ?? "" };
}

/** One entry's stored hash, so a paper copy can be checked against the ledger. */
export async function getEntryHash(seq: number): Promise<{ seq: number; kind: string; partId: number; prevHash: string; hash: string } | null> {
  const [rows] = await pool().query("SELECT seq, kind, part_id, prev_hash, hash FROM ledger_entries WHERE seq = ?", [seq]);
  const row = (rows as Array<Record<string, unknown>>)[0];
  if (!row) return null;
  return { seq: Number(row.seq), kind: String(row.kind), partId: Number(row.part_id), prevHash: String(row.prev_hash), hash: String(row.hash) };
}
