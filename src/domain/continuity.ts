// Continuity findings on one serial's thread: its ledger entries in seq order, replayed to
// catch what a back-to-birth history must not contain (gaps, overlaps, time going
// backwards, installs without a certificate, of an unserviceable unit, at an ineligible
// position, or past a life limit). Each finding names the entries it rests on.
//
// Rules chosen here, in one place:
// - Corrections. A `corrected` entry restates the whole entry it corrects (every value field
//   below), so findings are computed on the corrected view: the original seq keeps its place
//   in the thread, with the correction's values. A correction of a correction applies to the
//   original. Findings resting on a corrected entry say so and list the correction's seq.
// - Status replay: received, released, returned and repaired make the unit serviceable;
//   installed makes it installed; removed makes it unserviceable (installed, if it is still
//   fitted on another aircraft); sent_for_repair -> in_repair; quarantined -> quarantined;
//   scrapped -> scrapped; issued leaves the status as it is. Before the first entry the
//   status is unknown and not judged.
// - Certificates. An installation needs a release certificate filed at or after the unit's
//   latest receipt or shop-visit return (received / repaired entry) and before the
//   installation. A received or repaired entry with a documentId files one; so does a row
//   of `certificates` at its receivedSeq (without one, at the unit's first receipt).
// - Life. Installing a unit with no life left (used >= limit) is life_exceeded; so is flying
//   it past the limit while fitted (used > limit at a later entry, usually the removal).
// - A lower TSN/CSN than already seen is a time_regression even across a shop visit; a
//   higher one while off wing, with no shop visit (repaired entry) since it was last known,
//   is a gap. So is a TSN at removal that differs from the carry-over of the installation's.

import { DomainInputError } from "./errors";
import { formatFlightTime } from "./flight-time";
import { ageInDays, limitState, type LifeLimits } from "./life";
import type { LedgerEntryFields, LedgerKind, PartStatus } from "./ledger-types";

export interface ThreadEntry extends LedgerEntryFields {
  /** The part number the unit carried at this entry, when it differs from the current one. */
  partNumberAtEntry?: string | null;
}

export interface ThreadPart {
  id: number;
  partNumberId: number;
  partNumber: string;
  serialNumber: string;
  limits: LifeLimits;
  /** Start of calendar life (manufacture, or first receipt); YYYY-MM-DD or an instant. */
  manufacturedOn?: string | null;
}

/** A release certificate on file for the unit; receivedSeq is the entry it came with. */
export interface CertificateOnFile {
  documentId: number;
  partId: number;
  receivedSeq?: number | null;
}

/** One row of position eligibility: the part number may be fitted at that position of that type. */
export interface EligibilityRow {
  partNumber: string;
  aircraftTypeId: number;
  positionId: number;
}

export interface AircraftFact {
  id: number;
  typeId: number;
  registration?: string;
}

export interface PositionFact {
  id: number;
  code: string;
}

/** Everything the check needs, in the shape of database rows, so tests build it by hand. */
export interface ThreadFacts {
  part: ThreadPart;
  entries: readonly ThreadEntry[];
  certificates?: readonly CertificateOnFile[];
  eligibility: readonly EligibilityRow[];
  aircraft: readonly AircraftFact[];
  /** Only for naming positions in messages. */
  positions?: readonly PositionFact[];
}

export const FINDING_KINDS = [
  "gap",
  "overlap",
  "time_regression",
  "no_certificate",
  "not_serviceable_at_install",
  "not_eligible",
  "life_exceeded",
] as const;
export type FindingKind = (typeof FINDING_KINDS)[number];

export interface Finding {
  kind: FindingKind;
  /** The entry the finding rests on. */
  seq: number;
  /** Other entries it rests on (the earlier entry compared with, and any corrections). */
  relatedSeqs: number[];
  message: string;
}

// ---------------------------------------------------------------------------------------
// Corrected view

