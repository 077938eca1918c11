import "server-only";
import type { User } from "lucia";
import { db } from "./db";
import { AppError } from "./errors";
import { kickOutbox, queueMail } from "./mail";

export async function reportDiscrepancy(input: { registration: string; positionCode: string; found?: { partNumber: string; serialNumber: string } | null; note?: string; actor: User }) {
  const id = await db().transaction(async (trx) => {
    const aircraft = await trx("aircraft").where({ registration: input.registration }).first("id", "registration", "aircraft_type_id");
    if (!aircraft) throw new AppError("not_found", `Aircraft ${input.registration} is not in the fleet.`);
    const position = await trx("positions").where({ aircraft_type_id: aircraft.aircraft_type_id, code: input.positionCode.toUpperCase() }).first("id", "code", "label");
    if (!position) throw new AppError("invalid", `${input.registration} has no position ${input.positionCode}.`, "invalid", { positionCode: "no such position" });
    const fitted = await trx("fitted as f").join("parts as p", "p.id", "f.part_id").join("part_numbers as pn", "pn.id", "p.part_number_id").where({ "f.aircraft_id": aircraft.id, "f.position_id": position.id }).first("p.id", "p.serial_number", "pn.part_number");
    const [row] = await trx("position_discrepancies").insert({
      aircraft_id: aircraft.id,
      position_id: position.id,
      recorded_part_id: fitted?.id ?? null,
      found_part_number: input.found?.partNumber ?? null,
      found_serial_number: input.found?.serialNumber ?? null,
      note: input.note ?? null,
      reported_by: input.actor.id,
      reported_at: new Date(),
    });
    const inspectors = await trx("users").where({ role: "inspector", status: "active" }).pluck("email");
    await queueMail(
      trx,
      inspectors.map((to: string) => ({
        to,
        subject: `Position discrepancy: ${aircraft.registration} ${position.code}`,
        text: [
          `${input.actor.name} reports that the unit at ${aircraft.registration} ${position.code} (${position.label}) does not match the record.`,
          `On record: ${fitted ? `P/N ${fitted.part_number} S/N ${fitted.serial_number}` : "nothing fitted"}`,
          `Found: ${input.found ? `P/N ${input.found.partNumber} S/N ${input.found.serialNumber}` : "not stated"}`,
          input.note ? `Note: ${input.note}` : "",
          "No swap can be recorded at this position until the record is put right.",
        ].join("\n"),
      })),
    );
    return Number(row);
  });
  kickOutbox();
  return { discrepancy: { id } };
}
