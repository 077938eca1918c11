import "server-only";
import type { User } from "lucia";
import { formatFlightTime } from "@/domain/flight-time";
import type { PartStatus } from "@/domain/ledger-types";
import { MOVEMENT_LABELS, MOVEMENT_ROLES, type MovementInput } from "@/lib/schemas/stock";
import { db } from "./db";
import {
  assertTrackingNumberUnused,
  insertCertificateRow,
  toDocumentSummary,
  withStoredCertificate,
  type CheckedCertificate,
  type DocumentSummary,
} from "./documents";
import { AppError, invalidField } from "./errors";
import { appendLedgerEntries, type AppendedEntry, type Knex, type NewLedgerEntry } from "./ledger";
import { kickOutbox, queueMail } from "./mail";
import { assertIssuedOnNotFuture, duplicateKeyConflict } from "./receiving";
import { quarantineMail } from "./role-mail";
import { checkTransition, readPart } from "./stock-transitions";

export interface MovementResult {
  part: { id: number; partNumber: string; serialNumber: string; cage: string; status: PartStatus; bin: string | null; tsn: string; csn: number; tso: string | null; cso: number | null };
  entries: AppendedEntry[];
  document: DocumentSummary | null;
}

async function latestOfKind(trx: Knex.Transaction, partId: number, kind: string) {
  return trx("ledger_entries").where({ part_id: partId, kind }).orderBy("seq", "desc").first("seq", "details");
}

/** 403 unless the actor's role may record this kind of movement. */
export function assertMayRecord(actor: User, kind: MovementInput["kind"]): void {
  if (MOVEMENT_ROLES[kind].includes(actor.role)) return;
  const who = kind === "released" ? " Only quality (an auditor) or an administrator may release a unit from quarantine." : "";
  throw new AppError("forbidden", `The ${actor.role} role may not record "${MOVEMENT_LABELS[kind].toLowerCase()}".${who}`, "forbidden");
}

/**
 * Records one stock movement: checks the role and the unit's state, updates the unit and appends its
 * ledger entry (or two, when a certificate does not match and the unit goes to quarantine) in one
 * transaction. A return from repair brings its certificate, stored like a receipt's.
 */
export async function recordMovement(input: { actor: User; partId: number; movement: MovementInput; certificate?: CheckedCertificate | null; now?: Date }): Promise<MovementResult> {
  const { actor, partId, movement } = input;
  const now = input.now ?? new Date();
  assertMayRecord(actor, movement.kind);
  const occurredAt = movement.occurredAt ?? now;
  if (occurredAt.getTime() > now.getTime() + 5 * 60_000) throw invalidField("occurredAt", "This is in the future.");

  if (movement.kind !== "repaired") return db().transaction((trx) => writeMovement(trx, { ...input, occurredAt, now, objectKey: null })).then(afterCommit);

  const certificate = input.certificate;
  if (!certificate) throw invalidField("certificate", "Attach the release certificate from the repair shop (PDF, JPEG or PNG).");
  assertIssuedOnNotFuture(movement.issuedOn, now);
  // Fail fast before the file is stored; the same checks run again under the row lock.
  const current = await readPart(db(), partId, { lock: false });
  await checkTransition(db(), current, movement, occurredAt);
  await assertTrackingNumberUnused(movement.issuerApproval, movement.trackingNumber);
  return withStoredCertificate(certificate, (objectKey) =>
    db()
      .transaction((trx) => writeMovement(trx, { ...input, occurredAt, now, objectKey }))
      .catch((error) => {
        throw duplicateKeyConflict(error, { partNumber: current.partNumber, serialNumber: current.serialNumber, issuerApproval: movement.issuerApproval, trackingNumber: movement.trackingNumber }) ?? error;
      }),
  ).then(afterCommit);
}

function afterCommit(result: MovementResult & { mailQueued: boolean }): MovementResult {
  if (result.mailQueued) kickOutbox();
  const { mailQueued: _mailQueued, ...rest } = result;
  return rest;
}

