import "server-only";
import { carryOver, remainingLife, ageInDays, type PartTotals } from "@/domain/life";
import { formatFlightTime } from "@/domain/flight-time";
import type { SwapCheckInput, UnitRef } from "@/lib/schemas/swaps";
import type { SwapCheck } from "@/lib/swap-types";
import { AppError } from "./errors";
import type { Sql } from "./sql";

// What a swap rests on, read (and, when recording, locked) in one place, so the pre-install check the
// technician sees and the transaction that records the swap apply exactly the same rules.

export type { CheckLevel, SwapCheck } from "@/lib/swap-types";

export interface SwapPlan {
  aircraft: { id: number; registration: string; typeId: number };
  position: { id: number; code: string; label: string; requiresInspection: boolean; ataChapter: string };
  fitted: null | {
    partId: number;
    installedSeq: number;
    hostMinutes: number;
    hostCycles: number;
    part: PartTotals;
    partNumber: string;
    serialNumber: string;
    cage: string;
  };
  removedUnit: null | { id: number; partNumber: string; serialNumber: string; totals: PartTotals };
  installedUnit: null | { id: number; partNumber: string; serialNumber: string; cage: string; totals: PartTotals; documentId: number | null };
  latestSnapshot: { asOf: Date; minutes: number; cycles: number } | null;
  checks: SwapCheck[];
}

const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

// A row as mysql2 returns it; the Knex rows this code read before were as loosely typed.
type Row = Record<string, any>;

async function findUnit(sql: Sql, ref: UnitRef, lock: boolean) {
  const rows = await sql.rows<Row>(
    `SELECT pt.*, pn.part_number, pn.cage, pn.life_limit_minutes, pn.life_limit_cycles, pn.life_limit_days, pn.id AS pn_id
       FROM parts pt JOIN part_numbers pn ON pn.id = pt.part_number_id
      WHERE pn.part_number = ? AND pt.serial_number = ?${ref.cage ? " AND pn.cage = ?" : ""}${lock ? " FOR UPDATE" : ""}`,
    [ref.partNumber.toUpperCase(), ref.serialNumber.toUpperCase(), ...(ref.cage ? [ref.cage.toUpperCase()] : [])],
  );
  if (rows.length > 1) {
    throw new AppError("invalid", `Several units are P/N ${ref.partNumber} S/N ${ref.serialNumber}; give the CAGE code to say which.`, "invalid", { cage: "needed to tell the units apart" });
  }
  return rows[0] ?? null;
}

const totalsOfRow = (row: Record<string, unknown>): PartTotals => ({
  tsnMinutes: Number(row.tsn_minutes),
  csn: Number(row.csn),
  tsoMinutes: num(row.tso_minutes),
  cso: num(row.cso),
});

/**
 * Reads the state a swap rests on and judges it. With `lock`, the aircraft row, the installed unit and
 * the fitted row are locked for the caller's transaction (aircraft first, then parts: one order for all
 * writers, so two swaps never wait on each other in a circle).
 */
