import "server-only";
import Papa from "papaparse";
import type { PoolConnection } from "mysql2";
import { formatFlightTime } from "@/domain/flight-time";
import { isoFromDatetime } from "@/lib/datetime-text";
import { REMOVALS_CSV_HEADER, type RemovalFilters } from "@/lib/schemas/reliability";
import { pool } from "./db";
import type { RemovalDbRow } from "./removals";
import { removalsExportSql } from "./removals-sql";

// The removals export streams straight from a database cursor into the HTTP response: rows arrive
// from mysql2's query stream, are written as CSV with papaparse 1,000 at a time, and the query is
// paused whenever the client reads slower than the database sends. At most a chunk or two of rows
// is ever held in memory, however long the export: `npm run bench` measures the server's peak memory
// growth over a whole-fleet export (a few MB once the route is loaded).

export const CSV_CHUNK_ROWS = 1_000;

const minutesText = (value: unknown) => (value === null || value === undefined || Number(value) < 0 ? "" : formatFlightTime(Number(value)));
const plain = (value: unknown) => (value === null || value === undefined ? "" : value);
const isoOf = (value: unknown) => (value ? isoFromDatetime(value as Date | string) : "");

/** One export row, in the order of REMOVALS_CSV_HEADER. */
export function csvValues(row: RemovalDbRow): unknown[] {
  return [
    row.registration,
    row.aircraft_type,
    row.position_code,
    row.ata_chapter,
    row.part_number,
    row.cage,
    row.serial_number,
    isoOf(row.removed_at),
    plain(row.removal_type),
    plain(row.reason),
    plain(row.work_order),
    minutesText(row.aircraft_minutes),
    plain(row.aircraft_cycles),
    minutesText(row.minutes_on_wing),
    plain(row.cycles_on_wing),
    minutesText(row.tsn_minutes),
    plain(row.csn),
    plain(row.installed_part_number),
    plain(row.installed_serial_number),
    row.recorded_by,
  ];
}

// A cell that starts with =, +, -, @, tab or CR is quoted and prefixed with ' by papaparse, so free
// text such as a removal reason cannot run as a formula when the file is opened in a spreadsheet.
const UNPARSE_OPTIONS = { header: false, newline: "\r\n", escapeFormulae: true } as const;

export function csvChunk(rows: unknown[][]): string {
  return rows.length ? `${Papa.unparse(rows, UNPARSE_OPTIONS)}\r\n` : "";
}

function connection(): Promise<PoolConnection> {
  return new Promise((resolve, reject) => pool().pool.getConnection((error, conn) => (error ? reject(error) : resolve(conn))));
}

/** The removals export (contract header, ledger order) as a web stream of UTF-8 bytes. */
export function streamRemovalsCsv(filters: RemovalFilters): Promise<ReadableStream<Uint8Array>> {
  const { sql, params } = removalsExportSql(filters);
  return streamQueryAsCsv({ sql, params, header: [...REMOVALS_CSV_HEADER], toValues: csvValues });
}

/**
 * Any query as CSV, streamed. The connection is taken when the stream starts and given back when it
 * ends; if the client goes away mid-export the connection is destroyed, which stops the query on the
 * server instead of reading the rest into a paused buffer.
 */
export async function streamQueryAsCsv(input: {
  sql: string;
  params: unknown[];
  header: string[];
  toValues: (row: RemovalDbRow) => unknown[];
}): Promise<ReadableStream<Uint8Array>> {
  const conn = await connection();
  const encoder = new TextEncoder();
  // Dates come as text (see isoFromDatetime): fewer objects per row keeps the export's memory flat.
  const rowStream = conn.query({ sql: input.sql, values: input.params, dateStrings: true }).stream({ highWaterMark: CSV_CHUNK_ROWS });
  let buffer: unknown[][] = [];
  let finished = false;

  const finish = (release: boolean) => {
    if (finished) return;
    finished = true;
    if (release) conn.release();
    else conn.destroy();
  };

  return new ReadableStream<Uint8Array>(
    {
      start(controller) {
        controller.enqueue(encoder.encode(`${Papa.unparse([input.header], UNPARSE_OPTIONS)}\r\n`));
        rowStream.on("data", (row: RemovalDbRow) => {
          buffer.push(input.toValues(row));
          if (buffer.length >= CSV_CHUNK_ROWS) {
            controller.enqueue(encoder.encode(csvChunk(buffer)));
            buffer = [];
            // Backpressure: stop reading from the database until the client has caught up (pull resumes).
            if ((controller.desiredSize ?? 0) <= 0) rowStream.pause();
          }
        });
        rowStream.on("end", () => {
          if (finished) return;
          if (buffer.length) controller.enqueue(encoder.encode(csvChunk(buffer)));
          buffer = [];
          controller.close();
          finish(true);
        });
        rowStream.on("error", (error) => {
          console.error("CSV export failed", error);
          finish(false);
          // The header is already sent, so the status cannot change: end the body with an error.
          controller.error(error);
        });
      },
      pull() {
        if (rowStream.isPaused()) rowStream.resume();
      },
      cancel() {
        buffer = [];
        finish(false);
        rowStream.destroy();
      },
    },
    // Queue up to about two chunks' worth of bytes before pausing the query (a chunk is roughly 0.5 to 1 MB).
    new ByteLengthQueuingStrategy({ highWaterMark: 512 * 1024 }),
  );
}