/** Fields a correction restates; seq, kind, partId, recordedAt/By stay the original's. */
const RESTATED_FIELDS = [
  "aircraftId", "positionId", "occurredAt", "aircraftMinutes", "aircraftCycles", "tsnMinutes", "csn",
  "tsoMinutes", "cso", "removalType", "reason", "workOrder", "taskReference", "testResult", "documentId", "details",
] as const satisfies ReadonlyArray<keyof LedgerEntryFields>;

export interface ViewEntry extends ThreadEntry {
  /** Seqs of the corrections applied to this entry, oldest first. */
  correctedBy: number[];
}

/** The thread with corrections applied in place and the corrected entries themselves left out. */
export function correctedView(entries: readonly ThreadEntry[]): ViewEntry[] {
  const view: ViewEntry[] = [];
  const bySeq = new Map<number, ViewEntry>();
  const rootOf = new Map<number, number>(); // correction seq -> seq of the entry it finally corrects
  let lastSeq = -Infinity;
  for (const entry of entries) {
    if (!(entry.seq > lastSeq)) throw new DomainInputError(`Thread entries must be in rising seq order; seq ${entry.seq} follows ${lastSeq}.`, "entries");
    lastSeq = entry.seq;
    if (entry.kind !== "corrected") {
      const copy: ViewEntry = { ...entry, correctedBy: [] };
      view.push(copy);
      bySeq.set(entry.seq, copy);
      continue;
    }
    const named = entry.correctsSeq;
    const rootSeq = named === null ? undefined : (rootOf.get(named) ?? (bySeq.has(named) ? named : undefined));
    const target = rootSeq === undefined ? undefined : bySeq.get(rootSeq);
    if (!target || rootSeq === undefined) {
      throw new DomainInputError(`Correction at seq ${entry.seq} names seq ${named}, which is not earlier in this thread.`, "entries");
    }
    rootOf.set(entry.seq, rootSeq);
    const restated = target as unknown as Record<string, unknown>;
    for (const field of RESTATED_FIELDS) restated[field] = entry[field];
    if (entry.partNumberAtEntry !== undefined) target.partNumberAtEntry = entry.partNumberAtEntry;
    target.correctedBy.push(entry.seq);
  }
  return view;
}

// ---------------------------------------------------------------------------------------
// Status replay

const MAKES_SERVICEABLE: ReadonlySet<LedgerKind> = new Set(["received", "released", "returned", "repaired"]);
const NOT_INSTALLABLE: ReadonlySet<PartStatus> = new Set(["unserviceable", "in_repair", "quarantined", "scrapped"]);

/** Status after an entry of `kind`; null = unknown (before the thread's first telling entry). */
export function nextStatus(current: PartStatus | null, kind: LedgerKind, stillFittedElsewhere = false): PartStatus | null {
  if (MAKES_SERVICEABLE.has(kind)) return "serviceable";
  switch (kind) {
    case "installed": return "installed";
    case "removed": return stillFittedElsewhere ? "installed" : "unserviceable";
    case "sent_for_repair": return "in_repair";
    case "quarantined": return "quarantined";
    case "scrapped": return "scrapped";
    default: return current; // issued, corrected
  }
}

// ---------------------------------------------------------------------------------------
// Counters: TSN, CSN, TSO, CSO tracked the same way

interface CounterSpec {
  label: "TSN" | "CSN" | "TSO" | "CSO";
  field: "tsnMinutes" | "csn" | "tsoMinutes" | "cso";
  host: "aircraftMinutes" | "aircraftCycles";
  /** TSO/CSO restart at a shop visit; TSN/CSN never go back. */
  resetsAtShopVisit: boolean;
  show: (value: number) => string;
}