export async function planSwap(sql: Sql, input: SwapCheckInput, options: { lock: boolean; now: Date }): Promise<SwapPlan> {
  const lock = options.lock;
  const [aircraft] = await sql.rows<Row>(`SELECT id, registration, aircraft_type_id FROM aircraft WHERE registration = ? LIMIT 1${lock ? " FOR UPDATE" : ""}`, [input.registration]);
  if (!aircraft) throw new AppError("not_found", `Aircraft ${input.registration} is not in the fleet.`);
  // The position, the unit fitted there and the aircraft's latest snapshot, in one plain read (made
  // after the aircraft lock when recording, like the three reads it stands for).
  const latest = (column: string) => `(SELECT u.${column} FROM utilization u WHERE u.aircraft_id = ? ORDER BY u.as_of DESC LIMIT 1)`;
  const [position] = await sql.rows<Row>(
    `SELECT p.id, p.code, p.label, p.requires_independent_inspection, p.ata_chapter,
            f.part_id, f.installed_seq, f.aircraft_minutes_at_install, f.aircraft_cycles_at_install,
            f.tsn_minutes_at_install, f.csn_at_install, f.tso_minutes_at_install, f.cso_at_install,
            pt.serial_number, pn.part_number, pn.cage,
            ${latest("as_of")} AS latest_as_of, ${latest("total_minutes")} AS latest_minutes, ${latest("total_cycles")} AS latest_cycles
       FROM positions p
       LEFT JOIN fitted f ON f.position_id = p.id AND f.aircraft_id = ?
       LEFT JOIN parts pt ON pt.id = f.part_id
       LEFT JOIN part_numbers pn ON pn.id = pt.part_number_id
      WHERE p.aircraft_type_id = ? AND p.code = ?
      LIMIT 1`,
    [aircraft.id, aircraft.id, aircraft.id, aircraft.id, aircraft.aircraft_type_id, input.positionCode.toUpperCase()],
  );
  if (!position) {
    throw new AppError("invalid", `${input.registration} has no position ${input.positionCode}.`, "invalid", { positionCode: `no such position on ${input.registration}` });
  }
  const fittedRow = position.part_id === null ? null : position;

  const checks: SwapCheck[] = [];
  const plan: SwapPlan = {
    aircraft: { id: aircraft.id, registration: aircraft.registration, typeId: aircraft.aircraft_type_id },
    position: {
      id: position.id,
      code: position.code,
      label: position.label,
      requiresInspection: Boolean(position.requires_independent_inspection),
      ataChapter: position.ata_chapter,
    },
    fitted: fittedRow
      ? {
          partId: fittedRow.part_id,
          installedSeq: Number(fittedRow.installed_seq),
          hostMinutes: Number(fittedRow.aircraft_minutes_at_install),
          hostCycles: Number(fittedRow.aircraft_cycles_at_install),
          part: {
            tsnMinutes: Number(fittedRow.tsn_minutes_at_install),
            csn: Number(fittedRow.csn_at_install),
            tsoMinutes: num(fittedRow.tso_minutes_at_install),
            cso: num(fittedRow.cso_at_install),
          },
          partNumber: fittedRow.part_number,
          serialNumber: fittedRow.serial_number,
          cage: fittedRow.cage,
        }
      : null,
    removedUnit: null,
    installedUnit: null,
    latestSnapshot: position.latest_as_of === null ? null : { asOf: new Date(position.latest_as_of), minutes: Number(position.latest_minutes), cycles: Number(position.latest_cycles) },
    checks,
  };

  // The snapshot: never below the last one recorded, nor below the fitted unit's installation.
  if (plan.latestSnapshot && (input.aircraftHours < plan.latestSnapshot.minutes || input.aircraftCycles < plan.latestSnapshot.cycles)) {
    checks.push({
      name: "snapshot",
      level: "fail",
      code: "time_regression",
      message: `The aircraft already shows ${formatFlightTime(plan.latestSnapshot.minutes)} and ${plan.latestSnapshot.cycles} cycles (${plan.latestSnapshot.asOf.toISOString()}); the snapshot cannot be lower.`,
    });
  } else if (plan.fitted && (input.aircraftHours < plan.fitted.hostMinutes || input.aircraftCycles < plan.fitted.hostCycles)) {
    checks.push({ name: "snapshot", level: "fail", code: "time_regression", message: `The fitted unit was installed at ${formatFlightTime(plan.fitted.hostMinutes)} and ${plan.fitted.hostCycles} cycles; the snapshot cannot be lower.` });
  } else {
    checks.push({ name: "snapshot", level: "ok", message: `Snapshot ${formatFlightTime(input.aircraftHours)} h and ${input.aircraftCycles} cycles follows the last one recorded.` });
  }

  // The off part must be the unit Threadline has fitted here.
  if (input.removed) {
    const sameUnit =
      plan.fitted &&
      plan.fitted.partNumber === input.removed.partNumber.toUpperCase() &&
      plan.fitted.serialNumber === input.removed.serialNumber.toUpperCase() &&
      (!input.removed.cage || plan.fitted.cage === input.removed.cage.toUpperCase());
    if (!plan.fitted) {
      checks.push({ name: "off part", level: "fail", code: "position_mismatch", message: `Threadline has nothing fitted at ${position.code}, so S/N ${input.removed.serialNumber} cannot come off it. Check the position; if the unit really is there, report the discrepancy.` });
    } else if (!sameUnit) {
      checks.push({
        name: "off part",
        level: "fail",
        code: "position_mismatch",
        message: `Threadline has P/N ${plan.fitted.partNumber} S/N ${plan.fitted.serialNumber} fitted at ${position.code}, not P/N ${input.removed.partNumber} S/N ${input.removed.serialNumber}. Check you are at the right position; if the unit on the aircraft differs from the record, report the discrepancy.`,
      });
    } else {
      const totals = carryOver({ part: plan.fitted.part, host: { minutes: plan.fitted.hostMinutes, cycles: plan.fitted.hostCycles } }, { minutes: Math.max(input.aircraftHours, plan.fitted.hostMinutes), cycles: Math.max(input.aircraftCycles, plan.fitted.hostCycles) });
      plan.removedUnit = { id: plan.fitted.partId, partNumber: plan.fitted.partNumber, serialNumber: plan.fitted.serialNumber, totals };
      checks.push({ name: "off part", level: "ok", message: `S/N ${plan.fitted.serialNumber} is the unit on record at ${position.code}.` });
    }
  } else if (plan.fitted && input.installed) {
    checks.push({ name: "off part", level: "fail", code: "position_mismatch", message: `P/N ${plan.fitted.partNumber} S/N ${plan.fitted.serialNumber} is fitted at ${position.code}: scan it as the off part before installing another.` });
  }

  if (input.installed) await judgeInstalledUnit(sql, input.installed, plan, { lock, now: options.now });
  return plan;
}

