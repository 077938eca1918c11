// Reads one seq range of the ledger from MariaDB and verifies it. Shared by the ledger check's own
// thread and its worker threads, so it imports nothing that only a server component bundle may load.
import type { Connection, PoolConnection } from "mysql2";
import { ChainVerifier } from "@/domain/ledger-hash";
import type { LedgerSegment, SegmentOutcome } from "@/domain/ledger-segments";
import type { ChainedLedgerEntry, LedgerEntryFields } from "@/domain/ledger-types";
import { isoFromDatetime } from "@/lib/datetime-text";
import { LEDGER_ENTRY_COLUMNS } from "@/lib/ledger-rows";

const SEGMENT_SQL = `SELECT ${LEDGER_ENTRY_COLUMNS.join(", ")} FROM ledger_entries WHERE seq BETWEEN ? AND ? ORDER BY seq`;

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

/**
 * Streams the segment's rows (as arrays, the cheapest shape mysql2 produces) and checks each in
 * mysql2's own row callback, synchronously: no promise per row, and the socket is read no faster
 * than rows are checked. At the first break the rest is left unread: `stoppedEarly` then tells the
 * caller that the connection is mid-result and must be destroyed, not reused.
 */
export function verifySegment(connection: Connection | PoolConnection, segment: LedgerSegment): Promise<SegmentOutcome & { stoppedEarly: boolean }> {
  const verifier = new ChainVerifier(segment.startPrevHash, segment.firstSeq);
  const scratch = {} as ChainedLedgerEntry;
  let firstSeenSeq: number | null = null;
  let lastSeenSeq: number | null = null;
  const outcome = (stoppedEarly: boolean) => ({ firstSeq: segment.firstSeq, lastSeq: segment.lastSeq, verification: verifier.result(), firstSeenSeq, lastSeenSeq, stoppedEarly });
  return new Promise((resolve, reject) => {
    let settled = false;
    const select = connection.query({ sql: SEGMENT_SQL, values: [segment.firstSeq, segment.lastSeq], rowsAsArray: true, dateStrings: true });
    select.on("result", (row) => {
      if (settled) return;
      const pushed = verifier.push(fillEntry(scratch, row as unknown as unknown[]));
      firstSeenSeq ??= scratch.seq;
      lastSeenSeq = scratch.seq;
      if (!pushed.ok) {
        settled = true;
        resolve(outcome(true));
      }
    });
    select.on("error", (error) => {
      if (!settled) reject(error);
      settled = true;
    });
    select.on("end", () => {
      if (!settled) resolve(outcome(false));
      settled = true;
    });
  });
}