const COUNTERS: readonly CounterSpec[] = [
  { label: "TSN", field: "tsnMinutes", host: "aircraftMinutes", resetsAtShopVisit: false, show: formatFlightTime },
  { label: "CSN", field: "csn", host: "aircraftCycles", resetsAtShopVisit: false, show: String },
  { label: "TSO", field: "tsoMinutes", host: "aircraftMinutes", resetsAtShopVisit: true, show: formatFlightTime },
  { label: "CSO", field: "cso", host: "aircraftCycles", resetsAtShopVisit: true, show: String },
];

interface Mark { value: number; at: ViewEntry }

interface CounterState {
  /** Highest value seen (recorded or carried over): nothing later may be lower. */
  floor: Mark | null;
  /** The value as last known, or null once time accrued unrecorded. */
  known: Mark | null;
  shopVisitSinceKnown: boolean;
}

/** One fitted period: the installation and the unit's counters at it. */
interface Placement {
  install: ViewEntry;
  atInstall: Array<number | null>; // by COUNTERS index
  lifeFlagged: Set<string>;
}

// ---------------------------------------------------------------------------------------
// The check

export function findContinuityIssues(facts: ThreadFacts): Finding[] {
  return new ThreadCheck(facts).run();
}

class ThreadCheck {
  private readonly findings: Finding[] = [];
  private readonly typeOf = new Map<number, number>();
  private readonly registration = new Map<number, string>();
  private readonly positionCode = new Map<number, string>();
  private readonly eligible = new Set<string>();
  private readonly view: ViewEntry[];
  private readonly certificateSeqs: number[] = [];

  private status: PartStatus | null = null;
  private statusSince: ViewEntry | null = null;
  private readonly placements = new Map<number, Placement>();
  private readonly counters: CounterState[] = COUNTERS.map(() => ({ floor: null, known: null, shopVisitSinceKnown: false }));
  private readonly aircraftFloor = new Map<string, Mark>(); // `${aircraftId}:${host field}`
  private periodStart: ViewEntry | null = null; // latest received / repaired entry

  constructor(private readonly facts: ThreadFacts) {
    for (const a of facts.aircraft) {
      this.typeOf.set(a.id, a.typeId);
      if (a.registration) this.registration.set(a.id, a.registration);
    }
    for (const p of facts.positions ?? []) this.positionCode.set(p.id, p.code);
    for (const row of facts.eligibility) this.eligible.add(eligibilityKey(row.partNumber, row.aircraftTypeId, row.positionId));
    for (const e of facts.entries) {
      if (e.partId !== facts.part.id) throw new DomainInputError(`Entry seq ${e.seq} is for part ${e.partId}, not ${facts.part.id}.`, "entries");
    }
    this.view = correctedView(facts.entries);
    const firstReceipt = this.view.find((e) => e.kind === "received")?.seq ?? -Infinity;
    for (const e of this.view) if ((e.kind === "received" || e.kind === "repaired") && e.documentId !== null) this.certificateSeqs.push(e.seq);
    for (const c of facts.certificates ?? []) {
      if (c.partId !== facts.part.id) throw new DomainInputError(`Certificate ${c.documentId} is for part ${c.partId}, not ${facts.part.id}.`, "certificates");
      this.certificateSeqs.push(c.receivedSeq ?? firstReceipt);
    }
  }

  run(): Finding[] {
    for (const entry of this.view) this.visit(entry);
    return mergeAndSort(this.findings);
  }

  private visit(e: ViewEntry): void {
    this.checkAircraftTotals(e);
    const placement = e.aircraftId === null ? undefined : this.placements.get(e.aircraftId);
    if (e.kind === "installed") this.visitInstall(e);
    else if (placement) this.visitWhileFitted(e, placement);
    else {
      if (e.kind === "removed") {
        this.add("gap", e, [], `Removed from ${this.aircraftName(e.aircraftId)} at seq ${e.seq} with no installation on record in this thread.`);
      }
      this.updateCounters(e, null, this.placements.size === 0);
    }
    if (e.kind === "removed" && e.aircraftId !== null) this.placements.delete(e.aircraftId);
    if (e.kind === "received" || e.kind === "repaired") this.periodStart = e;
    const next = nextStatus(this.status, e.kind, this.placements.size > 0);
    if (next !== this.status) this.statusSince = e;
    this.status = next;
  }

