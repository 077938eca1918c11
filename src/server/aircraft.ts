import "server-only";
import type { Knex } from "knex";
import { currentTotals, onWingTime, remainingLife, ageInDays } from "@/domain/life";
import { formatFlightTime } from "@/domain/flight-time";
import type { FittedUnit, MapPosition, PositionState } from "@/lib/position-types";
import { db, type Trx } from "./db";
import { AppError, notFound } from "./errors";
import { countFindings } from "./thread-findings";

export interface AircraftSummary {
  id: number;
  registration: string;
  msn: string;
  type: string;
  typeName: string;
  typeId: number;
  station: string;
  stationName: string;
  timeZone: string;
  hours: string;
  totalMinutes: number;
  cycles: number;
  asOf: string | null;
}

// Each aircraft's latest snapshot by one descending dive into the (aircraft_id, as_of) index. A join
// to a grouped MAX(as_of) looked equivalent, but on a freshly loaded table (stale index statistics)
// MariaDB evaluated it as a lateral table per snapshot row: a second per fleet-list request.
const LATEST_UTILIZATION_ID = "(SELECT u.id FROM utilization u WHERE u.aircraft_id = a.id ORDER BY u.as_of DESC LIMIT 1)";

function toSummary(row: Record<string, any>): AircraftSummary {
  const minutes = Number(row.total_minutes ?? 0);
  return {
    id: row.id,
    registration: row.registration,
    msn: row.manufacturer_serial_number,
    type: row.type_code,
    typeName: row.type_name,
    typeId: row.aircraft_type_id,
    station: row.station_code,
    stationName: row.station_name,
    timeZone: row.time_zone,
    hours: formatFlightTime(minutes),
    totalMinutes: minutes,
    cycles: Number(row.total_cycles ?? 0),
    asOf: row.as_of ? new Date(row.as_of).toISOString() : null,
  };
}

function aircraftBaseQuery(trx: Trx) {
  return trx("aircraft as a")
    .join("aircraft_types as t", "t.id", "a.aircraft_type_id")
    .join("stations as s", "s.id", "a.station_id")
    .leftJoin("utilization as lu", "lu.id", trx.raw(LATEST_UTILIZATION_ID))
    .select(
      "a.id",
      "a.registration",
      "a.manufacturer_serial_number",
      "a.aircraft_type_id",
      "t.code as type_code",
      "t.name as type_name",
      "s.code as station_code",
      "s.name as station_name",
      "s.time_zone",
      "lu.total_minutes",
      "lu.total_cycles",
      "lu.as_of",
    );
}

/** The aircraft as the API and the pages show it in a header. */
export function aircraftHeader(aircraft: AircraftSummary) {
  return {
    registration: aircraft.registration,
    msn: aircraft.msn,
    type: aircraft.type,
    typeName: aircraft.typeName,
    station: aircraft.station,
    timeZone: aircraft.timeZone,
    hours: aircraft.hours,
    cycles: aircraft.cycles,
    asOf: aircraft.asOf,
  };
}

export async function listFleet(trx: Trx = db()): Promise<AircraftSummary[]> {
  const rows = await aircraftBaseQuery(trx).orderBy("a.registration");
  return rows.map(toSummary);
}

/**
 * Open continuity findings per aircraft: the findings of every unit fitted there now (cached counts,
 * re-checked only for threads that changed).
 */
export async function countOpenFindingsByAircraft(trx: Trx = db()): Promise<Map<number, number>> {
  const fitted = await trx("fitted").select("aircraft_id", "part_id");
  const byPart = await countFindings(fitted.map((f) => Number(f.part_id)), trx);
  const byAircraft = new Map<number, number>();
  for (const f of fitted) byAircraft.set(f.aircraft_id, (byAircraft.get(f.aircraft_id) ?? 0) + (byPart.get(Number(f.part_id)) ?? 0));
  return byAircraft;
}

export async function getAircraftOrThrow(registration: string, trx: Trx = db()): Promise<AircraftSummary> {
  const row = await aircraftBaseQuery(trx).where("a.registration", registration.toUpperCase()).first();
  if (!row) throw notFound(`Aircraft ${registration}`);
  return toSummary(row);
}