async function judgeInstalledUnit(sql: Sql, ref: UnitRef, plan: SwapPlan, options: { lock: boolean; now: Date }) {
  const checks = plan.checks;
  const unit = await findUnit(sql, ref, options.lock);
  if (!unit) {
    checks.push({ name: "on part", level: "fail", code: "part_not_serviceable", message: `No unit P/N ${ref.partNumber} S/N ${ref.serialNumber} is on record. Stores must receive it with its release certificate first.` });
    return;
  }
  const totals = totalsOfRow(unit);
  plan.installedUnit = { id: unit.id, partNumber: unit.part_number, serialNumber: unit.serial_number, cage: unit.cage, totals, documentId: null };

  // Three plain reads in one statement: eligibility, where else the unit is fitted, its latest release.
  // Eligible: the position lists the P/N, or an alternate that the P/N may replace (one-way: the
  // listed P/N names it as its alternate; two-way: either names the other).
  // A release certificate on file: the unit's latest receipt or return from repair cites a document.
  const elsewhere = (column: string) =>
    `(SELECT ${column} FROM fitted f JOIN aircraft a ON a.id = f.aircraft_id JOIN positions p ON p.id = f.position_id WHERE f.part_id = ? LIMIT 1)`;
  const [facts] = await sql.rows<Row>(
    `SELECT EXISTS (SELECT pe.part_number_id FROM position_eligibility pe
                     WHERE pe.position_id = ?
                       AND (pe.part_number_id = ?
                            OR EXISTS (SELECT * FROM part_interchange pi WHERE pi.part_number_id = pe.part_number_id AND pi.alternate_part_number_id = ?)
                            OR EXISTS (SELECT * FROM part_interchange pi WHERE pi.alternate_part_number_id = pe.part_number_id AND pi.part_number_id = ? AND pi.two_way = 1))) AS eligible,
            ${elsewhere("a.registration")} AS fitted_registration,
            ${elsewhere("p.code")} AS fitted_code,
            (SELECT document_id FROM ledger_entries WHERE part_id = ? AND kind IN ('received', 'repaired') ORDER BY seq DESC LIMIT 1) AS release_document_id`,
    [plan.position.id, unit.pn_id, unit.pn_id, unit.pn_id, unit.id, unit.id, unit.id],
  );

  checks.push(
    Number(facts.eligible) === 1
      ? { name: "eligibility", level: "ok", message: `P/N ${unit.part_number} is eligible at ${plan.position.code}.` }
      : { name: "eligibility", level: "fail", code: "not_eligible", message: `P/N ${unit.part_number} is not eligible at ${plan.position.code} (${plan.position.label}), nor an approved alternate of an eligible P/N.` },
  );

  if (facts.fitted_registration !== null) {
    checks.push({ name: "status", level: "fail", code: "part_fitted_elsewhere", message: `S/N ${unit.serial_number} is recorded as fitted on ${facts.fitted_registration} at ${facts.fitted_code}. It must be removed there first.` });
  } else if (unit.status !== "serviceable") {
    const word = String(unit.status).replace("_", " ");
    checks.push({ name: "status", level: "fail", code: "part_not_serviceable", message: `S/N ${unit.serial_number} is ${word}, not serviceable.${unit.status === "quarantined" ? " Ask quality to release it before installing." : " Only a serviceable unit may be fitted."}` });
  } else {
    checks.push({ name: "status", level: "ok", message: `S/N ${unit.serial_number} is serviceable.` });
  }

  plan.installedUnit.documentId = num(facts.release_document_id);
  checks.push(
    facts.release_document_id !== null
      ? { name: "certificate", level: "ok", message: "A release certificate is on file for this unit." }
      : { name: "certificate", level: "fail", code: "part_not_serviceable", message: `No release certificate is on file for S/N ${unit.serial_number}. Stores must attach the certificate before it can be fitted.` },
  );

  const life = remainingLife(
    { minutes: num(unit.life_limit_minutes), cycles: num(unit.life_limit_cycles), days: num(unit.life_limit_days) },
    { tsnMinutes: totals.tsnMinutes, csn: totals.csn, ageDays: unit.manufactured_on ? ageInDays(new Date(unit.manufactured_on), options.now) : null },
  );
  const limits = [
    life.minutes ? `${formatFlightTime(Math.max(0, life.minutes.remaining))} h of ${formatFlightTime(life.minutes.limit)}` : null,
    life.cycles ? `${Math.max(0, life.cycles.remaining)} of ${life.cycles.limit} cycles` : null,
    life.days ? `${Math.max(0, life.days.remaining)} of ${life.days.limit} days` : null,
  ].filter(Boolean);
  if (life.status === "exceeded") {
    checks.push({ name: "life", level: "fail", code: "life_exceeded", message: `S/N ${unit.serial_number} has reached a life limit (remaining: ${limits.join(", ")}). It may not be fitted.` });
  } else if (life.status === "near") {
    checks.push({ name: "life", level: "warn", message: `S/N ${unit.serial_number} is within 10% of a life limit (remaining: ${limits.join(", ")}).` });
  } else {
    checks.push({ name: "life", level: "ok", message: limits.length ? `Life left: ${limits.join(", ")}.` : "No life limit on this part number." });
  }
}

/** The first refusal, as the 409 the contract names. */
export function firstFailure(plan: SwapPlan): AppError | null {
  const failed = plan.checks.find((c) => c.level === "fail");
  return failed ? new AppError("conflict", failed.message, failed.code ?? "conflict") : null;
}
