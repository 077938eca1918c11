import "server-only";
import type { User } from "lucia";
import { formatFlightTime } from "@/domain/flight-time";
import type { PartStatus } from "@/domain/ledger-types";
import type { PartNumberRequest, ReceiptFields } from "@/lib/schemas/receiving";
import { db, type Trx } from "./db";
import {
  assertTrackingNumberUnused,
  duplicateTracking,
  insertCertificateRow,
  toDocumentSummary,
  withStoredCertificate,
  type CheckedCertificate,
  type DocumentSummary,
} from "./documents";
import { serverEnv } from "./env";
import { AppError, invalidField } from "./errors";
import { appendLedgerEntries, type NewLedgerEntry } from "./ledger";
import { kickOutbox, queueMail } from "./mail";
import { emailsOfRole, quarantineMail } from "./role-mail";

export interface CatalogPartNumber {
  id: number;
  partNumber: string;
  cage: string;
  description: string;
  serialised: boolean;
}

/** The catalog as the receiving form offers it (P/N with its CAGE and description). */
export async function listCatalogPartNumbers(trx: Trx = db()): Promise<CatalogPartNumber[]> {
  const rows = await trx("part_numbers").orderBy(["part_number", "cage"]).select("id", "part_number", "cage", "description", "serialised");
  return rows.map((r) => ({ id: r.id, partNumber: r.part_number, cage: r.cage, description: r.description, serialised: Boolean(r.serialised) }));
}

const unknownPartNumber = (partNumber: string, detail: string) =>
  new AppError(
    "invalid",
    `Part number ${partNumber} ${detail} Check the certificate's block 8, or ask an administrator to add it to the catalog.`,
    "unknown_part_number",
    { partNumber: `${partNumber} is not in the catalog.` },
  );

/** The catalog row for a P/N (and CAGE, which defaults when the P/N has only one). */
export async function findCatalogPartNumber(partNumber: string, cage: string | undefined, trx: Trx = db()): Promise<CatalogPartNumber> {
  const rows = await trx("part_numbers").where({ part_number: partNumber }).select("id", "part_number", "cage", "description", "serialised");
  if (rows.length === 0) throw unknownPartNumber(partNumber, "is not in the catalog.");
  const matching = cage ? rows.filter((r) => r.cage.toUpperCase() === cage.toUpperCase()) : rows;
  if (matching.length === 0) {
    throw unknownPartNumber(partNumber, `is in the catalog under CAGE ${rows.map((r) => r.cage).join(", ")}, not ${cage}.`);
  }
  if (matching.length > 1) {
    throw invalidField("cage", `${partNumber} is made under more than one CAGE code (${matching.map((r) => r.cage).join(", ")}): give the one on the certificate.`);
  }
  const row = matching[0];
  if (!row.serialised) {
    throw invalidField("partNumber", `${partNumber} is not a serialised part number; Threadline tracks serialised units only.`);
  }
  return { id: row.id, partNumber: row.part_number, cage: row.cage, description: row.description, serialised: true };
}

const duplicateSerial = (partNumber: string, serialNumber: string) =>
  new AppError(
    "conflict",
    `Serial number ${serialNumber} under part number ${partNumber} is already on file. A serial is unique within its part number: check the data plate, or find the unit with the part search.`,
    "duplicate_serial",
    { serialNumber: "Already on file for this part number." },
  );

async function assertSerialUnused(partNumberId: number, partNumber: string, serialNumber: string, trx: Trx): Promise<void> {
  const existing = await trx("parts").where({ part_number_id: partNumberId, serial_number: serialNumber }).first("id");
  if (existing) throw duplicateSerial(partNumber, serialNumber);
}

/** The certificate date may not lie in the future (a day of slack for time zones). */
export function assertIssuedOnNotFuture(issuedOn: string, now: Date): void {
  if (Date.parse(`${issuedOn}T00:00:00Z`) > now.getTime() + 86_400_000) {
    throw invalidField("issuedOn", `The certificate date ${issuedOn} is in the future.`);
  }
}

/** MariaDB's duplicate-key error names the index; map it back to the contract's 409 codes. */
export function duplicateKeyConflict(error: unknown, context: { partNumber: string; serialNumber: string; issuerApproval: string; trackingNumber: string }): AppError | null {
  const e = error as { code?: string; sqlMessage?: string; message?: string };
  if (e?.code !== "ER_DUP_ENTRY") return null;
  const text = e.sqlMessage ?? e.message ?? "";
  if (text.includes("tracking_number")) return duplicateTracking(context.issuerApproval, context.trackingNumber);
  if (text.includes("serial_number")) return duplicateSerial(context.partNumber, context.serialNumber);
  return null;
}

export interface ReceivedPart {
  id: number;
  partNumber: string;
  serialNumber: string;
  cage: string;
  description: string;
  status: PartStatus;
  bin: string;
  tsn: string;
  csn: number;
  tso: string | null;
  cso: number | null;
}

export interface ReceiptResult {
  part: ReceivedPart;
  document: DocumentSummary;
  entries: Array<{ seq: number; kind: string; hash: string }>;
}

