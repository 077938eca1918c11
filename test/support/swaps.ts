// Builders for swap requests against the demo fleet, read from the database so tests follow the seed.
import { randomUUID } from "node:crypto";
import { http, testDb } from "./api";

export async function fittedAt(registration: string, positionCode: string) {
  return testDb()("fitted as f")
    .join("aircraft as a", "a.id", "f.aircraft_id")
    .join("positions as p", "p.id", "f.position_id")
    .join("parts as pt", "pt.id", "f.part_id")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .where({ "a.registration": registration, "p.code": positionCode })
    .first("pt.id", "pt.serial_number as serialNumber", "pn.part_number as partNumber", "pn.cage");
}

/** Serviceable, unfitted units of the given part numbers that have a certificate on file. */
export async function spares(partNumbers: string[], count: number) {
  const rows = await testDb()("parts as pt")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .leftJoin("fitted as f", "f.part_id", "pt.id")
    .whereIn("pn.part_number", partNumbers)
    .andWhere("pt.status", "serviceable")
    .whereNull("f.part_id")
    .orderBy("pt.id")
    .limit(count)
    .select("pt.id", "pt.serial_number as serialNumber", "pn.part_number as partNumber");
  if (rows.length < count) throw new Error(`only ${rows.length} spares of ${partNumbers.join(", ")} are in stores`);
  return rows;
}

export async function latestTotals(registration: string) {
  const row = await testDb()("utilization as u").join("aircraft as a", "a.id", "u.aircraft_id").where("a.registration", registration).orderBy("u.as_of", "desc").first("u.total_minutes", "u.total_cycles");
  return { minutes: Number(row.total_minutes), cycles: Number(row.total_cycles) };
}

export const hm = (minutes: number) => `${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, "0")}`;

export function swapBody(input: {
  registration: string;
  positionCode: string;
  minutes: number;
  cycles: number;
  removed: { partNumber: string; serialNumber: string } | null;
  installed: { partNumber: string; serialNumber: string } | null;
  performedAt?: string;
}) {
  return {
    registration: input.registration,
    positionCode: input.positionCode,
    aircraftHours: hm(input.minutes),
    aircraftCycles: input.cycles,
    performedAt: input.performedAt ?? new Date().toISOString(),
    removed: input.removed,
    installed: input.installed,
    removalType: input.removed ? "unscheduled" : null,
    reason: input.removed ? "Fault message on the maintenance computer" : null,
    workOrder: "WO-TEST-1",
    taskReference: "AMM 32-42 brake actuator replacement",
    testResult: input.installed ? "Operational test from the maintenance computer: passed" : null,
  };
}

export function postSwap(cookie: string, body: unknown, key: string = randomUUID()) {
  return http().post("/api/swaps").set("cookie", cookie).set("Idempotency-Key", key).send(body as object);
}