async function writeMovement(
  trx: Knex.Transaction,
  input: { actor: User; partId: number; movement: MovementInput; certificate?: CheckedCertificate | null; occurredAt: Date; now: Date; objectKey: string | null },
): Promise<MovementResult & { mailQueued: boolean }> {
  const { actor, movement, occurredAt, now } = input;
  const part = await readPart(trx, input.partId, { lock: true });
  await checkTransition(trx, part, movement, occurredAt);

  let status = part.status;
  let bin = part.bin;
  let tso = part.tsoMinutes;
  let cso = part.cso;
  let documentId: number | null = null;
  let mailQueued = false;
  const base: Omit<NewLedgerEntry, "kind"> = {
    partId: part.id,
    aircraftId: null,
    positionId: null,
    occurredAt: occurredAt.toISOString(),
    recordedBy: actor.id,
    aircraftMinutes: null,
    aircraftCycles: null,
    tsnMinutes: part.tsnMinutes,
    csn: part.csn,
    tsoMinutes: part.tsoMinutes,
    cso: part.cso,
    removalType: null,
    reason: null,
    workOrder: null,
    taskReference: null,
    testResult: null,
    documentId: null,
    correctsSeq: null,
    details: null,
  };
  const entries: NewLedgerEntry[] = [];
  const clean = (details: Record<string, string | undefined | null>) =>
    Object.fromEntries(Object.entries(details).filter((entry): entry is [string, string] => typeof entry[1] === "string" && entry[1] !== ""));

  switch (movement.kind) {
    case "issued":
      // Status stays serviceable (the unit is still fit to install); it leaves its bin, and the entry names who has it.
      entries.push({ ...base, kind: "issued", workOrder: movement.workOrder ?? null, details: clean({ issuedTo: movement.issuedTo, fromBin: part.bin }) });
      bin = null;
      break;
    case "returned":
      entries.push({
        ...base,
        kind: "returned",
        reason: movement.reason ?? null,
        details: clean({ tag: movement.tagNumber, bin: movement.bin, unused: part.status === "serviceable" ? "yes" : undefined }),
      });
      bin = movement.bin;
      break;
    case "sent_for_repair":
      entries.push({ ...base, kind: "sent_for_repair", reason: movement.reason, details: clean({ shop: movement.shop, shopApproval: movement.shopApproval, repairOrder: movement.repairOrder }) });
      status = "in_repair";
      bin = null;
      break;
    case "repaired": {
      // An overhaul restarts the time since overhaul; TSN and CSN always continue.
      if (movement.statusWork === "overhauled") {
        tso = 0;
        cso = 0;
      }
      const [sent, removed] = await Promise.all([latestOfKind(trx, part.id, "sent_for_repair"), latestOfKind(trx, part.id, "removed")]);
      const sentDetails: Record<string, string> = sent?.details ? JSON.parse(sent.details) : {};
      documentId = await insertCertificateRow(trx, { partId: part.id, objectKey: input.objectKey!, file: input.certificate!, certificate: movement, uploadedBy: actor.id, uploadedAt: now });
      entries.push({
        ...base,
        kind: "repaired",
        tsoMinutes: tso,
        cso,
        documentId,
        details: clean({
          shop: sentDetails.shop ?? movement.issuerName,
          shopApproval: sentDetails.shopApproval ?? movement.issuerApproval,
          repairOrder: sentDetails.repairOrder,
          shopFinding: movement.shopFinding,
          removalSeq: removed ? String(removed.seq) : undefined,
          statusWork: movement.statusWork,
          formType: movement.formType,
          trackingNumber: movement.trackingNumber,
          bin: movement.bin,
        }),
      });
      status = "serviceable";
      bin = movement.bin;
      if (!movement.certificateMatches) {
        const reason = `Discrepancy on return from repair: ${movement.discrepancyNote}`;
        entries.push({ ...base, kind: "quarantined", tsoMinutes: tso, cso, reason, details: { bin: movement.bin, discrepancy: "repair_return", suspectedUnapproved: "no" } });
        status = "quarantined";
        const mail = await quarantineMail(trx, { partId: part.id, partNumber: part.partNumber, serialNumber: part.serialNumber, reason, actor, context: "discrepancy on return from repair" });
        await queueMail(trx, mail);
        mailQueued = mail.length > 0;
      }
      break;
    }
    case "quarantined": {
      bin = movement.bin ?? part.bin;
      entries.push({ ...base, kind: "quarantined", reason: movement.reason, details: clean({ suspectedUnapproved: movement.suspectedUnapproved ? "yes" : "no", bin }) });
      status = "quarantined";
      const mail = await quarantineMail(trx, {
        partId: part.id,
        partNumber: part.partNumber,
        serialNumber: part.serialNumber,
        reason: movement.reason,
        actor,
        context: movement.suspectedUnapproved ? "suspected unapproved part" : "quarantine",
      });
      await queueMail(trx, mail);
      mailQueued = mail.length > 0;
      break;
    }
    case "released":
      bin = movement.bin ?? part.bin;
      entries.push({ ...base, kind: "released", reason: movement.reason, details: clean({ releasedTo: movement.releaseTo, bin }) });
      status = movement.releaseTo;
      break;
    case "scrapped":
      entries.push({ ...base, kind: "scrapped", reason: movement.reason, details: clean({ mutilation: movement.mutilation, fromBin: part.bin }) });
      status = "scrapped";
      bin = null;
      break;
  }

  await trx("parts").where({ id: part.id }).update({ status, bin, tso_minutes: tso, cso, updated_at: now });
  const appended = await appendLedgerEntries(trx, entries);
  const document = documentId === null ? null : toDocumentSummary(await trx("documents").where({ id: documentId }).first());
  return {
    part: {
      id: part.id,
      partNumber: part.partNumber,
      serialNumber: part.serialNumber,
      cage: part.cage,
      status,
      bin,
      tsn: formatFlightTime(part.tsnMinutes),
      csn: part.csn,
      tso: tso === null ? null : formatFlightTime(tso),
      cso,
    },
    entries: appended,
    document,
    mailQueued,
  };
}
