import "server-only";
import type { PartStatus } from "@/domain/ledger-types";
import { MOVEMENT_FROM, MOVEMENT_LABELS, type MovementInput } from "@/lib/schemas/stock";
import { AppError, invalidField, notFound } from "./errors";
import type { Knex } from "./ledger";
import { issuedToOf, lastMovements, type LastMovement } from "./stock";

// The state machine of a unit in stores: which movement may follow which, with refusals that say what to do.

export interface LockedPart {
  id: number;
  partNumber: string;
  serialNumber: string;
  cage: string;
  status: PartStatus;
  bin: string | null;
  tsnMinutes: number;
  csn: number;
  tsoMinutes: number | null;
  cso: number | null;
}

const STATUS_WORDS: Record<PartStatus, string> = {
  serviceable: "serviceable",
  installed: "installed on an aircraft",
  unserviceable: "unserviceable",
  in_repair: "at the repair shop",
  quarantined: "quarantined",
  scrapped: "scrapped",
};

const NEXT_STEP: Partial<Record<PartStatus, string>> = {
  installed: "Remove it from the aircraft through a swap first.",
  in_repair: "Book it back from repair first.",
  quarantined: "Quality (an auditor) must release it from quarantine first.",
  scrapped: "A scrapped unit takes no further movements.",
};

function illegalTransition(part: LockedPart, input: MovementInput, fitted: { registration: string; positionCode: string } | null): AppError {
  const where = fitted ? ` (${fitted.registration}, position ${fitted.positionCode})` : "";
  const allowed = MOVEMENT_FROM[input.kind].map((s) => STATUS_WORDS[s]).join(" or ");
  return new AppError(
    "conflict",
    `Cannot "${MOVEMENT_LABELS[input.kind].toLowerCase()}" for P/N ${part.partNumber} S/N ${part.serialNumber}: it is ${STATUS_WORDS[part.status]}${where}, and this movement needs a unit that is ${allowed}. ${NEXT_STEP[part.status] ?? ""}`.trim(),
    "illegal_transition",
  );
}

export async function readPart(trx: Knex | Knex.Transaction, partId: number, options: { lock: boolean }): Promise<LockedPart> {
  const query = trx("parts").where({ id: partId });
  const row = await (options.lock ? query.forUpdate() : query).first();
  if (!row) throw notFound(`Part ${partId}`);
  const pn = await trx("part_numbers").where({ id: row.part_number_id }).first("part_number", "cage");
  return {
    id: Number(row.id),
    partNumber: pn.part_number,
    serialNumber: row.serial_number,
    cage: pn.cage,
    status: row.status,
    bin: row.bin,
    tsnMinutes: Number(row.tsn_minutes),
    csn: Number(row.csn),
    tsoMinutes: row.tso_minutes === null ? null : Number(row.tso_minutes),
    cso: row.cso === null ? null : Number(row.cso),
  };
}

/** The checks that depend on the unit's state; run before a file is stored and again under the row lock. */
export async function checkTransition(trx: Knex | Knex.Transaction, part: LockedPart, input: MovementInput, occurredAt: Date): Promise<LastMovement | null> {
  if (!MOVEMENT_FROM[input.kind].includes(part.status)) {
    const fitted = part.status === "installed"
      ? await trx("fitted as f").join("aircraft as a", "a.id", "f.aircraft_id").join("positions as p", "p.id", "f.position_id").where("f.part_id", part.id).first("a.registration", "p.code as positionCode")
      : null;
    throw illegalTransition(part, input, fitted ?? null);
  }
  const last = (await lastMovements([part.id], trx)).get(part.id) ?? null;
  if (last && occurredAt.getTime() < Date.parse(last.occurredAt)) {
    throw invalidField("occurredAt", `This is earlier than the unit's last entry (${last.kind}, ${last.occurredAt}). Entries of a unit follow one another in time.`);
  }
  const issuedTo = issuedToOf(last);
  if (issuedTo && input.kind !== "returned") {
    throw new AppError("conflict", `P/N ${part.partNumber} S/N ${part.serialNumber} is issued to ${issuedTo}. Take it back to stores (or fit it through a swap) before anything else.`, "issued");
  }
  if (input.kind === "issued" && !input.workOrder && !input.issuedTo) {
    throw new AppError("invalid", "workOrder: give the work order, or the technician the unit is issued to.", "invalid", { workOrder: "Give the work order or the technician." });
  }
  if (input.kind === "returned") {
    if (part.status === "unserviceable" && last?.kind !== "removed") {
      throw new AppError("conflict", `P/N ${part.partNumber} S/N ${part.serialNumber} is already in stores${part.bin ? ` (bin ${part.bin})` : ""}: only a unit removed from an aircraft, or one out on issue, can be taken back.`, "illegal_transition");
    }
    if (part.status === "serviceable" && !issuedTo) {
      throw new AppError("conflict", `P/N ${part.partNumber} S/N ${part.serialNumber} is not out on issue; it is already in stores${part.bin ? ` (bin ${part.bin})` : ""}.`, "illegal_transition");
    }
    if (part.status === "unserviceable" && !input.tagNumber) {
      throw invalidField("tagNumber", "A removed unit comes back with its unserviceable tag: give the tag number.");
    }
  }
  return last;
}