  private visitInstall(e: ViewEntry): void {
    const where = `Installed on ${this.aircraftName(e.aircraftId)} at seq ${e.seq}`;
    for (const [aircraftId, other] of this.placements) {
      const sameAircraft = aircraftId === e.aircraftId;
      this.add("overlap", e, [other.install],
        `${where} while still fitted on ${this.aircraftName(aircraftId)}${sameAircraft ? ` at ${this.positionName(other.install.positionId)}` : ""} since seq ${other.install.seq}, with no removal in between.`);
    }
    if (this.status !== null && NOT_INSTALLABLE.has(this.status)) {
      this.add("not_serviceable_at_install", e, this.statusSince ? [this.statusSince] : [],
        `${where} while ${this.status.replace(/_/g, " ")}${this.statusSince ? ` (since seq ${this.statusSince.seq})` : ""}.`);
    }
    if (!this.certificateSeqs.some((p) => p >= (this.periodStart?.seq ?? -Infinity) && p < e.seq)) {
      const since = this.periodStart ? ` since the ${this.periodStart.kind === "repaired" ? "shop visit" : "receipt"} at seq ${this.periodStart.seq}` : "";
      this.add("no_certificate", e, this.periodStart ? [this.periodStart] : [], `${where} with no release certificate on file${since}.`);
    }
    this.checkEligibility(e, where);

    const fittedElsewhere = this.placements.size > 0;
    const atInstall = this.updateCounters(e, null, !fittedElsewhere);
    if (e.aircraftId === null) return;
    const placement: Placement = { install: e, atInstall, lifeFlagged: new Set() };
    this.placements.set(e.aircraftId, placement);
    this.checkLife(e, placement, atInstall, true);
  }

  private visitWhileFitted(e: ViewEntry, placement: Placement): void {
    const values = this.updateCounters(e, placement);
    this.checkLife(e, placement, values, false);
  }

  private checkEligibility(e: ViewEntry, where: string): void {
    const partNumber = e.partNumberAtEntry ?? this.facts.part.partNumber;
    if (e.aircraftId === null || e.positionId === null) {
      this.add("not_eligible", e, [], `${where} with no ${e.aircraftId === null ? "aircraft" : "position"} recorded, so eligibility of P/N ${partNumber} cannot be shown.`);
      return;
    }
    const typeId = this.typeOf.get(e.aircraftId);
    if (typeId === undefined) throw new DomainInputError(`Aircraft ${e.aircraftId} (seq ${e.seq}) is missing from the aircraft facts.`, "aircraft");
    if (!this.eligible.has(eligibilityKey(partNumber, typeId, e.positionId))) {
      this.add("not_eligible", e, [], `${where}: P/N ${partNumber} is not eligible at ${this.positionName(e.positionId)}.`);
    }
  }

  /** Aircraft totals never decrease; compare each snapshot with the highest seen on that aircraft. */
  private checkAircraftTotals(e: ViewEntry): void {
    if (e.aircraftId === null) return;
    for (const [field, noun, show] of [["aircraftMinutes", "hours", formatFlightTime], ["aircraftCycles", "cycles", String]] as const) {
      const value = e[field];
      if (value === null) continue;
      const key = `${e.aircraftId}:${field}`;
      const floor = this.aircraftFloor.get(key);
      if (floor && value < floor.value) {
        this.add("time_regression", e, [floor.at],
          `${this.aircraftName(e.aircraftId)} ${noun} went back from ${show(floor.value)} (seq ${floor.at.seq}) to ${show(value)} at ${this.entryName(e)}.`);
      } else {
        this.aircraftFloor.set(key, { value, at: e });
      }
    }
  }

