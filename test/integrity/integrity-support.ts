// Shared by the integrity suites: spares received through the real receipts route, ledger counts,
// and a cheap fingerprint of the database to prove a refused request wrote nothing.
import { expect } from "vitest";
import { testDb } from "../support/api";
import { postReceipt, receiptFields } from "../api/receipts-fixtures";

export interface Unit {
  partNumber: string;
  serialNumber: string;
}

/** Books new units in through POST /api/receipts (a few at a time, as a stores desk would). */
export async function receiveSpares(storesCookie: string, wanted: Array<{ partNumber: string; cage: string }>): Promise<Unit[]> {
  const received: Unit[] = [];
  for (let i = 0; i < wanted.length; i += 4) {
    const batch = wanted.slice(i, i + 4);
    const answers = await Promise.all(
      batch.map((pn) => postReceipt(storesCookie, receiptFields({ partNumber: pn.partNumber, cage: pn.cage, statusWork: "new", tsn: "0:00", csn: "0", remarks: "New unit for the integrity suites." }))),
    );
    answers.forEach((answer, j) => {
      expect(answer.status, answer.text).toBe(201);
      received.push({ partNumber: batch[j].partNumber, serialNumber: answer.body.part.serialNumber });
    });
  }
  return received;
}

export async function ledgerCount(): Promise<number> {
  const [{ count }] = await testDb()("ledger_entries").count({ count: "*" });
  return Number(count);
}

/** ledger head plus row counts of the tables a write would touch. */
export async function dbFingerprint(): Promise<string> {
  const db = testDb();
  const head = await db("ledger_head").first("last_seq", "last_hash");
  const counts: string[] = [];
  for (const table of ["parts", "documents", "swaps", "utilization", "users", "part_numbers", "positions", "aircraft_types", "position_discrepancies", "account_tokens", "mail_outbox"]) {
    const [{ count }] = await db(table).count({ count: "*" });
    counts.push(`${table}=${count}`);
  }
  return `${head.last_seq}:${head.last_hash}|${counts.join(",")}`;
}

/** Runs `tasks` with at most `limit` in flight. */
export async function inBatches<T>(tasks: Array<() => Promise<T>>, limit: number): Promise<T[]> {
  const results: T[] = new Array(tasks.length);
  let next = 0;
  await Promise.all(
    Array.from({ length: limit }, async () => {
      while (next < tasks.length) {
        const index = next++;
        results[index] = await tasks[index]();
      }
    }),
  );
  return results;
}

/** Fitted positions across the fleet whose fitted part number may go back in (so a new unit of it is eligible). */
export async function positionsWithEligibleSpares(count: number) {
  const rows = await testDb()("fitted as f")
    .join("aircraft as a", "a.id", "f.aircraft_id")
    .join("positions as p", "p.id", "f.position_id")
    .join("parts as pt", "pt.id", "f.part_id")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .join("position_eligibility as pe", function () {
      this.on("pe.position_id", "p.id").andOn("pe.part_number_id", "pn.id");
    })
    .where("p.requires_independent_inspection", false)
    .orderBy(["a.registration", "p.code"])
    .select("a.registration", "p.code as positionCode", "pt.serial_number as serialNumber", "pn.part_number as partNumber", "pn.cage");
  // Spread across the fleet rather than filling the first aircraft.
  const byAircraft = new Map<string, typeof rows>();
  for (const row of rows) byAircraft.set(row.registration, [...(byAircraft.get(row.registration) ?? []), row]);
  const picked: typeof rows = [];
  for (let round = 0; picked.length < count; round++) {
    let added = false;
    for (const list of byAircraft.values()) {
      if (list[round] && picked.length < count) {
        picked.push(list[round]);
        added = true;
      }
    }
    if (!added) break;
  }
  if (picked.length < count) throw new Error(`only ${picked.length} fitted positions take their own part number again`);
  return picked;
}