/** Every position of the aircraft's type with what is fitted there now, its times and remaining life. */
export async function getPositionMap(
  registration: string,
  options: { now?: Date; trx?: Trx } = {},
): Promise<{ aircraft: AircraftSummary; positions: MapPosition[] }> {
  const trx = options.trx ?? db();
  const now = options.now ?? new Date();
  const aircraft = await getAircraftOrThrow(registration, trx);
  const [rows, eligibility] = await Promise.all([
    trx("positions as p")
      .leftJoin("fitted as f", function () {
        this.on("f.position_id", "p.id").andOn("f.aircraft_id", trx.raw("?", [aircraft.id]));
      })
      .leftJoin("parts as pt", "pt.id", "f.part_id")
      .leftJoin("part_numbers as pn", "pn.id", "pt.part_number_id")
      .where("p.aircraft_type_id", aircraft.typeId)
      .orderBy("p.sort_order")
      .select(
        "p.id",
        "p.code",
        "p.label",
        "p.parent_code",
        "p.ata_chapter",
        "p.zone",
        "p.map_x",
        "p.map_y",
        "p.cautions",
        "p.requires_independent_inspection",
        "f.part_id",
        "f.installed_at",
        "f.aircraft_minutes_at_install",
        "f.aircraft_cycles_at_install",
        "f.tsn_minutes_at_install",
        "f.csn_at_install",
        "f.tso_minutes_at_install",
        "f.cso_at_install",
        "pt.serial_number",
        "pt.manufactured_on",
        "pn.part_number",
        "pn.cage",
        "pn.description",
        "pn.life_limit_minutes",
        "pn.life_limit_cycles",
        "pn.life_limit_days",
      ),
    trx("position_eligibility as pe")
      .join("positions as p", "p.id", "pe.position_id")
      .join("part_numbers as pn", "pn.id", "pe.part_number_id")
      .where("p.aircraft_type_id", aircraft.typeId)
      .orderBy("pn.part_number")
      .select("pe.position_id", "pn.part_number"),
  ]);

  const eligibleBy = new Map<number, string[]>();
  for (const row of eligibility) {
    const list = eligibleBy.get(row.position_id) ?? [];
    list.push(row.part_number);
    eligibleBy.set(row.position_id, list);
  }
  const host = { minutes: aircraft.totalMinutes, cycles: aircraft.cycles };
  // Continuity findings of every fitted unit, read for the whole aircraft at once.
  const findingsOf = await countFindings(rows.filter((row) => row.part_id).map((row) => Number(row.part_id)), trx);

  const positions = rows.map((row): MapPosition => {
    const fitted = row.part_id ? fittedUnit(row, host, now) : null;
    const findings = row.part_id ? (findingsOf.get(Number(row.part_id)) ?? 0) : 0;
    const state: PositionState = !fitted
      ? "empty"
      : fitted.life.status === "exceeded"
        ? "past_limit"
        : findings > 0
          ? "finding"
          : fitted.life.status === "near"
            ? "near_limit"
            : "fitted";
    return {
      id: row.id,
      code: row.code,
      label: row.label,
      parentCode: row.parent_code,
      ataChapter: row.ata_chapter,
      zone: row.zone,
      x: Number(row.map_x),
      y: Number(row.map_y),
      cautions: row.cautions ? String(row.cautions).split("\n") : [],
      independentInspection: Boolean(row.requires_independent_inspection),
      eligible: eligibleBy.get(row.id) ?? [],
      fitted,
      state,
      findings,
    };
  });
  return { aircraft, positions };
}

function fittedUnit(row: Record<string, any>, host: { minutes: number; cycles: number }, now: Date): FittedUnit {
  const install = {
    part: {
      tsnMinutes: Number(row.tsn_minutes_at_install),
      csn: Number(row.csn_at_install),
      tsoMinutes: row.tso_minutes_at_install === null ? null : Number(row.tso_minutes_at_install),
      cso: row.cso_at_install === null ? null : Number(row.cso_at_install),
    },
    host: { minutes: Number(row.aircraft_minutes_at_install), cycles: Number(row.aircraft_cycles_at_install) },
  };
  // A snapshot older than the installation (never expected, but possible with late entries) counts as no time yet.
  const latest = { minutes: Math.max(host.minutes, install.host.minutes), cycles: Math.max(host.cycles, install.host.cycles) };
  const totals = currentTotals(install, latest);
  const onWing = onWingTime(install.host, latest);
  const life = remainingLife(
    {
      minutes: row.life_limit_minutes === null ? null : Number(row.life_limit_minutes),
      cycles: row.life_limit_cycles === null ? null : Number(row.life_limit_cycles),
      days: row.life_limit_days === null ? null : Number(row.life_limit_days),
    },
    { tsnMinutes: totals.tsnMinutes, csn: totals.csn, ageDays: row.manufactured_on ? ageInDays(new Date(row.manufactured_on), now) : null },
  );
  return {
    partId: row.part_id,
    partNumber: row.part_number,
    serialNumber: row.serial_number,
    cage: row.cage,
    description: row.description,
    installedAt: new Date(row.installed_at).toISOString(),
    hoursOnWing: formatFlightTime(onWing.minutes),
    cyclesOnWing: onWing.cycles,
    tsn: formatFlightTime(totals.tsnMinutes),
    csn: totals.csn,
    tso: totals.tsoMinutes === null ? null : formatFlightTime(totals.tsoMinutes),
    cso: totals.cso,
    life: {
      status: life.status,
      hoursRemaining: life.minutes ? formatSigned(life.minutes.remaining) : null,
      cyclesRemaining: life.cycles ? life.cycles.remaining : null,
      daysRemaining: life.days ? life.days.remaining : null,
    },
  };
}

