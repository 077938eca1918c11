// Simulates two years of the invented fleet: daily utilisation, units fitted at every position,
// unscheduled and scheduled removals, swaps from stores spares, repairs and re-use on other airframes.
// Everything follows from one seed, so every run writes the same history.
//
// The simulation only decides what happens and when. It returns the events in time order, and the
// replay (seeds/replay/history.ts) records them: every swap through the app's own swap recording,
// the rest through the app's ledger append.
import type { LedgerEntryFields, PartStatus, RemovalType } from "../../src/domain/ledger-types";
import { DEMO_PART_NUMBERS, type DemoPartNumber } from "./catalog-data";
import { DEMO_AIRCRAFT, DEMO_NOW, HISTORY_START } from "./demo";
import { buildLayout, DEMO_TYPES, type DemoPosition } from "./layout-data";
import { pick, seededRandom } from "./random";

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;

/** Mean flight hours between unscheduled removals, per part-number key; invented for the demo. */
const MTBUR_HOURS: Record<string, number> = {
  brakeActuator: 7_000, brakeActuatorB: 12_000, wheelSpeed: 9_000, brakeTemp: 11_000, adiru: 14_000, display: 12_000,
  displayB: 16_000, vhfCom: 15_000, transponder: 18_000, fuelPump: 16_000, starter: 9_000, starterB: 13_000,
  generator: 11_000, hydPump: 12_000, exciter: 14_000, oilPressure: 10_000, packValve: 8_000, bleedValve: 7_500,
  cpc: 15_000, steering: 20_000, spoilerActuator: 25_000, battery: 20_000, propControl: 16_000, deiceValve: 9_000,
};
const DEFAULT_MTBUR_HOURS = 30_000;
/** Wheels come off for tyre wear, brakes for heat-sink wear: scheduled, by landings. */
const WEAR_CYCLES: Record<string, number> = { mainWheel: 320, mainWheelB: 340, noseWheel: 380, brake: 1_900, brakeB: 2_300 };

/**
 * A spare is only taken from the shelf with this much life left (a planning margin chosen for the
 * demo, so a unit is not fitted only to come off again within days; the swap's own life check
 * refuses a unit with no life left at all).
 */
const SPARE_MARGIN = { days: 90, minutes: 500 * 60, cycles: 500 };

const UNSCHEDULED_REASONS: Record<string, string[]> = {
  brakeActuator: ["BRAKE ACTUATOR FAULT message on the maintenance computer", "Actuator failed the running-clearance test", "Intermittent position feedback from the actuator"],
  default: ["Failed built-in test", "Intermittent fault reported by the crew", "Fault message on the maintenance computer", "Leak found on the daily check", "Erratic indication"],
};
const SHOPS = [
  { name: "Quillfeather Component Shop", approval: "QA.145.0012" },
  { name: "Harbourline Repair Services", approval: "QA.145.0047" },
];
/** The supplier of new and exchange units (receipts). */
export const SUPPLIER = { name: "Quillfeather Parts Supply", approval: "QA.21G.0003" };

/** A ledger entry as the simulation describes it; seq, recordedAt and the hashes are the ledger's. */
export type SimulatedEntry = Omit<LedgerEntryFields, "seq" | "recordedAt">;

export interface SimulatedPart {
  id: number;
  partNumberId: number;
  partNumber: string;
  cage: string;
  serialNumber: string;
  bin: string | null;
  manufacturedOn: string;
  tsnMinutes: number;
  csn: number;
  tsoMinutes: number | null;
  cso: number | null;
}

/** The release certificate that comes with a receipt or a return from repair. */
export interface SimulatedCertificate {
  issuerName: string;
  issuerApproval: string;
  statusWork: string;
}

export interface SimulatedSwap {
  /** 1-based, in the order the swaps happen. */
  number: number;
  aircraftId: number;
  positionId: number;
  registration: string;
  positionCode: string;
  /** The aircraft's totals the technician reads off for the snapshot. */
  hostMinutes: number;
  hostCycles: number;
  removed: { partId: number; partNumber: string; serialNumber: string; tsnMinutes: number; csn: number };
  installed: { partId: number; partNumber: string; serialNumber: string };
  removalType: RemovalType;
  reason: string;
  workOrder: string;
  taskReference: string;
  testResult: string;
  requiresInspection: boolean;
}

/** The unit's state in stores after a stock entry; TSO/CSO only when the entry restarts them. */
export interface StockState {
  status: PartStatus;
  bin: string | null;
  overhauled?: true;
}

