import "server-only";
import { findContinuityIssues, type Finding, type FindingKind, type ThreadFacts } from "@/domain/continuity";
import { DomainInputError } from "@/domain/errors";
import { formatFlightTime } from "@/domain/flight-time";
import type { LedgerKind, PartStatus } from "@/domain/ledger-types";
import { db, type Trx } from "./db";
import { notFound } from "./errors";
import { rowToEntry } from "./ledger";
import { asSql, sqlOnPool, type Sql } from "./sql";

// The auditor's trace: one serial's thread straight from the ledger, with the continuity findings
// computed on it. The facts the check needs (entries, certificates, eligibility with alternates,
// aircraft types) are read for many units at once, so the position map can count findings for a
// whole aircraft in a handful of queries rather than one set per unit.

export interface TraceDocument {
  id: number;
  kind: string;
  formType: string | null;
  trackingNumber: string | null;
  statusWork: string | null;
  issuerName: string | null;
  issuerApproval: string | null;
  sha256: string;
}

export interface TraceSigner {
  name: string;
  licenceNumber: string | null;
}

export interface TraceChange {
  field: string;
  from: string | null;
  to: string | null;
}

export interface TraceEntry {
  seq: number;
  kind: LedgerKind;
  occurredAt: string;
  recordedAt: string;
  registration: string | null;
  positionCode: string | null;
  positionLabel: string | null;
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
  details: Record<string, string> | null;
  signedBy: TraceSigner;
  /** The independent inspector who countersigned the swap this entry belongs to, if any. */
  inspectedBy: TraceSigner | null;
  document: TraceDocument | null;
  /** On a correction: the entry it corrects, and what it changed there. */
  correctsSeq: number | null;
  changes: TraceChange[];
  /** On a corrected entry: the corrections that restate it, oldest first. */
  correctedBy: number[];
  prevHash: string;
  hash: string;
}

export interface TracePart {
  id: number;
  partNumber: string;
  serialNumber: string;
  cage: string;
  description: string;
  ataChapter: string;
  status: PartStatus;
  manufacturedOn: string | null;
}

export interface TraceFinding {
  kind: FindingKind;
  message: string;
  seq: number;
  relatedSeqs: number[];
}

export interface PartTrace {
  part: TracePart;
  entries: TraceEntry[];
  findings: TraceFinding[];
}

export interface SerialMatch {
  id: number;
  partNumber: string;
  serialNumber: string;
  cage: string;
  description: string;
  status: PartStatus;
  entries: number;
}

const num = (value: unknown) => (value === null || value === undefined ? null : Number(value));
const minutes = (value: unknown) => (value === null || value === undefined ? null : formatFlightTime(Number(value)));

/** Units with exactly this serial (and P/N and CAGE when given). Several matches are all returned: the caller chooses. */
export async function findSerials(query: { serial: string; partNumber?: string | null; cage?: string | null }, trx: Trx = db()): Promise<SerialMatch[]> {
  const q = trx("parts as pt")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .where("pt.serial_number", query.serial.trim().toUpperCase())
    .orderBy(["pn.part_number", "pn.cage"])
    .limit(50)
    .select("pt.id", "pt.serial_number", "pt.status", "pn.part_number", "pn.cage", "pn.description")
    .select(trx.raw("(select count(*) from ledger_entries le where le.part_id = pt.id) as entry_count"));
  if (query.partNumber) q.andWhere("pn.part_number", query.partNumber.trim().toUpperCase());
  if (query.cage) q.andWhere("pn.cage", query.cage.trim().toUpperCase());
  const rows = await q;
  return rows.map((row) => ({
    id: row.id,
    partNumber: row.part_number,
    serialNumber: row.serial_number,
    cage: row.cage,
    description: row.description,
    status: row.status,
    entries: Number(row.entry_count),
  }));
}

/** Serials that start with the text, for "did you mean" when nothing matches exactly. */
export async function suggestSerials(serialStart: string, trx: Trx = db()): Promise<SerialMatch[]> {
  const prefix = serialStart.trim().toUpperCase().replace(/[%_\\]/g, (c) => `\\${c}`) + "%";
  const rows = await trx("parts as pt")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .where("pt.serial_number", "like", prefix)
    .orderBy("pt.serial_number")
    .limit(10)
    .select("pt.id", "pt.serial_number", "pt.status", "pn.part_number", "pn.cage", "pn.description");
  return rows.map((row) => ({ id: row.id, partNumber: row.part_number, serialNumber: row.serial_number, cage: row.cage, description: row.description, status: row.status, entries: 0 }));
}

// ---------------------------------------------------------------------------------------
// Continuity facts for many units at once

type EntryRow = Record<string, any>;