function formatSigned(minutes: number): string {
  return minutes < 0 ? `-${formatFlightTime(-minutes)}` : formatFlightTime(minutes);
}

/**
 * Records aircraft totals as of an instant. Totals never decrease: a value lower than an earlier
 * snapshot (or higher than a later one) is refused with 409 naming the snapshot it contradicts.
 */
export async function recordUtilization(input: {
  registration: string;
  asOf: Date;
  minutes: number;
  cycles: number;
  actorId: string;
  trx?: Knex.Transaction;
}): Promise<{ asOf: string; hours: string; cycles: number }> {
  const work = async (trx: Knex.Transaction) => {
    const aircraft = await trx("aircraft").where({ registration: input.registration.toUpperCase() }).forUpdate().first("id", "registration");
    if (!aircraft) throw notFound(`Aircraft ${input.registration}`);
    const earlier = await trx("utilization").where("aircraft_id", aircraft.id).andWhere("as_of", "<=", input.asOf).orderBy("as_of", "desc").first();
    const later = await trx("utilization").where("aircraft_id", aircraft.id).andWhere("as_of", ">", input.asOf).orderBy("as_of", "asc").first();
    if (earlier && new Date(earlier.as_of).getTime() === input.asOf.getTime()) {
      if (Number(earlier.total_minutes) === input.minutes && Number(earlier.total_cycles) === input.cycles) {
        return { asOf: input.asOf.toISOString(), hours: formatFlightTime(input.minutes), cycles: input.cycles };
      }
      throw new AppError("conflict", `A snapshot for ${aircraft.registration} at ${input.asOf.toISOString()} already exists with ${formatFlightTime(Number(earlier.total_minutes))} and ${earlier.total_cycles} cycles.`, "utilization_exists");
    }
    if (earlier && (input.minutes < Number(earlier.total_minutes) || input.cycles < Number(earlier.total_cycles))) {
      throw new AppError(
        "conflict",
        `Aircraft totals never decrease: the snapshot of ${new Date(earlier.as_of).toISOString()} already shows ${formatFlightTime(Number(earlier.total_minutes))} and ${earlier.total_cycles} cycles.`,
        "time_regression",
        { hours: `must be at least ${formatFlightTime(Number(earlier.total_minutes))}`, cycles: `must be at least ${earlier.total_cycles}` },
      );
    }
    if (later && (input.minutes > Number(later.total_minutes) || input.cycles > Number(later.total_cycles))) {
      throw new AppError(
        "conflict",
        `A later snapshot (${new Date(later.as_of).toISOString()}) shows only ${formatFlightTime(Number(later.total_minutes))} and ${later.total_cycles} cycles; totals at an earlier instant cannot be higher.`,
        "time_regression",
      );
    }
    await trx("utilization").insert({
      aircraft_id: aircraft.id,
      as_of: input.asOf,
      total_minutes: input.minutes,
      total_cycles: input.cycles,
      recorded_by: input.actorId,
      recorded_at: new Date(),
    });
    return { asOf: input.asOf.toISOString(), hours: formatFlightTime(input.minutes), cycles: input.cycles };
  };
  return input.trx ? work(input.trx) : db().transaction(work);
}

export async function listUtilization(registration: string, limit = 30, trx: Trx = db()) {
  const aircraft = await getAircraftOrThrow(registration, trx);
  const rows = await trx("utilization").where("aircraft_id", aircraft.id).orderBy("as_of", "desc").limit(limit);
  return rows.map((row) => ({
    asOf: new Date(row.as_of).toISOString(),
    hours: formatFlightTime(Number(row.total_minutes)),
    cycles: Number(row.total_cycles),
  }));
}

export type { FittedUnit, MapPosition, PositionState };