/**
 * Books a serviceable unit in with its release certificate. Every check runs before anything is
 * written; the file goes to storage first and is deleted again if the transaction fails.
 */
export async function receivePart(input: { actor: User; fields: ReceiptFields; file: CheckedCertificate; now?: Date }): Promise<ReceiptResult> {
  const { actor, fields, file } = input;
  const now = input.now ?? new Date();
  const catalog = await findCatalogPartNumber(fields.partNumber, fields.cage);
  assertIssuedOnNotFuture(fields.issuedOn, now);
  await assertSerialUnused(catalog.id, catalog.partNumber, fields.serialNumber, db());
  await assertTrackingNumberUnused(fields.issuerApproval, fields.trackingNumber);

  // An overhaul certificate starts the time since overhaul at zero unless it states otherwise.
  const tso = fields.tso ?? (fields.statusWork === "overhauled" ? 0 : null);
  const cso = fields.cso ?? (fields.statusWork === "overhauled" ? 0 : null);
  const discrepancy = fields.certificateMatches ? null : fields.discrepancyNote!;
  const status: PartStatus = discrepancy ? "quarantined" : "serviceable";

  let mailQueued = false;
  const result = await withStoredCertificate(file, (objectKey) =>
    db()
      .transaction(async (trx) => {
        const [partId] = await trx("parts").insert({
          part_number_id: catalog.id,
          serial_number: fields.serialNumber,
          status,
          bin: fields.bin,
          tsn_minutes: fields.tsn,
          csn: fields.csn,
          tso_minutes: tso,
          cso,
          updated_at: now,
        });
        const documentId = await insertCertificateRow(trx, {
          partId: Number(partId),
          objectKey,
          file,
          certificate: fields,
          uploadedBy: actor.id,
          uploadedAt: now,
        });
        const base: Omit<NewLedgerEntry, "kind"> = {
          partId: Number(partId),
          aircraftId: null,
          positionId: null,
          occurredAt: now.toISOString(),
          recordedBy: actor.id,
          aircraftMinutes: null,
          aircraftCycles: null,
          tsnMinutes: fields.tsn,
          csn: fields.csn,
          tsoMinutes: tso,
          cso,
          removalType: null,
          reason: null,
          workOrder: null,
          taskReference: null,
          testResult: null,
          documentId,
          correctsSeq: null,
          details: null,
        };
        const entries: NewLedgerEntry[] = [
          {
            ...base,
            kind: "received",
            details: {
              bin: fields.bin,
              statusWork: fields.statusWork,
              formType: fields.formType,
              trackingNumber: fields.trackingNumber,
              issuerApproval: fields.issuerApproval,
              certificateMatches: fields.certificateMatches ? "yes" : "no",
            },
          },
        ];
        if (discrepancy) {
          const reason = `Receiving discrepancy: ${discrepancy}`;
          entries.push({ ...base, kind: "quarantined", documentId: null, reason, details: { bin: fields.bin, discrepancy: "receiving", suspectedUnapproved: "no" } });
          const mail = await quarantineMail(trx, { partId: Number(partId), partNumber: catalog.partNumber, serialNumber: fields.serialNumber, reason, actor, context: "receiving discrepancy" });
          await queueMail(trx, mail);
          mailQueued = mail.length > 0;
        }
        const appended = await appendLedgerEntries(trx, entries);
        const document = toDocumentSummary(await trx("documents").where({ id: documentId }).first());
        return {
          part: {
            id: Number(partId),
            partNumber: catalog.partNumber,
            serialNumber: fields.serialNumber,
            cage: catalog.cage,
            description: catalog.description,
            status,
            bin: fields.bin,
            tsn: formatFlightTime(fields.tsn),
            csn: fields.csn,
            tso: tso === null ? null : formatFlightTime(tso),
            cso,
          },
          document,
          entries: appended,
        };
      })
      .catch((error) => {
        throw duplicateKeyConflict(error, { ...fields, partNumber: catalog.partNumber }) ?? error;
      }),
  );
  if (mailQueued) kickOutbox();
  return result;
}

/** Asks the administrators (by mail, through the outbox) to add a part number to the catalog. */
export async function requestCatalogPartNumber(input: { actor: User; request: PartNumberRequest }): Promise<{ queued: number }> {
  const { actor, request } = input;
  const queued = await db().transaction(async (trx) => {
    const admins = await emailsOfRole(trx, "admin");
    await queueMail(
      trx,
      admins.map((to) => ({
        to,
        subject: `Please add part number ${request.partNumber} to the catalog`,
        text: [
          `${actor.name} (${actor.email}) tried to receive part number ${request.partNumber}${request.cage ? `, CAGE ${request.cage}` : ""}, which is not in the catalog.`,
          request.note ? `\nNote: ${request.note}` : "",
          `\nAdd it in the catalog, then ask stores to receive the unit again: ${serverEnv().APP_URL}/catalog`,
        ].join("\n"),
      })),
    );
    return admins.length;
  });
  if (queued > 0) kickOutbox();
  return { queued };
}