interface LoadedThreads {
  facts: Map<number, ThreadFacts>;
  rows: Map<number, EntryRow[]>;
  parts: Map<number, EntryRow>;
}

/**
 * Reads everything the continuity check needs for the given units: their entries (one query),
 * their part numbers and limits, the positions each part number may occupy (alternates as the
 * swap checks allow them), the type of every aircraft they name, and the release certificates their entries cite.
 */
async function loadThreads(partIds: number[], runner: Trx | Sql, withDisplay: boolean): Promise<LoadedThreads> {
  const facts = new Map<number, ThreadFacts>();
  const rowsByPart = new Map<number, EntryRow[]>();
  const partRows = new Map<number, EntryRow>();
  if (partIds.length === 0) return { facts, rows: rowsByPart, parts: partRows };
  const sql = asSql(runner);

  // Written out rather than built: the trace is read per request, and the builder's work was a
  // tenth of it (see src/server/sql.ts). `IN (?)` takes the array as a list.
  const display = withDisplay
    ? {
        columns: `, a.registration, p.code AS position_code, p.label AS position_label, us.name AS signer_name, us.licence_number AS signer_licence,
                  d.form_type AS document_form_type, d.tracking_number AS document_tracking_number, d.status_work AS document_status_work,
                  d.issuer_name AS document_issuer_name, d.issuer_approval AS document_issuer_approval, d.sha256 AS document_sha256`,
        joins: " LEFT JOIN aircraft a ON a.id = e.aircraft_id LEFT JOIN positions p ON p.id = e.position_id LEFT JOIN users us ON us.id = e.recorded_by",
      }
    : { columns: "", joins: "" };
  const [parts, entryRows, aircraft, positions] = await Promise.all([
    sql.rows<EntryRow>(
      `SELECT pt.id, pt.serial_number, pt.status, pt.manufactured_on, pn.id AS pn_id, pn.part_number, pn.cage, pn.description, pn.ata_chapter,
              pn.life_limit_minutes, pn.life_limit_cycles, pn.life_limit_days
         FROM parts pt JOIN part_numbers pn ON pn.id = pt.part_number_id
        WHERE pt.id IN (?)`,
      [partIds],
    ),
    sql.rows<EntryRow>(
      `SELECT e.*, d.kind AS document_kind${display.columns}
         FROM ledger_entries e LEFT JOIN documents d ON d.id = e.document_id${display.joins}
        WHERE e.part_id IN (?)
        ORDER BY e.seq`,
      [partIds],
    ),
    // Only the airframes the thread names: the check reads nothing of the others.
    sql.rows<EntryRow>(
      "SELECT a.id, a.aircraft_type_id, a.registration FROM aircraft a WHERE a.id IN (SELECT DISTINCT aircraft_id FROM ledger_entries WHERE part_id IN (?) AND aircraft_id IS NOT NULL)",
      [partIds],
    ),
    sql.rows<EntryRow>(
      "SELECT p.id, p.code FROM positions p WHERE p.id IN (SELECT DISTINCT position_id FROM ledger_entries WHERE part_id IN (?) AND position_id IS NOT NULL)",
      [partIds],
    ),
  ]);
  const pnIds = [...new Set(parts.map((p) => Number(p.pn_id)))];
  const eligibility = await eligiblePositions(pnIds, sql);

  for (const row of entryRows) {
    const list = rowsByPart.get(Number(row.part_id)) ?? [];
    list.push(row);
    rowsByPart.set(Number(row.part_id), list);
  }
  const aircraftFacts = aircraft.map((a) => ({ id: a.id, typeId: a.aircraft_type_id, registration: a.registration }));
  const positionFacts = positions.map((p) => ({ id: p.id, code: p.code }));
  for (const part of parts) {
    partRows.set(part.id, part);
    const rows = rowsByPart.get(part.id) ?? [];
    const entries = rows.map((row) => rowToEntry(row));
    facts.set(part.id, {
      part: {
        id: part.id,
        partNumberId: Number(part.pn_id),
        partNumber: part.part_number,
        serialNumber: part.serial_number,
        limits: { minutes: num(part.life_limit_minutes), cycles: num(part.life_limit_cycles), days: num(part.life_limit_days) },
        manufacturedOn: part.manufactured_on ? new Date(part.manufactured_on).toISOString().slice(0, 10) : null,
      },
      entries,
      // A release certificate cited by an entry is on file from that entry on.
      certificates: rows
        .filter((row) => row.document_id !== null && row.document_kind === "release_certificate" && row.kind !== "corrected")
        .map((row) => ({ documentId: Number(row.document_id), partId: part.id, receivedSeq: Number(row.seq) })),
      eligibility: (eligibility.get(Number(part.pn_id)) ?? []).map((e) => ({ partNumber: part.part_number, aircraftTypeId: e.aircraftTypeId, positionId: e.positionId })),
      aircraft: aircraftFacts,
      positions: positionFacts,
    });
  }
  return { facts, rows: rowsByPart, parts: partRows };
}