  /**
   * Runs each counter through entry e and returns the unit's value of each at e (recorded, or
   * carried over from the placement). `offWing` says a rise since the last known value has no
   * flying to explain it (false for an install while still fitted elsewhere).
   */
  private updateCounters(e: ViewEntry, placement: Placement | null, offWing = placement === null): Array<number | null> {
    return COUNTERS.map((spec, i) => {
      const state = this.counters[i];
      const recorded = e[spec.field];
      const shopVisit = e.kind === "repaired";
      const carried = placement ? carryOverValue(spec, placement.install, placement.atInstall[i], e) : null;

      if (shopVisit && spec.resetsAtShopVisit) {
        // TSO/CSO may restart here; whatever the shop recorded is the new base.
        const mark = recorded === null ? null : { value: recorded, at: e };
        Object.assign(state, { floor: mark, known: mark, shopVisitSinceKnown: false });
        return recorded;
      }
      if (recorded === null) {
        if (shopVisit) state.shopVisitSinceKnown = true;
        if (carried !== null) {
          state.known = { value: carried, at: e };
          if (!state.floor || carried > state.floor.value) state.floor = state.known;
        } else if (placement) {
          state.known = null; // time accrued while fitted, and nothing says how much
        }
        // Off wing, the unit still has its last known value; fitted (here or elsewhere), it has
        // been flying, so only a carry-over can say what it is.
        return carried ?? (placement || !offWing ? null : (state.known?.value ?? null));
      }

      const { floor, known } = state;
      if (floor && recorded < floor.value) {
        this.add("time_regression", e, [floor.at], `${spec.label} went back from ${spec.show(floor.value)} (seq ${floor.at.seq}) to ${spec.show(recorded)} at ${this.entryName(e)}.`);
      } else if (offWing && known && recorded > known.value && !state.shopVisitSinceKnown && !shopVisit) {
        const rise = spec.show(recorded - known.value);
        this.add("gap", e, [known.at],
          `${spec.label} rose from ${spec.show(known.value)} (seq ${known.at.seq}) to ${spec.show(recorded)} at ${this.entryName(e)} with no shop visit in between: ${rise} unaccounted for.`);
      } else if (placement && carried !== null && recorded !== carried) {
        const diff = spec.show(Math.abs(recorded - carried));
        const flown = spec.show(carried - (placement.atInstall[i] as number));
        this.add("gap", e, [placement.install],
          `${spec.label} at ${this.entryName(e)} is ${spec.show(recorded)}, but ${spec.show(placement.atInstall[i] as number)} at installation (seq ${placement.install.seq}) plus ${flown} flown gives ${spec.show(carried)}: ${diff} ${recorded > carried ? "unaccounted for" : "flown but not counted"}.`);
      }
      // Trust the latest record from here on, so one bad value gives one finding, not a cascade.
      state.known = { value: recorded, at: e };
      state.floor = state.known;
      state.shopVisitSinceKnown = false;
      return recorded;
    });
  }

  private checkLife(e: ViewEntry, placement: Placement, values: Array<number | null>, atInstall: boolean): void {
    const { limits, manufacturedOn } = this.facts.part;
    const where = atInstall ? `Installed on ${this.aircraftName(e.aircraftId)} at seq ${e.seq}` : `At seq ${e.seq} on ${this.aircraftName(e.aircraftId)}`;
    const checks: Array<[string, number | null, number | null, (v: number) => string]> = [
      ["TSN", limits.minutes, values[0], formatFlightTime],
      ["CSN", limits.cycles, values[1], String],
      ["age", limits.days, limits.days === null ? null : this.ageAt(e, manufacturedOn), (v) => `${v} days`],
    ];
    for (const [label, limit, used, show] of checks) {
      if (limit === null || used === null || placement.lifeFlagged.has(label)) continue;
      const state = limitState(limit, used, 0, label);
      // At installation, reaching the limit already leaves no life; while fitted, the unit may
      // fly up to its limit, so only going beyond it counts.
      const exceeded = atInstall ? state.remaining <= 0 : state.remaining < 0;
      if (!exceeded) continue;
      placement.lifeFlagged.add(label);
      const related = atInstall ? [] : [placement.install];
      this.add("life_exceeded", e, related, atInstall
        ? `${where} with ${label} ${show(used)}, at or past its limit of ${show(limit)}: no life remains.`
        : `${where} the unit's ${label} is ${show(used)}, past its limit of ${show(limit)} by ${show(-state.remaining)} while fitted since seq ${placement.install.seq}.`);
    }
  }