export type HistoryEvent =
  /** Stores books a unit in with its release certificate. */
  | { type: "received"; at: number; part: SimulatedPart; entry: SimulatedEntry; certificate: SimulatedCertificate }
  /** A unit already fitted when the records start: taken over from the previous records, not a swap. */
  | { type: "taken_over"; at: number; entry: SimulatedEntry }
  /** Returned to stores, sent for repair, back from repair. `removal` is the swap that took it off. */
  | { type: "stock"; at: number; entry: SimulatedEntry; state: StockState; removal: number; certificate?: SimulatedCertificate }
  /** The day's totals of one aircraft. */
  | { type: "utilisation"; at: number; aircraftId: number; minutes: number; cycles: number }
  | { type: "swap"; at: number; swap: SimulatedSwap };

export interface SimulatedHistory {
  /** In time order (ties in the order they were decided). */
  events: HistoryEvent[];
}

interface Unit {
  id: number;
  pn: DemoPartNumber;
  pnId: number;
  serial: string;
  status: PartStatus;
  manufacturedOn: string;
  tsn: number; // minutes
  csn: number;
  tso: number | null;
  cso: number | null;
  // while fitted
  at?: { aircraftId: number; positionId: number; hostMinutes: number; hostCycles: number; tsn: number; csn: number; tso: number | null; cso: number | null };
  removedUnscheduled?: boolean;
}