/**
 * Positions each part number may occupy: listed itself, or listed P/N that it is an approved
 * alternate of (one-way: the alternate replaces the listed P/N; two-way also the reverse),
 * exactly as src/server/swap-checks.ts judges an installation.
 */
async function eligiblePositions(pnIds: number[], sql: Sql): Promise<Map<number, Array<{ positionId: number; aircraftTypeId: number }>>> {
  const out = new Map<number, Array<{ positionId: number; aircraftTypeId: number }>>();
  if (pnIds.length === 0) return out;
  const marks = pnIds.map(() => "?").join(",");
  const rows = await sql.rows(
    `SELECT pe.part_number_id AS pn_id, pe.position_id, p.aircraft_type_id
       FROM position_eligibility pe JOIN positions p ON p.id = pe.position_id
      WHERE pe.part_number_id IN (${marks})
     UNION
     SELECT pi.alternate_part_number_id, pe.position_id, p.aircraft_type_id
       FROM position_eligibility pe JOIN positions p ON p.id = pe.position_id
       JOIN part_interchange pi ON pi.part_number_id = pe.part_number_id
      WHERE pi.alternate_part_number_id IN (${marks})
     UNION
     SELECT pi.part_number_id, pe.position_id, p.aircraft_type_id
       FROM position_eligibility pe JOIN positions p ON p.id = pe.position_id
       JOIN part_interchange pi ON pi.alternate_part_number_id = pe.part_number_id AND pi.two_way = 1
      WHERE pi.part_number_id IN (${marks})`,
    [...pnIds, ...pnIds, ...pnIds],
  );
  for (const row of rows as Array<Record<string, number>>) {
    const list = out.get(Number(row.pn_id)) ?? [];
    list.push({ positionId: Number(row.position_id), aircraftTypeId: Number(row.aircraft_type_id) });
    out.set(Number(row.pn_id), list);
  }
  return out;
}

function toFindings(findings: Finding[]): TraceFinding[] {
  return findings.map((f) => ({ kind: f.kind, message: f.message, seq: f.seq, relatedSeqs: f.relatedSeqs }));
}

/** The check's findings; a thread it cannot replay is itself a finding an auditor must see, not a 500. */
function checkThread(facts: ThreadFacts): TraceFinding[] {
  try {
    return toFindings(findContinuityIssues(facts));
  } catch (error) {
    if (!(error instanceof DomainInputError)) throw error;
    return [{ kind: "gap", message: `The thread cannot be checked as recorded: ${error.message}`, seq: facts.entries[0]?.seq ?? 0, relatedSeqs: [] }];
  }
}

/**
 * Findings per unit, checked afresh, for the given units: every kind of finding, not only the cheap
 * ones, since the facts for many units come in one read. Screens that only show counts read them
 * through the cache in thread-findings.ts, which calls this for the units whose thread changed.
 */
export async function checkFindingCounts(partIds: number[], runner: Trx | Sql = sqlOnPool()): Promise<Map<number, number>> {
  const { facts } = await loadThreads(partIds, runner, false);
  const counts = new Map<number, number>();
  for (const [partId, threadFacts] of facts) counts.set(partId, checkThread(threadFacts).length);
  return counts;
}

/** The findings of one unit's thread. */
export async function getPartFindings(partId: number, runner: Trx | Sql = sqlOnPool()): Promise<TraceFinding[]> {
  const { facts } = await loadThreads([partId], runner, false);
  const threadFacts = facts.get(partId);
  if (!threadFacts) throw notFound(`Part ${partId}`);
  return checkThread(threadFacts);
}

// ---------------------------------------------------------------------------------------
// The thread as the trace shows it

const CHANGE_FIELDS: Array<[string, (row: EntryRow) => string | null]> = [
  ["aircraft", (r) => r.registration ?? null],
  ["position", (r) => r.position_code ?? null],
  ["occurred at", (r) => (r.occurred_at ? new Date(r.occurred_at).toISOString() : null)],
  ["aircraft hours", (r) => minutes(r.aircraft_minutes)],
  ["aircraft cycles", (r) => (r.aircraft_cycles === null ? null : String(r.aircraft_cycles))],
  ["TSN", (r) => minutes(r.tsn_minutes)],
  ["CSN", (r) => (r.csn === null ? null : String(r.csn))],
  ["TSO", (r) => minutes(r.tso_minutes)],
  ["CSO", (r) => (r.cso === null ? null : String(r.cso))],
  ["removal type", (r) => r.removal_type ?? null],
  ["work order", (r) => r.work_order ?? null],
  ["task reference", (r) => r.task_reference ?? null],
  ["test result", (r) => r.test_result ?? null],
  ["document", (r) => (r.document_id === null ? null : String(r.document_id))],
];

