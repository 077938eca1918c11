import type { Knex } from "knex";
import { chainEntry } from "../src/domain/ledger-hash";
import type { LedgerEntryFields } from "../src/domain/ledger-types";
import { demoCertificatePdf, sha256, uploadAll } from "./lib/certificates";
import { DEMO_NOW, DEMO_USERS } from "./lib/demo";

// The simulated history is continuous by construction, so the trace demo would show no finding at
// all. This seed adds exactly one, the way it happens in practice: a transponder comes back into
// stores from a pool exchange with a certificate quoting lower times than its own record, and the
// receipt is booked with the certificate's figures. The continuity check flags the time regression.
//
// It appends through the same chain as the app (the head row, locked; chainEntry) and keeps the
// `parts` row on the receipt's values, so the ledger check passes and the projection holds.

/** The part number of the unit given the finding; chosen because no test draws its spares from it. */
export const DEMO_FINDING_PART_NUMBER = "QF-3452-10";
/** How much lower the receipt's times are than the unit's record. */
const TSN_SHORTFALL_MINUTES = 150 * 60;
const CSN_SHORTFALL = 90;

const storesUser = DEMO_USERS.find((u) => u.role === "stores")!.id;

export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    // A serviceable unit in stores that has flown on the most airframes (lowest id on a tie), so its
    // thread is worth tracing; the same unit on every run, as the history is deterministic.
    const unit = await trx("parts as pt")
      .join("part_numbers as pn", "pn.id", "pt.part_number_id")
      .leftJoin("fitted as f", "f.part_id", "pt.id")
      .where({ "pn.part_number": DEMO_FINDING_PART_NUMBER, "pt.status": "serviceable" })
      .whereNull("f.part_id")
      .select("pt.id", "pt.serial_number", "pt.tsn_minutes", "pt.csn", "pt.tso_minutes", "pt.cso", "pn.part_number")
      .select(trx.raw("(select count(distinct le.aircraft_id) from ledger_entries le where le.part_id = pt.id and le.kind = 'installed') as airframes"))
      .orderBy([{ column: "airframes", order: "desc" }, { column: "pt.id", order: "asc" }])
      .first();
    if (!unit) throw new Error(`seed 04: no serviceable ${DEMO_FINDING_PART_NUMBER} in stores to give the demo finding`);
    const last = await trx("ledger_entries").where({ part_id: unit.id }).orderBy("seq", "desc").first("occurred_at");
    const lastAt = new Date(last.occurred_at).getTime();
    const occurredAt = new Date(Math.max(DEMO_NOW.getTime() - 26 * 3_600_000, lastAt + 3_600_000));

    const tsn = Math.max(0, Number(unit.tsn_minutes) - TSN_SHORTFALL_MINUTES);
    const csn = Math.max(0, Number(unit.csn) - CSN_SHORTFALL);
    const tracking = "RC-POOL-0417";
    const body = demoCertificatePdf([
      "AUTHORISED RELEASE CERTIFICATE (demo document, invented)",
      `Form tracking number: ${tracking}`,
      "Organisation: Harbourline Repair Services (QA.145.0047)",
      `Part number: ${unit.part_number}   Serial number: ${unit.serial_number}`,
      "Status/work: inspected/tested",
      `Remarks: TSN ${Math.floor(tsn / 60)}:${String(tsn % 60).padStart(2, "0")}, CSN ${csn} as stated by the pool`,
      `Date: ${occurredAt.toISOString().slice(0, 10)}`,
    ]);
    const key = "certificates/demo-pool-exchange-0417.pdf";
    await uploadAll([{ key, body }]);
    const [documentId] = await trx("documents").insert({
      kind: "release_certificate",
      form_type: "easa_form_1",
      tracking_number: tracking,
      status_work: "inspected_tested",
      issuer_name: "Harbourline Repair Services",
      issuer_approval: "QA.145.0047",
      issued_on: occurredAt.toISOString().slice(0, 10),
      object_key: key,
      sha256: sha256(body),
      size_bytes: body.length,
      content_type: "application/pdf",
      original_name: `${tracking}.pdf`,
      uploaded_by: storesUser,
      uploaded_at: occurredAt,
    });

    const head = await trx("ledger_head").where({ id: 1 }).forUpdate().first("last_seq", "last_hash");
    const fields: LedgerEntryFields = {
      seq: Number(head.last_seq) + 1,
      kind: "received",
      partId: unit.id,
      aircraftId: null,
      positionId: null,
      occurredAt: occurredAt.toISOString(),
      recordedAt: new Date(occurredAt.getTime() + 20 * 60_000).toISOString(),
      recordedBy: storesUser,
      aircraftMinutes: null,
      aircraftCycles: null,
      tsnMinutes: tsn,
      csn,
      tsoMinutes: unit.tso_minutes === null ? null : Number(unit.tso_minutes),
      cso: unit.cso === null ? null : Number(unit.cso),
      removalType: null,
      reason: "Received back from a pool exchange",
      workOrder: null,
      taskReference: null,
      testResult: null,
      documentId: Number(documentId),
      correctsSeq: null,
      details: { bin: "S1-C4", statusWork: "inspected_tested", note: "Times booked as stated on the pool's certificate" },
    };
    const chained = chainEntry(head.last_hash, fields);
    await trx("ledger_entries").insert({
      seq: chained.seq,
      kind: chained.kind,
      part_id: chained.partId,
      aircraft_id: null,
      position_id: null,
      occurred_at: occurredAt,
      recorded_at: new Date(chained.recordedAt),
      recorded_by: chained.recordedBy,
      aircraft_minutes: null,
      aircraft_cycles: null,
      tsn_minutes: chained.tsnMinutes,
      csn: chained.csn,
      tso_minutes: chained.tsoMinutes,
      cso: chained.cso,
      removal_type: null,
      reason: chained.reason,
      work_order: null,
      task_reference: null,
      test_result: null,
      document_id: chained.documentId,
      corrects_seq: null,
      details: JSON.stringify(chained.details),
      prev_hash: chained.prevHash,
      hash: chained.hash,
    });
    await trx("ledger_head").where({ id: 1 }).update({ last_seq: chained.seq, last_hash: chained.hash });
    await trx("parts").where({ id: unit.id }).update({ status: "serviceable", bin: "S1-C4", tsn_minutes: tsn, csn, updated_at: DEMO_NOW });
  });
}