export function simulateHistory(userIds: { technician: string; inspector: string; stores: string }): SimulatedHistory {
  const random = seededRandom(20261201);
  const events: HistoryEvent[] = [];
  const units: Unit[] = [];
  const serialCounters = new Map<string, number>();
  const pnIdOf = new Map(DEMO_PART_NUMBERS.map((p, i) => [p.key, i + 1]));
  let swapCount = 0;

  const iso = (ms: number) => new Date(ms).toISOString();
  const entry = (kind: SimulatedEntry["kind"], unit: Unit, atMs: number, fields: Partial<SimulatedEntry> = {}): SimulatedEntry => ({
    kind,
    partId: unit.id,
    aircraftId: null,
    positionId: null,
    occurredAt: iso(atMs),
    recordedBy: kind === "installed" || kind === "removed" ? userIds.technician : userIds.stores,
    aircraftMinutes: null,
    aircraftCycles: null,
    tsnMinutes: unit.tsn,
    csn: unit.csn,
    tsoMinutes: unit.tso,
    cso: unit.cso,
    removalType: null,
    reason: null,
    workOrder: null,
    taskReference: null,
    testResult: null,
    documentId: null,
    correctsSeq: null,
    details: null,
    ...fields,
  });

  const newUnit = (pnKey: string, receivedMs: number, ageYears: number): Unit => {
    ageYears = Math.max(0, ageYears);
    const pn = DEMO_PART_NUMBERS.find((p) => p.key === pnKey)!;
    // Units arrive with most of any calendar life left, as a stores clerk would accept them.
    if (pn.lifeDays) ageYears = Math.min(ageYears, (pn.lifeDays / 365) * 0.6 * random());
    const n = (serialCounters.get(pn.serialPrefix) ?? 1000) + 1 + Math.floor(random() * 3);
    serialCounters.set(pn.serialPrefix, n);
    const hoursSoFar = Math.floor(ageYears * 2_600 * (0.6 + random() * 0.5));
    const limitHours = pn.lifeHours ?? Infinity;
    const tsnHours = Math.min(hoursSoFar, Math.floor(limitHours * 0.7));
    const cyclesSoFar = Math.min(Math.floor(tsnHours * (0.6 + random() * 0.4)), pn.lifeCycles ? Math.floor(pn.lifeCycles * 0.7) : Infinity);
    const overhauled = pn.overhaulHours || pn.overhaulCycles ? true : false;
    const unit: Unit = {
      id: units.length + 1,
      pn,
      pnId: pnIdOf.get(pnKey)!,
      serial: `${pn.serialPrefix}${String(n).padStart(5, "0")}`,
      status: "serviceable",
      manufacturedOn: new Date(receivedMs - Math.floor(ageYears * 365 + 30) * DAY_MS).toISOString().slice(0, 10),
      tsn: tsnHours * 60,
      csn: cyclesSoFar,
      tso: overhauled ? Math.floor(tsnHours * 0.3) * 60 : null,
      cso: overhauled ? Math.floor(cyclesSoFar * 0.3) : null,
    };
    const bin = `S${1 + Math.floor(random() * 3)}-${String.fromCharCode(65 + Math.floor(random() * 6))}${1 + Math.floor(random() * 9)}`;
    units.push(unit);
    const statusWork = overhauled ? "overhauled" : ageYears === 0 ? "new" : "inspected_tested";
    events.push({
      type: "received",
      at: receivedMs,
      part: {
        id: unit.id,
        partNumberId: unit.pnId,
        partNumber: pn.partNumber,
        cage: pn.cage,
        serialNumber: unit.serial,
        bin,
        manufacturedOn: unit.manufacturedOn,
        tsnMinutes: unit.tsn,
        csn: unit.csn,
        tsoMinutes: unit.tso,
        cso: unit.cso,
      },
      entry: entry("received", unit, receivedMs, { details: { bin, statusWork } }),
      certificate: { issuerName: SUPPLIER.name, issuerApproval: SUPPLIER.approval, statusWork },
    });
    return unit;
  };

  // Aircraft and their layouts.
  const layouts = new Map(DEMO_TYPES.map((t) => [t.id, buildLayout(t)]));
  let positionIdBase = 0;
  const positionIds = new Map<string, number>(); // `${typeId}:${code}` -> id
  for (const type of DEMO_TYPES) {
    layouts.get(type.id)!.forEach((p, i) => positionIds.set(`${type.id}:${p.code}`, positionIdBase + i + 1));
    positionIdBase += layouts.get(type.id)!.length;
  }
  const positionById = new Map<number, DemoPosition>();
  for (const type of DEMO_TYPES) for (const p of layouts.get(type.id)!) positionById.set(positionIds.get(`${type.id}:${p.code}`)!, p);

  const host = new Map<number, { minutes: number; cycles: number }>(DEMO_AIRCRAFT.map((a) => [a.id, { minutes: a.startHours * 60, cycles: a.startCycles }]));
  // What is fitted where, per aircraft: position id -> unit, in the order the units were fitted.
  const fittedOn = new Map<number, Map<number, Unit>>(DEMO_AIRCRAFT.map((a) => [a.id, new Map()]));
  const start = HISTORY_START.getTime();

  function fit(unit: Unit, aircraftId: number, positionId: number) {
    const totals = host.get(aircraftId)!;
    unit.status = "installed";
    unit.at = { aircraftId, positionId, hostMinutes: totals.minutes, hostCycles: totals.cycles, tsn: unit.tsn, csn: unit.csn, tso: unit.tso, cso: unit.cso };
    fittedOn.get(aircraftId)!.set(positionId, unit);
  }

  // Initial fit: every position of every aircraft, a few left empty on the two youngest airframes.
  for (const aircraft of DEMO_AIRCRAFT) {
    const layout = layouts.get(aircraft.typeId)!;
    for (const position of layout) {
      if (aircraft.id === 4 && position.code === "WXR") continue; // removed before the records start, awaiting a spare
      if (aircraft.id === 8 && position.code.startsWith("DEICE-V-4")) continue;
      const pnKey = position.eligible.length > 1 && random() < 0.25 ? position.eligible[1] : position.eligible[0];
      const unit = newUnit(pnKey, start - (20 + Math.floor(random() * 10)) * DAY_MS, 1 + random() * 6);
      const atMs = start + (aircraft.id * 7 + Math.floor(random() * 50)) * 60_000;
      const positionId = positionIds.get(`${aircraft.typeId}:${position.code}`)!;
      const totals = host.get(aircraft.id)!;
      events.push({
        type: "taken_over",
        at: atMs,
        entry: entry("installed", unit, atMs, {
          aircraftId: aircraft.id,
          positionId,
          aircraftMinutes: totals.minutes,
          aircraftCycles: totals.cycles,
          workOrder: "WO-INIT-2412",
          taskReference: "Records take-over of fitted components",
        }),
      });
      fit(unit, aircraft.id, positionId);
    }
  }
  // Stores spares: a few of each part number, and a deep shelf of the brake actuators that come off most.
  const SPARES: Record<string, number> = { brakeActuator: 40, brakeActuatorB: 25 };
  for (const pn of DEMO_PART_NUMBERS) for (let i = 0; i < (SPARES[pn.key] ?? 4); i++) newUnit(pn.key, start - 10 * DAY_MS, random() < 0.3 ? 0 : 2 + random() * 3);

  function accrue(unit: Unit) {
    const at = unit.at!;
    const totals = host.get(at.aircraftId)!;
    const dm = totals.minutes - at.hostMinutes;
    const dc = totals.cycles - at.hostCycles;
    unit.tsn = at.tsn + dm;
    unit.csn = at.csn + dc;
    unit.tso = at.tso === null ? null : at.tso + dm;
    unit.cso = at.cso === null ? null : at.cso + dc;
  }

  const lifeHoursLeft = (unit: Unit) => (unit.pn.lifeHours ? unit.pn.lifeHours * 60 - unit.tsn : Infinity);
  const lifeCyclesLeft = (unit: Unit) => (unit.pn.lifeCycles ? unit.pn.lifeCycles - unit.csn : Infinity);
  const lifeDaysLeft = (unit: Unit, atMs: number) => (unit.pn.lifeDays ? unit.pn.lifeDays - (atMs - Date.parse(unit.manufacturedOn)) / DAY_MS : Infinity);
  const fitToInstall = (unit: Unit, atMs: number) =>
    lifeDaysLeft(unit, atMs) > SPARE_MARGIN.days && lifeHoursLeft(unit) > SPARE_MARGIN.minutes && lifeCyclesLeft(unit) > SPARE_MARGIN.cycles;

  const days = Math.round((DEMO_NOW.getTime() - start) / DAY_MS);
  // Stock movements decided earlier, by day; each runs at the start of its day.
  const pending = new Map<number, Array<() => void>>();
  const later = (day: number, run: () => void) => {
    if (!pending.has(day)) pending.set(day, []);
    pending.get(day)!.push(run);
  };
  for (let day = 0; day < days; day++) {
    const dayStart = start + day * DAY_MS;
    for (const run of pending.get(day) ?? []) run();
    pending.delete(day);

    for (const aircraft of DEMO_AIRCRAFT) {
      const turbofan = aircraft.typeId === 1;
      const grounded = random() < 0.06; // checks, spares, weather
      const hours = grounded ? 0 : turbofan ? 7.5 + random() * 3 : 5.5 + random() * 2.5;
      const minutes = Math.round(hours * 60);
      const cycles = grounded ? 0 : turbofan ? Math.max(1, Math.round(hours / 2.1)) : Math.max(2, Math.round(hours / 0.9));
      const fitted = fittedOn.get(aircraft.id)!;

      // Morning: removals decided from yesterday's snapshot, swaps before the first flight.
      for (const [positionId, unit] of [...fitted.entries()]) {
        const pnKey = unit.pn.key;
        accrue(unit);
        let removalType: RemovalType | null = null;
        let reason = "";
        const wear = WEAR_CYCLES[pnKey];
        const sinceInstall = host.get(aircraft.id)!.cycles - unit.at!.hostCycles;
        const overhaulDue = (unit.pn.overhaulHours && unit.tso !== null && unit.tso >= unit.pn.overhaulHours * 60) || (unit.pn.overhaulCycles && unit.cso !== null && unit.cso >= unit.pn.overhaulCycles);
        if (wear && sinceInstall >= wear * (0.85 + random() * 0.3)) {
          removalType = "scheduled";
          reason = pnKey.includes("rake") ? "Brake wear pin at limit" : "Tyre worn to limit";
        } else if (overhaulDue) {
          removalType = "scheduled";
          reason = "Overhaul interval reached";
        } else if (lifeCyclesLeft(unit) < 40 || lifeHoursLeft(unit) < 50 * 60 || lifeDaysLeft(unit, dayStart) < 21) {
          removalType = "scheduled";
          reason = "Life limit approaching";
        } else {
          let mtbur = MTBUR_HOURS[pnKey] ?? DEFAULT_MTBUR_HOURS;
          // A bad batch of actuator seals in the last three months at South Harbour: the demo's alert.
          if (pnKey === "brakeActuator" && aircraft.stationId === 2 && dayStart >= Date.parse("2026-09-01")) mtbur /= 7;
          const yesterdayHours = turbofan ? 9 : 6.5;
          if (random() < yesterdayHours / mtbur) {
            removalType = "unscheduled";
            reason = pick(random, UNSCHEDULED_REASONS[pnKey] ?? UNSCHEDULED_REASONS.default);
          }
        }
        if (!removalType) continue;

        const position = positionById.get(positionId)!;
        const swapMs = dayStart + (5 * 60 + Math.floor(random() * 90)) * 60_000;
        const performedMs = swapMs + 35 * 60_000;
        // The spare: a serviceable unit of an eligible part number with life left, else a new receipt.
        let spare = units.find((u) => u.status === "serviceable" && position.eligible.includes(u.pn.key) && fitToInstall(u, performedMs));
        if (!spare) spare = newUnit(position.eligible[position.eligible.length - 1], swapMs - 3 * HOUR_MS, 0);
        const totals = host.get(aircraft.id)!;
        const number = ++swapCount;
        events.push({
          type: "swap",
          at: performedMs,
          swap: {
            number,
            aircraftId: aircraft.id,
            positionId,
            registration: aircraft.registration,
            positionCode: position.code,
            hostMinutes: totals.minutes,
            hostCycles: totals.cycles,
            removed: { partId: unit.id, partNumber: unit.pn.partNumber, serialNumber: unit.serial, tsnMinutes: unit.tsn, csn: unit.csn },
            installed: { partId: spare.id, partNumber: spare.pn.partNumber, serialNumber: spare.serial },
            removalType,
            reason,
            workOrder: `WO-${26000 + number - 1}`,
            taskReference: "AMM task per the position's maintenance manual reference",
            testResult: "Operational test from the maintenance computer: passed",
            requiresInspection: position.independentInspection,
          },
        });
        fitted.delete(positionId);
        unit.at = undefined;
        unit.status = "unserviceable";
        unit.removedUnscheduled = removalType === "unscheduled";
        fit(spare, aircraft.id, positionId);

        // The removed unit goes back to stores, to a shop, and (mostly) comes back serviceable.
        const removedUnit = unit;
        const back = day + 1;
        later(Math.min(back, days - 1), () => {
          events.push({ type: "stock", at: start + back * DAY_MS + 9 * HOUR_MS, entry: entry("returned", removedUnit, start + back * DAY_MS + 9 * HOUR_MS), state: { status: "unserviceable", bin: "QUAR-US" }, removal: number });
        });
        const sendDay = day + 3;
        const shop = pick(random, SHOPS);
        later(sendDay, () => {
          const at = start + sendDay * DAY_MS + 10 * HOUR_MS;
          events.push({
            type: "stock",
            at,
            entry: entry("sent_for_repair", removedUnit, at, {
              reason: removedUnit.removedUnscheduled ? "Repair and test after unscheduled removal" : reason,
              details: { shop: shop.name, shopApproval: shop.approval },
            }),
            state: { status: "in_repair", bin: null },
            removal: number,
          });
          removedUnit.status = "in_repair";
        });
        const backDay = sendDay + 20 + Math.floor(random() * 25);
        const roll = random();
        later(backDay, () => {
          const overhaul = reason === "Overhaul interval reached" || roll < 0.15;
          const finding = !removedUnit.removedUnscheduled ? (overhaul ? "modification" : "damage") : roll < 0.62 ? "confirmed_failure" : roll < 0.9 ? "no_fault_found" : "damage";
          if (overhaul && removedUnit.tso !== null) {
            removedUnit.tso = 0;
            removedUnit.cso = 0;
          }
          removedUnit.status = "serviceable";
          const bin = `S2-R${1 + Math.floor(random() * 9)}`;
          const statusWork = overhaul ? "overhauled" : finding === "no_fault_found" ? "inspected_tested" : "repaired";
          // Booked in early in the morning, before that day's swaps may take the unit as a spare.
          const at = start + backDay * DAY_MS + 3 * HOUR_MS;
          events.push({
            type: "stock",
            at,
            entry: entry("repaired", removedUnit, at, { details: { shop: shop.name, shopApproval: shop.approval, shopFinding: finding, statusWork, bin } }),
            state: { status: "serviceable", bin, ...(overhaul && removedUnit.tso !== null ? { overhauled: true as const } : {}) },
            removal: number,
            certificate: { issuerName: shop.name, issuerApproval: shop.approval, statusWork },
          });
        });
      }

      const totals = host.get(aircraft.id)!;
      totals.minutes += minutes;
      totals.cycles += cycles;
      events.push({ type: "utilisation", at: dayStart + DAY_MS - 60_000, aircraftId: aircraft.id, minutes: totals.minutes, cycles: totals.cycles });
    }
  }

  // Time order; events at the same instant stay in the order they were decided.
  const order = new Map(events.map((e, i) => [e, i]));
  events.sort((a, b) => a.at - b.at || order.get(a)! - order.get(b)!);
  return { events };
}