/** One unit's whole thread, every entry in seq order from its first receipt, with its findings. */
export async function getPartTrace(partId: number, runner: Trx | Sql = sqlOnPool()): Promise<PartTrace> {
  const { facts, rows, parts } = await loadThreads([partId], runner, true);
  const threadFacts = facts.get(partId);
  if (!threadFacts) throw notFound(`Part ${partId}`);
  const entryRows = rows.get(partId) ?? [];

  const seqs = entryRows.map((row) => row.seq);
  const swapSigners = seqs.length
    ? await asSql(runner).rows<EntryRow>(
        "SELECT s.removed_seq, s.installed_seq, u.name, u.licence_number FROM swaps s JOIN users u ON u.id = s.inspected_by WHERE s.removed_seq IN (?) OR s.installed_seq IN (?)",
        [seqs, seqs],
      )
    : [];
  const inspectorOf = new Map<number, TraceSigner>();
  for (const s of swapSigners) {
    const signer = { name: s.name, licenceNumber: s.licence_number ?? null };
    if (s.removed_seq !== null) inspectorOf.set(Number(s.removed_seq), signer);
    if (s.installed_seq !== null) inspectorOf.set(Number(s.installed_seq), signer);
  }

  // The values each entry stands at (after earlier corrections), so a correction shows what it changed.
  const current = new Map<number, EntryRow>();
  const rootOf = new Map<number, number>();
  const correctedBy = new Map<number, number[]>();
  const entries: TraceEntry[] = entryRows.map((row) => {
    const seq = Number(row.seq);
    let changes: TraceChange[] = [];
    if (row.kind === "corrected" && row.corrects_seq !== null) {
      const named = Number(row.corrects_seq);
      const root = rootOf.get(named) ?? named;
      rootOf.set(seq, root);
      const before = current.get(root);
      if (before) {
        changes = CHANGE_FIELDS.map(([field, read]) => ({ field, from: read(before), to: read(row) })).filter((c) => c.from !== c.to);
        current.set(root, row);
      }
      correctedBy.set(root, [...(correctedBy.get(root) ?? []), seq]);
    } else {
      current.set(seq, row);
    }
    return {
      seq,
      kind: row.kind,
      occurredAt: new Date(row.occurred_at).toISOString(),
      recordedAt: new Date(row.recorded_at).toISOString(),
      registration: row.registration ?? null,
      positionCode: row.position_code ?? null,
      positionLabel: row.position_label ?? null,
      aircraftHours: minutes(row.aircraft_minutes),
      aircraftCycles: num(row.aircraft_cycles),
      tsn: minutes(row.tsn_minutes),
      csn: num(row.csn),
      tso: minutes(row.tso_minutes),
      cso: num(row.cso),
      removalType: row.removal_type ?? null,
      reason: row.reason ?? null,
      workOrder: row.work_order ?? null,
      taskReference: row.task_reference ?? null,
      testResult: row.test_result ?? null,
      details: row.details ? JSON.parse(row.details) : null,
      signedBy: { name: row.signer_name ?? row.recorded_by, licenceNumber: row.signer_licence ?? null },
      inspectedBy: inspectorOf.get(seq) ?? null,
      document:
        row.document_id === null
          ? null
          : {
              id: Number(row.document_id),
              kind: row.document_kind,
              formType: row.document_form_type ?? null,
              trackingNumber: row.document_tracking_number ?? null,
              statusWork: row.document_status_work ?? null,
              issuerName: row.document_issuer_name ?? null,
              issuerApproval: row.document_issuer_approval ?? null,
              sha256: row.document_sha256,
            },
      correctsSeq: num(row.corrects_seq),
      changes,
      correctedBy: [],
      prevHash: row.prev_hash,
      hash: row.hash,
    };
  });
  for (const entry of entries) entry.correctedBy = correctedBy.get(entry.seq) ?? [];

  const findings = checkThread(threadFacts);
  const part = threadFacts.part;
  const partRow = parts.get(partId)!;
  return {
    part: {
      id: part.id,
      partNumber: part.partNumber,
      serialNumber: part.serialNumber,
      cage: partRow.cage,
      description: partRow.description,
      ataChapter: partRow.ata_chapter,
      status: partRow.status,
      manufacturedOn: part.manufacturedOn ?? null,
    },
    entries,
    findings,
  };
}
