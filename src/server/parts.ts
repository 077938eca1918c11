import "server-only";
import { ageInDays, currentTotals, remainingLife, type LifeStatus } from "@/domain/life";
import { formatFlightTime } from "@/domain/flight-time";
import type { LedgerKind, PartStatus } from "@/domain/ledger-types";
import { db, type Trx } from "./db";
import { notFound } from "./errors";

export interface PartSummary {
  id: number;
  partNumber: string;
  serialNumber: string;
  cage: string;
  description: string;
  status: PartStatus;
  tsn: string;
  csn: number;
  location: string;
}

function partBaseQuery(trx: Trx) {
  return trx("parts as pt")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .leftJoin("fitted as f", "f.part_id", "pt.id")
    .leftJoin("aircraft as a", "a.id", "f.aircraft_id")
    .leftJoin("positions as p", "p.id", "f.position_id")
    .leftJoin(
      trx("utilization as u")
        .join(trx("utilization").select("aircraft_id").max({ as_of: "as_of" }).groupBy("aircraft_id").as("latest"), function () {
          this.on("latest.aircraft_id", "u.aircraft_id").andOn("latest.as_of", "u.as_of");
        })
        .select("u.aircraft_id", "u.total_minutes", "u.total_cycles")
        .as("lu"),
      "lu.aircraft_id",
      "f.aircraft_id",
    )
    .select(
      "pt.id",
      "pt.serial_number",
      "pt.status",
      "pt.bin",
      "pt.manufactured_on",
      "pt.tsn_minutes",
      "pt.csn",
      "pt.tso_minutes",
      "pt.cso",
      "pn.id as part_number_id",
      "pn.part_number",
      "pn.cage",
      "pn.description",
      "pn.ata_chapter",
      "pn.life_limit_minutes",
      "pn.life_limit_cycles",
      "pn.life_limit_days",
      "a.registration",
      "p.code as position_code",
      "p.label as position_label",
      "f.installed_at",
      "f.aircraft_minutes_at_install",
      "f.aircraft_cycles_at_install",
      "f.tsn_minutes_at_install",
      "f.csn_at_install",
      "f.tso_minutes_at_install",
      "f.cso_at_install",
      "lu.total_minutes as host_minutes",
      "lu.total_cycles as host_cycles",
    );
}

/** The unit's own totals now: carried from its installation snapshot while fitted, else as last recorded. */
function totalsOf(row: Record<string, any>) {
  if (row.installed_at) {
    const install = {
      part: {
        tsnMinutes: Number(row.tsn_minutes_at_install),
        csn: Number(row.csn_at_install),
        tsoMinutes: row.tso_minutes_at_install === null ? null : Number(row.tso_minutes_at_install),
        cso: row.cso_at_install === null ? null : Number(row.cso_at_install),
      },
      host: { minutes: Number(row.aircraft_minutes_at_install), cycles: Number(row.aircraft_cycles_at_install) },
    };
    const host = {
      minutes: Math.max(Number(row.host_minutes ?? 0), install.host.minutes),
      cycles: Math.max(Number(row.host_cycles ?? 0), install.host.cycles),
    };
    return currentTotals(install, host);
  }
  return {
    tsnMinutes: Number(row.tsn_minutes),
    csn: Number(row.csn),
    tsoMinutes: row.tso_minutes === null ? null : Number(row.tso_minutes),
    cso: row.cso === null ? null : Number(row.cso),
  };
}

function locationOf(row: Record<string, any>): string {
  if (row.registration) return `${row.registration} · ${row.position_code}`;
  if (row.status === "in_repair") return "At the repair shop";
  return row.bin ? `Stores bin ${row.bin}` : "Stores";
}

function toSummary(row: Record<string, any>): PartSummary {
  const totals = totalsOf(row);
  return {
    id: row.id,
    partNumber: row.part_number,
    serialNumber: row.serial_number,
    cage: row.cage,
    description: row.description,
    status: row.status,
    tsn: formatFlightTime(totals.tsnMinutes),
    csn: totals.csn,
    location: locationOf(row),
  };
}

/** Units whose serial or part number starts with the text (case-insensitive), serial matches first. */
export async function searchParts(q: string, trx: Trx = db()): Promise<PartSummary[]> {
  const prefix = q.trim().replace(/[%_\\]/g, (c) => `\\${c}`) + "%";
  const rows = await partBaseQuery(trx)
    .where((where) => where.where("pt.serial_number", "like", prefix).orWhere("pn.part_number", "like", prefix))
    .orderByRaw("pt.serial_number LIKE ? DESC, pt.serial_number", [prefix])
    .limit(50);
  return rows.map(toSummary);
}

export interface ThreadLine {
  seq: number;
  kind: LedgerKind;
  occurredAt: string;
  registration: string | null;
  positionCode: string | null;
  aircraftHours: string | null;
  aircraftCycles: number | null;
  tsn: string | null;
  csn: number | null;
  tso: string | null;
  cso: number | null;
  removalType: string | null;
  reason: string | null;
  workOrder: string | null;
  taskReference: string | null;
  testResult: string | null;
  recordedBy: string;
  recordedByLicence: string | null;
  details: Record<string, string> | null;
  correctsSeq: number | null;
  hash: string;
}

