// Simulates two years of the invented fleet: daily utilisation, units fitted at every position,
// unscheduled and scheduled removals, swaps from stores spares, repairs and re-use on other airframes.
// Everything follows from one seed, so every run writes the same history.
import type { LedgerEntryFields, LedgerKind, RemovalType } from "../../src/domain/ledger-types";
import { DEMO_PART_NUMBERS, type DemoPartNumber } from "./catalog-data";
import { DEMO_AIRCRAFT, DEMO_NOW, HISTORY_START } from "./demo";
import { buildLayout, DEMO_TYPES } from "./layout-data";
import { pick, seededRandom } from "./random";

const DAY_MS = 86_400_000;

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

const UNSCHEDULED_REASONS: Record<string, string[]> = {
  brakeActuator: ["BRAKE ACTUATOR FAULT message on the maintenance computer", "Actuator failed the running-clearance test", "Intermittent position feedback from the actuator"],
  default: ["Failed built-in test", "Intermittent fault reported by the crew", "Fault message on the maintenance computer", "Leak found on the daily check", "Erratic indication"],
};
const SHOPS = [
  { name: "Quillfeather Component Shop", approval: "QA.145.0012" },
  { name: "Harbourline Repair Services", approval: "QA.145.0047" },
];

export interface SimulatedHistory {
  parts: Array<{ id: number; partNumberId: number; serialNumber: string; status: string; bin: string | null; manufacturedOn: string; tsnMinutes: number; csn: number; tsoMinutes: number | null; cso: number | null }>;
  entries: LedgerEntryFields[];
  fitted: Array<{ aircraftId: number; positionId: number; partId: number; installedSeq: number; installedAt: string; hostMinutes: number; hostCycles: number; tsnMinutes: number; csn: number; tsoMinutes: number | null; cso: number | null }>;
  swaps: Array<{ id: string; aircraftId: number; positionId: number; removedSeq: number | null; installedSeq: number | null; performedAt: string; inspected: boolean }>;
  utilization: Array<{ aircraftId: number; asOf: string; minutes: number; cycles: number }>;
}

interface Unit {
  id: number;
  pn: DemoPartNumber;
  pnId: number;
  serial: string;
  status: "serviceable" | "installed" | "unserviceable" | "in_repair" | "quarantined" | "scrapped";
  bin: string | null;
  manufacturedOn: string;
  tsn: number; // minutes
  csn: number;
  tso: number | null;
  cso: number | null;
  // while fitted
  at?: { aircraftId: number; positionId: number; seq: number; installedAt: string; hostMinutes: number; hostCycles: number; tsn: number; csn: number; tso: number | null; cso: number | null };
  dueForRepairBack?: number; // day index
  removedSeq?: number;
  removedUnscheduled?: boolean;
}