  private ageAt(e: ViewEntry, since: string | null | undefined): number | null {
    if (!since) return null;
    try {
      return ageInDays(since, e.occurredAt);
    } catch {
      return null; // an entry dated before manufacture says nothing about calendar life
    }
  }

  private add(kind: FindingKind, at: ViewEntry, related: ViewEntry[], message: string): void {
    const relatedSeqs = new Set<number>();
    const notes: string[] = [];
    for (const e of [at, ...related]) {
      if (e !== at) relatedSeqs.add(e.seq);
      if (e.correctedBy.length > 0) {
        for (const c of e.correctedBy) relatedSeqs.add(c);
        notes.push(`seq ${e.seq} as corrected by seq ${e.correctedBy.join(", ")}`);
      }
    }
    const note = notes.length > 0 ? ` (A correction applies: ${notes.join("; ")}.)` : "";
    this.findings.push({ kind, seq: at.seq, relatedSeqs: [...relatedSeqs].sort((a, b) => a - b), message: message + note });
  }

  /** "the removal from TL-AAA (seq 3)": how messages point at an entry. */
  private entryName(e: ViewEntry): string {
    if (e.kind === "installed") return `the installation on ${this.aircraftName(e.aircraftId)} (seq ${e.seq})`;
    if (e.kind === "removed") return `the removal from ${this.aircraftName(e.aircraftId)} (seq ${e.seq})`;
    return `seq ${e.seq} (${e.kind.replace(/_/g, " ")})`;
  }

  private aircraftName(id: number | null): string {
    if (id === null) return "no aircraft";
    return this.registration.get(id) ?? `aircraft ${id}`;
  }

  private positionName(id: number | null): string {
    if (id === null) return "no position";
    const code = this.positionCode.get(id);
    return code ? `position ${code}` : `position ${id}`;
  }
}

function eligibilityKey(partNumber: string, aircraftTypeId: number, positionId: number): string {
  return `${aircraftTypeId}\u0000${positionId}\u0000${partNumber}`;
}

/** The counter carried over from installation to e, or null when a snapshot is missing or runs backwards. */
function carryOverValue(spec: CounterSpec, install: ViewEntry, atInstall: number | null, e: ViewEntry): number | null {
  const from = install[spec.host];
  const to = e[spec.host];
  if (atInstall === null || from === null || to === null || to < from) return null;
  return atInstall + (to - from);
}

/** One finding per kind and seq (TSN and CSN issues at one entry read as one), in seq order. */
function mergeAndSort(findings: Finding[]): Finding[] {
  const merged = new Map<string, Finding>();
  for (const f of findings) {
    const key = `${f.seq}:${f.kind}`;
    const existing = merged.get(key);
    if (!existing) {
      merged.set(key, { ...f });
      continue;
    }
    existing.message += " " + f.message;
    existing.relatedSeqs = [...new Set([...existing.relatedSeqs, ...f.relatedSeqs])].sort((a, b) => a - b);
  }
  const order = (k: FindingKind) => FINDING_KINDS.indexOf(k);
  return [...merged.values()].sort((a, b) => a.seq - b.seq || order(a.kind) - order(b.kind));
}
