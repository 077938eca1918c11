import "server-only";
import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";
import type { PoolConnection } from "mysql2";
import { GENESIS_HASH, type ChainBreakReason } from "@/domain/ledger-hash";
import { MISSING_PREV_HASH, joinSegmentOutcomes, planSegmentRanges, type LedgerSegment, type SegmentOutcome } from "@/domain/ledger-segments";
import { connectionOptions, pool } from "./db";
import { serverEnv } from "./env";
import { verifySegment } from "./ledger-segment";
import type { LedgerWorkerInput } from "./ledger-verify-worker";

// The ledger check: recompute the hash chain over every entry up to the head, straight from
// MariaDB. Rows are streamed and verified one at a time, so memory stays flat however long the
// ledger grows. The head is read in a consistent snapshot; entries up to it are committed and
// append-only, so entries appended meanwhile neither break the check nor slip into it half-way.
//
// Encoding and hashing each entry costs about three times what reading it does, so one thread
// is the limit of a long check. A long ledger is therefore split into seq ranges, each verified by
// a worker thread over a connection of its own from the stored hash of the entry before it, and
// the outcomes are joined into the single-pass answer (src/domain/ledger-segments.ts says why
// that is sound). The workers also keep the check off the event loop that serves other requests.

export interface LedgerIntact {
  ok: true;
  entries: number;
  /** Hash of the last entry (the chain's head). */
  head: string;
  headSeq: number;
  checkedAt: string;
  durationMs: number;
  /** Seq ranges verified side by side (1: the whole ledger in one pass). */
  segments: number;
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
  segments: number;
}

export type LedgerVerification = LedgerIntact | LedgerBroken;

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
    const env = serverEnv();
    const ranges = planSegmentRanges(headSeq, env.LEDGER_CHECK_THREADS ?? availableParallelism() + 1, env.LEDGER_CHECK_MIN_SEGMENT);
    let outcomes: SegmentOutcome[];
    if (ranges.length <= 1) {
      const segment = { firstSeq: 1, lastSeq: headSeq, startPrevHash: GENESIS_HASH };
      const { stoppedEarly, ...outcome } = await verifySegment(connection, segment);
      outcomes = [outcome];
      if (stoppedEarly) return report(outcomes, headSeq, head?.last_hash, started, checkedAt);
    } else {
      const segments = await withStartHashes(connection, ranges);
      outcomes = await Promise.all(segments.map(verifyInWorker));
    }
    await query(connection, "COMMIT");
    reusable = true;
    return report(outcomes, headSeq, head?.last_hash, started, checkedAt);
  } finally {
    if (reusable) connection.release();
    else connection.destroy();
  }
}

/** Each range with the stored hash of the entry just before it, read in the check's snapshot. */
async function withStartHashes(connection: PoolConnection, ranges: Array<{ firstSeq: number; lastSeq: number }>): Promise<LedgerSegment[]> {
  const before = ranges.filter((range) => range.firstSeq > 1).map((range) => range.firstSeq - 1);
  const rows = await new Promise<Array<{ seq: number | string; hash: string }>>((resolve, reject) =>
    connection.query({ sql: "SELECT seq, hash FROM ledger_entries WHERE seq IN (?)", values: [before] }, (error, result) => (error ? reject(error) : resolve(result as never))),
  );
  const hashOf = new Map(rows.map((row) => [Number(row.seq), row.hash]));
  return ranges.map((range) => ({ ...range, startPrevHash: range.firstSeq === 1 ? GENESIS_HASH : (hashOf.get(range.firstSeq - 1) ?? MISSING_PREV_HASH) }));
}

function verifyInWorker(segment: LedgerSegment): Promise<SegmentOutcome> {
  const input: LedgerWorkerInput = { connection: connectionOptions(), segment };
  const worker = new Worker(new URL("./ledger-verify-worker.ts", import.meta.url), { workerData: input });
  return new Promise((resolve, reject) => {
    worker.once("message", (message: { outcome?: SegmentOutcome; error?: string }) => {
      if (message.outcome) resolve(message.outcome);
      else reject(new Error(`The ledger check of seqs ${segment.firstSeq}-${segment.lastSeq} failed: ${message.error}`));
    });
    worker.once("error", reject);
    worker.once("exit", (code) => reject(new Error(`The ledger check's worker for seqs ${segment.firstSeq}-${segment.lastSeq} stopped (exit code ${code}).`)));
  });
}

function report(outcomes: SegmentOutcome[], headSeq: number, headHash: string | undefined, started: number, checkedAt: string): LedgerVerification {
  const durationMs = Math.round((performance.now() - started) * 10) / 10;
  const { verification: result, lastSeenSeq } = joinSegmentOutcomes(outcomes, GENESIS_HASH);
  const segments = outcomes.length;
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
      segments,
    };
  }
  if (lastSeenSeq !== headSeq || result.head !== (headHash ?? result.head)) {
    const brokenAt = Math.min(lastSeenSeq + 1, headSeq);
    return {
      ok: false,
      brokenAt,
      reason: "head_mismatch",
      entries: result.entries,
      foundSeq: lastSeenSeq,
      message: `The chain breaks at seq ${brokenAt}: ${BREAK_WORDS.head_mismatch}.`,
      checkedAt,
      durationMs,
      segments,
    };
  }
  return { ok: true, entries: result.entries, head: result.head, headSeq, checkedAt, durationMs, segments };
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
