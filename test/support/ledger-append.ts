// Stand-ins for writes the API does not offer (yet) in this branch: receiving a unit with its
// certificate (POST /api/receipts is built elsewhere) and entries no route would ever write (an
// installation while the unit is still fitted elsewhere). They append exactly as
// src/server/ledger.ts appendLedgerEntries does: inside one transaction that locks the head row,
// chaining from ledger_head with chainEntry, so the ledger check still passes afterwards.
import { createHash, randomUUID } from "node:crypto";
import { PutObjectCommand } from "@aws-sdk/client-s3";
import { chainEntry } from "../../src/domain/ledger-hash";
import type { LedgerEntryFields } from "../../src/domain/ledger-types";
import { testS3 } from "../api/receipts-fixtures";
import { testDb, testEnv } from "./api";

export type TestEntry = Omit<LedgerEntryFields, "seq" | "recordedAt" | "aircraftId" | "positionId" | "aircraftMinutes" | "aircraftCycles" | "tsoMinutes" | "cso" | "removalType" | "reason" | "workOrder" | "taskReference" | "testResult" | "documentId" | "correctsSeq" | "details"> &
  Partial<LedgerEntryFields>;

type Knexish = ReturnType<typeof testDb>;
type Trx = Parameters<Parameters<Knexish["transaction"]>[0]>[0];

/** Appends entries to the chain in the caller's transaction (head row locked first). */
export async function appendInTransaction(trx: Trx, entries: TestEntry[]): Promise<Array<{ seq: number; hash: string }>> {
  const head = await trx("ledger_head").where({ id: 1 }).forUpdate().first("last_seq", "last_hash");
  let seq = Number(head.last_seq);
  let prevHash: string = head.last_hash;
  const recordedAt = new Date().toISOString();
  const out: Array<{ seq: number; hash: string }> = [];
  for (const entry of entries) {
    seq += 1;
    const fields: LedgerEntryFields = {
      aircraftId: null, positionId: null, aircraftMinutes: null, aircraftCycles: null, tsoMinutes: null, cso: null, removalType: null, reason: null,
      workOrder: null, taskReference: null, testResult: null, documentId: null, correctsSeq: null, details: null,
      ...entry,
      seq,
      recordedAt,
    };
    const chained = chainEntry(prevHash, fields);
    prevHash = chained.hash;
    await trx("ledger_entries").insert({
      seq: chained.seq, kind: chained.kind, part_id: chained.partId, aircraft_id: chained.aircraftId, position_id: chained.positionId,
      occurred_at: new Date(chained.occurredAt), recorded_at: new Date(chained.recordedAt), recorded_by: chained.recordedBy,
      aircraft_minutes: chained.aircraftMinutes, aircraft_cycles: chained.aircraftCycles, tsn_minutes: chained.tsnMinutes, csn: chained.csn,
      tso_minutes: chained.tsoMinutes, cso: chained.cso, removal_type: chained.removalType, reason: chained.reason, work_order: chained.workOrder,
      task_reference: chained.taskReference, test_result: chained.testResult, document_id: chained.documentId, corrects_seq: chained.correctsSeq,
      details: chained.details ? JSON.stringify(chained.details) : null, prev_hash: chained.prevHash, hash: chained.hash,
    });
    out.push({ seq: chained.seq, hash: chained.hash });
  }
  await trx("ledger_head").where({ id: 1 }).update({ last_seq: seq, last_hash: prevHash });
  return out;
}

export async function appendTestEntries(entries: TestEntry[]) {
  return testDb().transaction((trx) => appendInTransaction(trx, entries));
}

/**
 * Stands in for POST /api/receipts: books a unit into stores as serviceable with a release
 * certificate (a documents row) and a `received` entry; creates the parts row the first time.
 */
export async function receiveUnitForTest(input: { partNumber: string; serialNumber: string; tsnMinutes: number; csn: number; occurredAt?: Date }) {
  return testDb().transaction(async (trx) => {
    const pn = await trx("part_numbers").where({ part_number: input.partNumber }).first("id");
    if (!pn) throw new Error(`no part number ${input.partNumber}`);
    const now = new Date();
    let part = await trx("parts").where({ part_number_id: pn.id, serial_number: input.serialNumber }).forUpdate().first("id");
    if (!part) {
      const [id] = await trx("parts").insert({ part_number_id: pn.id, serial_number: input.serialNumber, status: "serviceable", bin: "T1-A1", manufactured_on: "2024-01-15", tsn_minutes: input.tsnMinutes, csn: input.csn, updated_at: now });
      part = { id };
    }
    const bytes = Buffer.from(`test certificate for ${input.partNumber} ${input.serialNumber} ${randomUUID()}`);
    const tracking = `TC-${randomUUID().slice(0, 13)}`;
    // The file is stored too, so every certificate row has its object (as the receipts suite checks).
    await testS3().send(new PutObjectCommand({ Bucket: testEnv().S3_BUCKET, Key: `certificates/test-${tracking}.pdf`, Body: bytes, ContentType: "application/pdf" }));
    const [documentId] = await trx("documents").insert({
      kind: "release_certificate", form_type: "easa_form_1", tracking_number: tracking, status_work: "inspected_tested", issuer_name: "Invented Test Shop",
      issuer_approval: "QT.145.0001", issued_on: now.toISOString().slice(0, 10), object_key: `certificates/test-${tracking}.pdf`,
      sha256: createHash("sha256").update(bytes).digest("hex"), size_bytes: bytes.length, content_type: "application/pdf",
      original_name: `${tracking}.pdf`, uploaded_by: "usr-stores", uploaded_at: now,
    });
    const [entry] = await appendInTransaction(trx, [
      { kind: "received", partId: part.id, occurredAt: (input.occurredAt ?? now).toISOString(), recordedBy: "usr-stores", tsnMinutes: input.tsnMinutes, csn: input.csn, documentId: Number(documentId), details: { bin: "T1-A1" } },
    ]);
    await trx("parts").where({ id: part.id }).update({ status: "serviceable", bin: "T1-A1", tsn_minutes: input.tsnMinutes, csn: input.csn, updated_at: now });
    return { partId: Number(part.id), seq: entry.seq, documentId: Number(documentId) };
  });
}
