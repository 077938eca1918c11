import "server-only";
import { createHash, randomUUID } from "node:crypto";
import {
  CERTIFICATE_CONTENT_TYPES,
  MAX_CERTIFICATE_BYTES,
  type CertificateContentType,
  type FormType,
  type StatusWord,
} from "@/lib/schemas/receiving";
import { db, type Trx } from "./db";
import { AppError, notFound } from "./errors";
import { deleteObject, getObjectStream, putObject } from "./storage";

const MB = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

/** Refused with 413 before a byte is stored. */
export const tooLarge = () =>
  new AppError("too_large", `The certificate file is larger than ${MB(MAX_CERTIFICATE_BYTES)}. Scan it at a lower resolution or as a PDF and try again.`, "too_large", {
    certificate: `At most ${MB(MAX_CERTIFICATE_BYTES)}.`,
  });

/**
 * The type by the file's first bytes, never by its name or what the browser said: an executable
 * renamed .pdf stays an executable. Signatures: "%PDF-" (ISO 32000), JPEG SOI FF D8 FF, PNG's 8-byte
 * signature (ISO/IEC 15948) [from memory].
 */
export function sniffCertificateType(bytes: Uint8Array): CertificateContentType | null {
  const starts = (...signature: number[]) => signature.every((byte, i) => bytes[i] === byte);
  if (starts(0x25, 0x50, 0x44, 0x46, 0x2d)) return "application/pdf";
  if (starts(0xff, 0xd8, 0xff)) return "image/jpeg";
  if (starts(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a)) return "image/png";
  return null;
}

export interface CheckedCertificate {
  bytes: Uint8Array;
  sha256: string;
  sizeBytes: number;
  contentType: CertificateContentType;
  originalName: string | null;
}

/**
 * The client's file name is kept for the record only (never as a key or a download name), but it is
 * still shown to people: keep the last path part, drop control and bidirectional-override characters
 * (an RTL override makes "fdp.exe" read as "exe.pdf"), and cut at 255 characters without splitting one.
 */
export function recordableFileName(name: string | undefined): string | null {
  const base = (name ?? "").split(/[/\\]/).pop() ?? "";
  // eslint-disable-next-line no-control-regex
  const printable = base.replace(/[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069]/g, "").replace(/[\uD800-\uDFFF]/g, (c, i, all) => (isPaired(all, i) ? c : "")).trim();
  const cut = [...printable].slice(0, 255).join("");
  return cut.length ? cut : null;
}

function isPaired(text: string, index: number): boolean {
  const code = text.charCodeAt(index);
  if (code <= 0xdbff) return index + 1 < text.length && (text.charCodeAt(index + 1) & 0xfc00) === 0xdc00;
  return index > 0 && (text.charCodeAt(index - 1) & 0xfc00) === 0xd800;
}

/** Size (413) and type (415) checks on an uploaded certificate; nothing is stored yet. */
export async function checkCertificateFile(file: File): Promise<CheckedCertificate> {
  if (file.size > MAX_CERTIFICATE_BYTES) throw tooLarge();
  const bytes = new Uint8Array(await file.arrayBuffer());
  if (bytes.byteLength > MAX_CERTIFICATE_BYTES) throw tooLarge();
  if (bytes.byteLength === 0) {
    throw new AppError("invalid", "certificate: the file is empty.", "invalid", { certificate: "The file is empty: choose the scanned certificate again." });
  }
  const contentType = sniffCertificateType(bytes);
  if (!contentType) {
    throw new AppError(
      "unsupported_type",
      `The certificate file is not a PDF, JPEG or PNG (judged by its content, not its name). Accepted: ${CERTIFICATE_CONTENT_TYPES.join(", ")}.`,
      "unsupported_type",
      { certificate: "Upload the certificate as a PDF, JPEG or PNG." },
    );
  }
  return {
    bytes,
    sha256: createHash("sha256").update(bytes).digest("hex"),
    sizeBytes: bytes.byteLength,
    contentType,
    originalName: recordableFileName(file.name),
  };
}

export interface CertificateRecord {
  formType: FormType;
  statusWork: StatusWord;
  trackingNumber: string;
  issuerName: string;
  issuerApproval: string;
  issuedOn: string;
  remarks?: string;
}

/** 409 when the issuer (by approval reference) has already used this tracking number. */
export async function assertTrackingNumberUnused(issuerApproval: string, trackingNumber: string, trx: Trx = db()): Promise<void> {
  const existing = await trx("documents").where({ issuer_approval: issuerApproval, tracking_number: trackingNumber }).first("id", "part_id");
  if (existing) throw duplicateTracking(issuerApproval, trackingNumber);
}

export const duplicateTracking = (issuerApproval: string, trackingNumber: string) =>
  new AppError(
    "conflict",
    `Tracking number ${trackingNumber} from the organisation with approval ${issuerApproval} is already on file. Each certificate has its own number: check block 3, or whether this certificate was booked in before.`,
    "duplicate_tracking_number",
    { trackingNumber: "Already used by this issuer." },
  );

/** Puts the bytes in object storage under a key of ours; the caller deletes it if its transaction fails. */
export async function putCertificateObject(file: CheckedCertificate): Promise<string> {
  const key = `certificates/${randomUUID()}`;
  await putObject(key, file.bytes, file.contentType, { sha256: file.sha256 });
  return key;
}

