import type { Knex } from "knex";
import { GENESIS_HASH, chainEntry } from "../src/domain/ledger-hash";
import { entryToRow } from "../src/lib/ledger-rows";
import { DEMO_PART_NUMBERS } from "./lib/catalog-data";
import { DEMO_USERS, DEMO_NOW } from "./lib/demo";
import { demoCertificatePdf, sha256, uploadAll } from "./lib/certificates";
import { simulateHistory } from "./lib/history";

const userId = (role: string) => DEMO_USERS.find((u) => u.role === role)!.id;
const DEMO_PART_NUMBER_OF = (id: number) => DEMO_PART_NUMBERS[id - 1].partNumber;

export async function seed(knex: Knex): Promise<void> {
  const history = simulateHistory({ technician: userId("technician"), inspector: userId("inspector"), stores: userId("stores") });

  await knex.batchInsert(
    "utilization",
    history.utilization.map((u) => ({ aircraft_id: u.aircraftId, as_of: new Date(u.asOf), total_minutes: u.minutes, total_cycles: u.cycles, recorded_by: null, recorded_at: new Date(u.asOf) })),
    1000,
  );
  await knex.batchInsert(
    "parts",
    history.parts.map((p) => ({
      id: p.id,
      part_number_id: p.partNumberId,
      serial_number: p.serialNumber,
      status: p.status,
      bin: p.bin,
      manufactured_on: p.manufacturedOn,
      tsn_minutes: p.tsnMinutes,
      csn: p.csn,
      tso_minutes: p.tsoMinutes,
      cso: p.cso,
      updated_at: DEMO_NOW,
    })),
    1000,
  );

  // Every receipt and every return from repair comes with its release certificate.
  const serialOf = new Map(history.parts.map((p) => [p.id, p]));
  const documents: Array<Record<string, unknown>> = [];
  const uploads: Array<{ key: string; body: Buffer }> = [];
  for (const entry of history.entries) {
    if (entry.kind !== "received" && entry.kind !== "repaired") continue;
    const part = serialOf.get(entry.partId)!;
    const id = documents.length + 1;
    const shop = entry.details?.shopApproval ?? "QA.21G.0003";
    const tracking = `${entry.kind === "received" ? "RC" : "RR"}-${String(id).padStart(6, "0")}`;
    const statusWork = entry.details?.statusWork ?? "new";
    const body = demoCertificatePdf([
      "AUTHORISED RELEASE CERTIFICATE (demo document, invented)",
      `Form tracking number: ${tracking}`,
      `Organisation: ${entry.details?.shop ?? "Quillfeather Parts Supply"} (${shop})`,
      `Part number: ${DEMO_PART_NUMBER_OF(part.partNumberId)}   Serial number: ${part.serialNumber}`,
      `Status/work: ${statusWork}`,
      `Date: ${entry.occurredAt.slice(0, 10)}`,
    ]);
    const key = `demo-certificates/${String(id).padStart(6, "0")}.pdf`;
    uploads.push({ key, body });
    documents.push({
      id,
      part_id: entry.partId,
      kind: "release_certificate",
      form_type: id % 3 === 0 ? "easa_form_1" : "faa_8130_3",
      tracking_number: tracking,
      status_work: statusWork,
      issuer_name: entry.details?.shop ?? "Quillfeather Parts Supply",
      issuer_approval: shop,
      issued_on: entry.occurredAt.slice(0, 10),
      object_key: key,
      sha256: sha256(body),
      size_bytes: body.length,
      content_type: "application/pdf",
      original_name: `${tracking}.pdf`,
      uploaded_by: userId("stores"),
      uploaded_at: new Date(entry.occurredAt),
    });
    entry.documentId = id;
  }
  // An installation cites the certificate the unit was last released on.
  const lastCertificate = new Map<number, number>();
  for (const entry of history.entries) {
    if (entry.documentId && (entry.kind === "received" || entry.kind === "repaired")) lastCertificate.set(entry.partId, entry.documentId);
    else if (entry.kind === "installed") entry.documentId = lastCertificate.get(entry.partId) ?? null;
  }
  const uploadStarted = Date.now();
  await uploadAll(uploads);
  if (process.env.SEED_TIMING) console.log(`uploaded ${uploads.length} certificates in ${Date.now() - uploadStarted} ms`);
  await knex.batchInsert("documents", documents, 1000);

  // The chain is computed here exactly as the app appends it, so the ledger check passes on the demo.
  let prevHash = GENESIS_HASH;
  const rows = history.entries.map((entry) => {
    const chained = chainEntry(prevHash, entry);
    prevHash = chained.hash;
    return entryToRow(chained);
  });
  await knex.batchInsert("ledger_entries", rows, 1000);
  await knex("ledger_head").where({ id: 1 }).update({ last_seq: rows.length, last_hash: prevHash });

  await knex.batchInsert(
    "fitted",
    history.fitted.map((f) => ({
      aircraft_id: f.aircraftId,
      position_id: f.positionId,
      part_id: f.partId,
      installed_seq: f.installedSeq,
      installed_at: new Date(f.installedAt),
      aircraft_minutes_at_install: f.hostMinutes,
      aircraft_cycles_at_install: f.hostCycles,
      tsn_minutes_at_install: f.tsnMinutes,
      csn_at_install: f.csn,
      tso_minutes_at_install: f.tsoMinutes,
      cso_at_install: f.cso,
    })),
    1000,
  );

  await knex.batchInsert(
    "swaps",
    history.swaps.map((s) => ({
      id: s.id,
      idempotency_key: `demo-${s.id}`,
      request_hash: "0".repeat(64),
      aircraft_id: s.aircraftId,
      position_id: s.positionId,
      removed_seq: s.removedSeq,
      installed_seq: s.installedSeq,
      performed_by: userId("technician"),
      inspected_by: s.inspected ? userId("inspector") : null,
      performed_at: new Date(s.performedAt),
      inspected_at: s.inspected ? new Date(Date.parse(s.performedAt) + 40 * 60_000) : null,
      response: JSON.stringify({ swap: { id: s.id } }),
      created_at: new Date(s.performedAt),
    })),
    1000,
  );
}