export function simulateHistory(userIds: { technician: string; inspector: string; stores: string }): SimulatedHistory {
  const random = seededRandom(20261201);
  const entries: LedgerEntryFields[] = [];
  const swaps: SimulatedHistory["swaps"] = [];
  const utilization: SimulatedHistory["utilization"] = [];
  const units: Unit[] = [];
  const serialCounters = new Map<string, number>();
  const pnIdOf = new Map(DEMO_PART_NUMBERS.map((p, i) => [p.key, i + 1]));

  const iso = (ms: number) => new Date(ms).toISOString();
  const append = (kind: LedgerKind, unit: Unit, atMs: number, fields: Partial<LedgerEntryFields> = {}): number => {
    const seq = entries.length + 1;
    entries.push({
      seq,
      kind,
      partId: unit.id,
      aircraftId: null,
      positionId: null,
      occurredAt: iso(atMs),
      recordedAt: iso(atMs + 20 * 60_000),
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
    return seq;
  };

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
      bin: `S${1 + Math.floor(random() * 3)}-${String.fromCharCode(65 + Math.floor(random() * 6))}${1 + Math.floor(random() * 9)}`,
      manufacturedOn: new Date(receivedMs - Math.floor(ageYears * 365 + 30) * DAY_MS).toISOString().slice(0, 10),
      tsn: tsnHours * 60,
      csn: cyclesSoFar,
      tso: overhauled ? Math.floor(tsnHours * 0.3) * 60 : null,
      cso: overhauled ? Math.floor(cyclesSoFar * 0.3) : null,
    };
    units.push(unit);
    append("received", unit, receivedMs, {
      details: { bin: unit.bin!, statusWork: overhauled ? "overhauled" : ageYears === 0 ? "new" : "inspected_tested" },
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

  const host = new Map<number, { minutes: number; cycles: number }>(DEMO_AIRCRAFT.map((a) => [a.id, { minutes: a.startHours * 60, cycles: a.startCycles }]));
  const fittedAt = new Map<string, Unit>(); // `${aircraftId}:${positionId}` -> unit
  const start = HISTORY_START.getTime();

  // Initial fit: every position of every aircraft, a few left empty on the two youngest airframes.
  for (const aircraft of DEMO_AIRCRAFT) {
    const layout = layouts.get(aircraft.typeId)!;
    for (const position of layout) {
      if (aircraft.id === 4 && position.code === "WXR") continue; // removed before the records start, awaiting a spare
      if (aircraft.id === 8 && position.code.startsWith("DEICE-V-4")) continue;
      const pnKey = position.eligible.length > 1 && random() < 0.25 ? position.eligible[1] : position.eligible[0];
      const unit = newUnit(pnKey, start - (20 + Math.floor(random() * 10)) * DAY_MS, 1 + random() * 6);
      install(unit, aircraft.id, positionIds.get(`${aircraft.typeId}:${position.code}`)!, start + (aircraft.id * 7 + Math.floor(random() * 50)) * 60_000, null);
    }
  }
  // Stores spares: a few of each part number, and a deep shelf of the brake actuators that come off most.
  const SPARES: Record<string, number> = { brakeActuator: 40, brakeActuatorB: 25 };
  for (const pn of DEMO_PART_NUMBERS) for (let i = 0; i < (SPARES[pn.key] ?? 4); i++) newUnit(pn.key, start - 10 * DAY_MS, random() < 0.3 ? 0 : 2 + random() * 3);

  function install(unit: Unit, aircraftId: number, positionId: number, atMs: number, swapId: string | null): number {
    const totals = host.get(aircraftId)!;
    const seq = append("installed", unit, atMs, {
      aircraftId,
      positionId,
      aircraftMinutes: totals.minutes,
      aircraftCycles: totals.cycles,
      workOrder: swapId ? `WO-${26000 + swaps.length}` : "WO-INIT-2412",
      taskReference: swapId ? "AMM task per the position's maintenance manual reference" : "Records take-over of fitted components",
      testResult: swapId ? "Operational test from the maintenance computer: passed" : null,
    });
    unit.status = "installed";
    unit.bin = null;
    unit.at = { aircraftId, positionId, seq, installedAt: iso(atMs), hostMinutes: totals.minutes, hostCycles: totals.cycles, tsn: unit.tsn, csn: unit.csn, tso: unit.tso, cso: unit.cso };
    fittedAt.set(`${aircraftId}:${positionId}`, unit);
    return seq;
  }

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

  function remove(unit: Unit, atMs: number, removalType: RemovalType, reason: string): number {
    const at = unit.at!;
    accrue(unit);
    const totals = host.get(at.aircraftId)!;
    const seq = append("removed", unit, atMs, {
      aircraftId: at.aircraftId,
      positionId: at.positionId,
      aircraftMinutes: totals.minutes,
      aircraftCycles: totals.cycles,
      removalType,
      reason,
      workOrder: `WO-${26000 + swaps.length}`,
      taskReference: "AMM task per the position's maintenance manual reference",
    });
    fittedAt.delete(`${at.aircraftId}:${at.positionId}`);
    unit.at = undefined;
    unit.status = "unserviceable";
    unit.removedSeq = seq;
    unit.removedUnscheduled = removalType === "unscheduled";
    return seq;
  }

  const lifeHoursLeft = (unit: Unit) => (unit.pn.lifeHours ? unit.pn.lifeHours * 60 - unit.tsn : Infinity);
  const lifeDaysLeft = (unit: Unit, atMs: number) => (unit.pn.lifeDays ? unit.pn.lifeDays - (atMs - Date.parse(unit.manufacturedOn)) / DAY_MS : Infinity);

  const days = Math.round((DEMO_NOW.getTime() - start) / DAY_MS);
  const pending: Array<{ day: number; run: () => void }> = [];
  for (let day = 0; day < days; day++) {
    const dayStart = start + day * DAY_MS;
    for (const item of pending.filter((p) => p.day === day)) item.run();

    for (const aircraft of DEMO_AIRCRAFT) {
      const turbofan = aircraft.typeId === 1;
      const grounded = random() < 0.06; // checks, spares, weather
      const hours = grounded ? 0 : turbofan ? 7.5 + random() * 3 : 5.5 + random() * 2.5;
      const minutes = Math.round(hours * 60);
      const cycles = grounded ? 0 : turbofan ? Math.max(1, Math.round(hours / 2.1)) : Math.max(2, Math.round(hours / 0.9));

      // Morning: removals decided from yesterday's snapshot, swaps before the first flight.
      for (const [key, unit] of [...fittedAt.entries()].filter(([k]) => k.startsWith(`${aircraft.id}:`))) {
        const pnKey = unit.pn.key;
        accrue(unit);
        const positionId = Number(key.split(":")[1]);
        let removalType: RemovalType | null = null;
        let reason = "";
        const wear = WEAR_CYCLES[pnKey];
        const sinceInstall = host.get(aircraft.id)!.cycles - unit.at!.hostCycles;
        const lifeCyclesLeft = unit.pn.lifeCycles ? unit.pn.lifeCycles - unit.csn : Infinity;
        const overhaulDue = (unit.pn.overhaulHours && unit.tso !== null && unit.tso >= unit.pn.overhaulHours * 60) || (unit.pn.overhaulCycles && unit.cso !== null && unit.cso >= unit.pn.overhaulCycles);
        if (wear && sinceInstall >= wear * (0.85 + random() * 0.3)) {
          removalType = "scheduled";
          reason = pnKey.includes("rake") ? "Brake wear pin at limit" : "Tyre worn to limit";
        } else if (overhaulDue) {
          removalType = "scheduled";
          reason = "Overhaul interval reached";
        } else if (lifeCyclesLeft < 40 || lifeHoursLeft(unit) < 50 * 60 || lifeDaysLeft(unit, dayStart) < 21) {
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

        const layout = layouts.get(aircraft.typeId)!;
        const position = layout.find((p) => positionIds.get(`${aircraft.typeId}:${p.code}`) === positionId)!;
        const swapMs = dayStart + (5 * 60 + Math.floor(random() * 90)) * 60_000;
        const swapId = `00000000-0000-4000-8000-${String(swaps.length + 1).padStart(12, "0")}`;
        const removedSeq = remove(unit, swapMs, removalType, reason);
        // The spare: a serviceable unit of an eligible part number, else a new receipt.
        let spare = units.find((u) => u.status === "serviceable" && position.eligible.includes(u.pn.key));
        if (!spare) spare = newUnit(position.eligible[position.eligible.length - 1], swapMs - 3 * 3_600_000, 0);
        const installedSeq = install(spare, aircraft.id, positionId, swapMs + 35 * 60_000, swapId);
        swaps.push({ id: swapId, aircraftId: aircraft.id, positionId, removedSeq, installedSeq, performedAt: iso(swapMs + 35 * 60_000), inspected: position.independentInspection });

        // The removed unit goes back to stores, to a shop, and (mostly) comes back serviceable.
        const removedUnit = unit;
        const back = day + 1;
        pending.push({
          day: Math.min(back, days - 1),
          run: () => {
            append("returned", removedUnit, start + back * DAY_MS + 9 * 3_600_000, { details: { tag: `U/S tag ${removedSeq}`, bin: "QUAR-US" } });
            removedUnit.bin = "QUAR-US";
          },
        });
        const sendDay = day + 3;
        const shop = pick(random, SHOPS);
        pending.push({
          day: sendDay,
          run: () => {
            append("sent_for_repair", removedUnit, start + sendDay * DAY_MS + 10 * 3_600_000, {
              reason: removedUnit.removedUnscheduled ? "Repair and test after unscheduled removal" : reason,
              details: { shop: shop.name, shopApproval: shop.approval, repairOrder: `RO-${40000 + removedSeq}` },
            });
            removedUnit.status = "in_repair";
            removedUnit.bin = null;
          },
        });
        const backDay = sendDay + 20 + Math.floor(random() * 25);
        const roll = random();
        pending.push({
          day: backDay,
          run: () => {
            const overhaul = reason === "Overhaul interval reached" || roll < 0.15;
            const finding = !removedUnit.removedUnscheduled ? (overhaul ? "modification" : "damage") : roll < 0.62 ? "confirmed_failure" : roll < 0.9 ? "no_fault_found" : "damage";
            if (overhaul && removedUnit.tso !== null) {
              removedUnit.tso = 0;
              removedUnit.cso = 0;
            }
            removedUnit.status = "serviceable";
            removedUnit.bin = `S2-R${1 + Math.floor(random() * 9)}`;
            append("repaired", removedUnit, start + backDay * DAY_MS + 14 * 3_600_000, {
              details: {
                shop: shop.name,
                shopApproval: shop.approval,
                shopFinding: finding,
                removalSeq: String(removedSeq),
                statusWork: overhaul ? "overhauled" : finding === "no_fault_found" ? "inspected_tested" : "repaired",
                bin: removedUnit.bin,
              },
            });
          },
        });
      }

      const totals = host.get(aircraft.id)!;
      totals.minutes += minutes;
      totals.cycles += cycles;
      utilization.push({ aircraftId: aircraft.id, asOf: iso(dayStart + DAY_MS - 60_000), minutes: totals.minutes, cycles: totals.cycles });
    }
  }

  for (const unit of fittedAt.values()) accrue(unit);
  entries.sort((a, b) => a.occurredAt.localeCompare(b.occurredAt) || a.seq - b.seq);
  // Renumber after sorting so seq follows time; references to seq are remapped.
  const renumber = new Map(entries.map((e, i) => [e.seq, i + 1]));
  entries.forEach((e) => {
    e.seq = renumber.get(e.seq)!;
    if (e.details?.removalSeq) e.details.removalSeq = String(renumber.get(Number(e.details.removalSeq)));
    if (e.details?.tag) e.details.tag = e.details.tag.replace(/\d+$/, (m) => String(renumber.get(Number(m))));
  });
  entries.sort((a, b) => a.seq - b.seq);

  return {
    parts: units.map((u) => ({ id: u.id, partNumberId: u.pnId, serialNumber: u.serial, status: u.status, bin: u.bin, manufacturedOn: u.manufacturedOn, tsnMinutes: u.tsn, csn: u.csn, tsoMinutes: u.tso, cso: u.cso })),
    entries,
    fitted: [...fittedAt.values()].map((u) => ({ aircraftId: u.at!.aircraftId, positionId: u.at!.positionId, partId: u.id, installedSeq: renumber.get(u.at!.seq)!, installedAt: u.at!.installedAt, hostMinutes: u.at!.hostMinutes, hostCycles: u.at!.hostCycles, tsnMinutes: u.at!.tsn, csn: u.at!.csn, tsoMinutes: u.at!.tso, cso: u.at!.cso })),
    swaps: swaps.map((s) => ({ ...s, removedSeq: s.removedSeq === null ? null : renumber.get(s.removedSeq)!, installedSeq: s.installedSeq === null ? null : renumber.get(s.installedSeq)! })),
    utilization,
  };
}
