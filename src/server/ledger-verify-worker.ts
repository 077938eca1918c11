// A worker thread of the ledger check: verifies one seq range over a connection of its own and posts
// the outcome back. Started by src/server/ledger-verify.ts; see there for why.
import { parentPort, workerData } from "node:worker_threads";
import mysql from "mysql2";
import type { LedgerSegment } from "@/domain/ledger-segments";
import { verifySegment } from "./ledger-segment";

export interface LedgerWorkerInput {
  connection: mysql.ConnectionOptions;
  segment: LedgerSegment;
}

const input = workerData as LedgerWorkerInput;
const connection = mysql.createConnection(input.connection);
verifySegment(connection, input.segment)
  .then(({ stoppedEarly: _, ...outcome }) => parentPort!.postMessage({ outcome }))
  .catch((error: unknown) => parentPort!.postMessage({ error: error instanceof Error ? error.message : String(error) }))
  // Destroyed, not ended: after a break the rest of the result is unread.
  .finally(() => connection.destroy());