export interface PartDetail extends PartSummary {
  ataChapter: string;
  bin: string | null;
  manufacturedOn: string | null;
  tso: string | null;
  cso: number | null;
  fittedAt: { registration: string; positionCode: string; positionLabel: string; installedAt: string } | null;
  life: {
    status: LifeStatus;
    limits: Array<{ kind: "hours" | "cycles" | "days"; limit: string; used: string; remaining: string; status: LifeStatus }>;
  };
  documents: Array<{ id: number; kind: string; formType: string | null; trackingNumber: string | null; sha256: string; sizeBytes: number; contentType: string; uploadedAt: string }>;
  thread: ThreadLine[];
}

export async function getPartDetail(partId: number, options: { now?: Date; trx?: Trx } = {}): Promise<PartDetail> {
  const trx = options.trx ?? db();
  const row = await partBaseQuery(trx).where("pt.id", partId).first();
  if (!row) throw notFound(`Part ${partId}`);
  const summary = toSummary(row);
  const totals = totalsOf(row);
  const life = remainingLife(
    {
      minutes: row.life_limit_minutes === null ? null : Number(row.life_limit_minutes),
      cycles: row.life_limit_cycles === null ? null : Number(row.life_limit_cycles),
      days: row.life_limit_days === null ? null : Number(row.life_limit_days),
    },
    { tsnMinutes: totals.tsnMinutes, csn: totals.csn, ageDays: row.manufactured_on ? ageInDays(new Date(row.manufactured_on), options.now ?? new Date()) : null },
  );
  const limits: PartDetail["life"]["limits"] = [];
  if (life.minutes) limits.push({ kind: "hours", limit: formatFlightTime(life.minutes.limit), used: formatFlightTime(life.minutes.used), remaining: signed(life.minutes.remaining, formatFlightTime), status: life.minutes.status });
  if (life.cycles) limits.push({ kind: "cycles", limit: String(life.cycles.limit), used: String(life.cycles.used), remaining: String(life.cycles.remaining), status: life.cycles.status });
  if (life.days) limits.push({ kind: "days", limit: String(life.days.limit), used: String(life.days.used), remaining: String(life.days.remaining), status: life.days.status });

  const [entries, documents] = await Promise.all([
    trx("ledger_entries as e")
      .leftJoin("aircraft as a", "a.id", "e.aircraft_id")
      .leftJoin("positions as p", "p.id", "e.position_id")
      .join("users as us", "us.id", "e.recorded_by")
      .where("e.part_id", partId)
      .orderBy("e.seq", "desc")
      .select("e.*", "a.registration", "p.code as position_code", "us.name as recorded_by_name", "us.licence_number"),
    // A unit's documents are those its ledger entries cite (certificates, tags, shop reports).
    trx("documents").whereIn("id", trx("ledger_entries").where("part_id", partId).whereNotNull("document_id").select("document_id")).orderBy("uploaded_at", "desc"),
  ]);
  return {
    ...summary,
    ataChapter: row.ata_chapter,
    bin: row.bin,
    manufacturedOn: row.manufactured_on ? new Date(row.manufactured_on).toISOString().slice(0, 10) : null,
    tso: totals.tsoMinutes === null ? null : formatFlightTime(totals.tsoMinutes),
    cso: totals.cso,
    fittedAt: row.registration
      ? { registration: row.registration, positionCode: row.position_code, positionLabel: row.position_label, installedAt: new Date(row.installed_at).toISOString() }
      : null,
    life: { status: life.status, limits },
    documents: documents.map((d) => ({
      id: d.id,
      kind: d.kind,
      formType: d.form_type,
      trackingNumber: d.tracking_number,
      sha256: d.sha256,
      sizeBytes: Number(d.size_bytes),
      contentType: d.content_type,
      uploadedAt: new Date(d.uploaded_at).toISOString(),
    })),
    thread: entries.map(toThreadLine),
  };
}

function signed(value: number, format: (n: number) => string): string {
  return value < 0 ? `-${format(-value)}` : format(value);
}

const minutesOrNull = (value: unknown) => (value === null || value === undefined ? null : formatFlightTime(Number(value)));
const intOrNull = (value: unknown) => (value === null || value === undefined ? null : Number(value));

export function toThreadLine(row: Record<string, any>): ThreadLine {
  return {
    seq: Number(row.seq),
    kind: row.kind,
    occurredAt: new Date(row.occurred_at).toISOString(),
    registration: row.registration ?? null,
    positionCode: row.position_code ?? null,
    aircraftHours: minutesOrNull(row.aircraft_minutes),
    aircraftCycles: intOrNull(row.aircraft_cycles),
    tsn: minutesOrNull(row.tsn_minutes),
    csn: intOrNull(row.csn),
    tso: minutesOrNull(row.tso_minutes),
    cso: intOrNull(row.cso),
    removalType: row.removal_type ?? null,
    reason: row.reason ?? null,
    workOrder: row.work_order ?? null,
    taskReference: row.task_reference ?? null,
    testResult: row.test_result ?? null,
    recordedBy: row.recorded_by_name ?? row.recorded_by,
    recordedByLicence: row.licence_number ?? null,
    details: row.details ? JSON.parse(row.details) : null,
    correctsSeq: intOrNull(row.corrects_seq),
    hash: row.hash,
  };
}