export async function insertCertificateRow(
  trx: Trx,
  input: { partId: number; objectKey: string; file: CheckedCertificate; certificate: CertificateRecord; uploadedBy: string; uploadedAt: Date },
): Promise<number> {
  const [id] = await trx("documents").insert({
    kind: "release_certificate",
    part_id: input.partId,
    form_type: input.certificate.formType,
    tracking_number: input.certificate.trackingNumber,
    status_work: input.certificate.statusWork,
    issuer_name: input.certificate.issuerName,
    issuer_approval: input.certificate.issuerApproval,
    issued_on: input.certificate.issuedOn,
    remarks: input.certificate.remarks ?? null,
    object_key: input.objectKey,
    sha256: input.file.sha256,
    size_bytes: input.file.sizeBytes,
    content_type: input.file.contentType,
    original_name: input.file.originalName,
    uploaded_by: input.uploadedBy,
    uploaded_at: input.uploadedAt,
  });
  return Number(id);
}

/**
 * Stores the certificate, runs `write` (the caller's transaction) and removes the object again if the
 * transaction fails, so a failed receipt leaves neither a row nor an orphaned file.
 */
export async function withStoredCertificate<T>(file: CheckedCertificate, write: (objectKey: string) => Promise<T>): Promise<T> {
  const objectKey = await putCertificateObject(file);
  try {
    return await write(objectKey);
  } catch (error) {
    await deleteObject(objectKey).catch((cleanupError) => console.error(`could not remove ${objectKey} after a failed write`, cleanupError));
    throw error;
  }
}

export interface DocumentSummary {
  id: number;
  partId: number | null;
  kind: string;
  formType: string | null;
  trackingNumber: string | null;
  statusWork: string | null;
  issuerName: string | null;
  issuerApproval: string | null;
  issuedOn: string | null;
  remarks: string | null;
  sha256: string;
  sizeBytes: number;
  contentType: string;
  uploadedAt: string;
}

export function toDocumentSummary(row: Record<string, any>): DocumentSummary {
  return {
    id: Number(row.id),
    partId: row.part_id === null || row.part_id === undefined ? null : Number(row.part_id),
    kind: row.kind,
    formType: row.form_type,
    trackingNumber: row.tracking_number,
    statusWork: row.status_work,
    issuerName: row.issuer_name,
    issuerApproval: row.issuer_approval,
    issuedOn: row.issued_on ? isoDate(row.issued_on) : null,
    remarks: row.remarks ?? null,
    sha256: row.sha256,
    sizeBytes: Number(row.size_bytes),
    contentType: row.content_type,
    uploadedAt: new Date(row.uploaded_at).toISOString(),
  };
}

function isoDate(value: Date | string): string {
  if (value instanceof Date) {
    // DATE columns arrive as local-midnight Dates from mysql2 with timezone "Z": UTC midnight.
    return value.toISOString().slice(0, 10);
  }
  return String(value).slice(0, 10);
}

const EXTENSIONS: Record<string, string> = { "application/pdf": "pdf", "image/jpeg": "jpg", "image/png": "png" };

export interface VerifiedDocument {
  document: DocumentSummary;
  bytes: Uint8Array;
  fileName: string;
}

/**
 * The stored bytes, re-hashed as they are read: a file whose SHA-256 no longer matches the one
 * recorded at upload is refused with 409 instead of being served as if it were the original.
 * Files are capped at upload, so buffering one to check it before the first byte goes out is cheap.
 */
export async function readVerifiedDocument(documentId: number, trx: Trx = db()): Promise<VerifiedDocument> {
  const row = await trx("documents").where({ id: documentId }).first();
  if (!row) throw notFound(`Document ${documentId}`);
  const document = toDocumentSummary(row);
  const object = await getObjectStream(row.object_key);
  if (!object) {
    throw new AppError("conflict", `The file of document ${documentId} is missing from storage. Tell an administrator; the certificate has to be scanned again.`, "document_missing");
  }
  const hash = createHash("sha256");
  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = object.stream.getReader();
  let oversized = false;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > MAX_CERTIFICATE_BYTES) {
      // Larger than anything we accept: it cannot be the file we stored.
      oversized = true;
      await reader.cancel().catch(() => {});
      break;
    }
    hash.update(value);
    chunks.push(value);
  }
  const served = oversized ? null : hash.digest("hex");
  if (served !== document.sha256) {
    console.warn(`document ${documentId}: stored SHA-256 ${document.sha256}, object now ${served ?? "larger than the cap"}`);
    throw new AppError(
      "conflict",
      `The stored file of document ${documentId} has changed since it was uploaded: its SHA-256 no longer matches the one recorded (${document.sha256}). It is not served. Tell quality; the original certificate must be checked and scanned again.`,
      "document_altered",
      undefined,
      { "X-Content-SHA256": document.sha256 },
    );
  }
  const extension = EXTENSIONS[document.contentType] ?? "bin";
  const name = document.trackingNumber ? `certificate-${document.trackingNumber.replace(/[^A-Za-z0-9-]+/g, "-")}` : `document-${document.id}`;
  return { document, bytes: Buffer.concat(chunks), fileName: `${name}.${extension}` };
}
