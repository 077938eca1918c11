// The demo's one deliberate continuity finding, for auditors to find on a fitted unit.
//
// The simulated history is continuous (seed 03 records it through the app's own checks), so the
// trace and the position map would show no finding at all. This adds exactly one, the way it happens
// in practice: a transponder comes back into stores from a pool exchange with a certificate quoting
// lower times than its own record, the receipt is booked with the certificate's figures, and the
// unit is then fitted on an aircraft through an ordinary swap (the swap's checks look at status,
// certificate, eligibility and life, not at the unit's past). The continuity check flags the time
// regression at the receipt, on the unit's trace and at its position on the aircraft's map.
//
// The receipt of a unit already on record has no route in the app, so it is appended here with the
// ledger's own appendLedgerEntries (and the `parts` row kept on the receipt's values); the swap goes
// through recordSwap like any other. Run by seed 04 under `--conditions=react-server`.
import { formatFlightTime } from "@/domain/flight-time";
import { SwapSchema } from "@/lib/schemas/swaps";
import { closeDatabase, db } from "@/server/db";
import { appendLedgerEntries } from "@/server/ledger";
import { lastOutboxId, withdrawQueuedMail } from "@/server/mail";
import { putObject } from "@/server/storage";
import { recordSwap } from "@/server/swaps";
import type { Knex } from "knex";
import { DEMO_FINDING, DEMO_FINDING_PART_NUMBER } from "../lib/demo-finding";
import { demoCertificatePdf, sha256 } from "../lib/certificates";
import { DEMO_NOW } from "../lib/demo";
import { demoActor, WITHDRAWN_MAIL_REASON } from "./support";

async function main() {
  const [stores, technician] = await Promise.all([demoActor(db(), "stores"), demoActor(db(), "technician")]);
  // A serviceable unit in stores that has flown on the most airframes (lowest id on a tie), so its
  // thread is worth tracing; the same unit on every run, as the history is deterministic.
  const unit = await db()("parts as pt")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .leftJoin("fitted as f", "f.part_id", "pt.id")
    .where({ "pn.part_number": DEMO_FINDING_PART_NUMBER, "pt.status": "serviceable" })
    .whereNull("f.part_id")
    .select("pt.id", "pt.serial_number", "pt.tsn_minutes", "pt.csn", "pt.tso_minutes", "pt.cso", "pn.part_number")
    .select(db().raw("(select count(distinct le.aircraft_id) from ledger_entries le where le.part_id = pt.id and le.kind = 'installed') as airframes"))
    .orderBy([{ column: "airframes", order: "desc" }, { column: "pt.id", order: "asc" }])
    .first();
  if (!unit) throw new Error(`seed 04: no serviceable ${DEMO_FINDING_PART_NUMBER} in stores to give the demo finding`);
  const last = await db()("ledger_entries").where({ part_id: unit.id }).orderBy("seq", "desc").first("occurred_at");
  const receivedAt = new Date(Math.max(DEMO_NOW.getTime() - 26 * 3_600_000, new Date(last.occurred_at).getTime() + 3_600_000));
  const recordedAt = new Date(receivedAt.getTime() + 20 * 60_000);

  const tsn = Math.max(0, Number(unit.tsn_minutes) - DEMO_FINDING.tsnShortfallMinutes);
  const csn = Math.max(0, Number(unit.csn) - DEMO_FINDING.csnShortfall);
  const body = demoCertificatePdf([
    "AUTHORISED RELEASE CERTIFICATE (demo document, invented)",
    `Form tracking number: ${DEMO_FINDING.trackingNumber}`,
    "Organisation: Harbourline Repair Services (QA.145.0047)",
    `Part number: ${unit.part_number}   Serial number: ${unit.serial_number}`,
    "Status/work: inspected/tested",
    `Remarks: TSN ${formatFlightTime(tsn)}, CSN ${csn} as stated by the pool`,
    `Date: ${receivedAt.toISOString().slice(0, 10)}`,
  ]);
  const key = "certificates/demo-pool-exchange-0417.pdf";
  await putObject(key, body, "application/pdf", { sha256: sha256(body) });

  await db().transaction(async (trx: Knex.Transaction) => {
    const [documentId] = await trx("documents").insert({
      part_id: unit.id,
      kind: "release_certificate",
      form_type: "easa_form_1",
      tracking_number: DEMO_FINDING.trackingNumber,
      status_work: "inspected_tested",
      issuer_name: "Harbourline Repair Services",
      issuer_approval: "QA.145.0047",
      issued_on: receivedAt.toISOString().slice(0, 10),
      object_key: key,
      sha256: sha256(body),
      size_bytes: body.length,
      content_type: "application/pdf",
      original_name: `${DEMO_FINDING.trackingNumber}.pdf`,
      uploaded_by: stores.id,
      uploaded_at: recordedAt,
    });
    // Deliberate: the receipt states lower times than the unit's own record (the demo finding).
    await appendLedgerEntries(trx, [
      {
        kind: "received",
        partId: unit.id,
        aircraftId: null,
        positionId: null,
        occurredAt: receivedAt.toISOString(),
        recordedAt,
        recordedBy: stores.id,
        aircraftMinutes: null,
        aircraftCycles: null,
        tsnMinutes: tsn,
        csn,
        tsoMinutes: unit.tso_minutes === null ? null : Number(unit.tso_minutes),
        cso: unit.cso === null ? null : Number(unit.cso),
        removalType: null,
        reason: DEMO_FINDING.reason,
        workOrder: null,
        taskReference: null,
        testResult: null,
        documentId: Number(documentId),
        correctsSeq: null,
        details: { bin: "S1-C4", statusWork: "inspected_tested", note: "Times booked as stated on the pool's certificate" },
      },
    ]);
    await trx("parts").where({ id: unit.id }).update({ status: "serviceable", bin: "S1-C4", tsn_minutes: tsn, csn, updated_at: recordedAt });
  });

  // Fitted at the first transponder position of the fleet, on the night stop after the aircraft's
  // latest totals were recorded, in place of a transponder the crew reported.
  const target = await db()("fitted as f")
    .join("aircraft as a", "a.id", "f.aircraft_id")
    .join("positions as p", "p.id", "f.position_id")
    .join("parts as pt", "pt.id", "f.part_id")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .where({ "p.code": DEMO_FINDING.positionCode, "pn.part_number": DEMO_FINDING_PART_NUMBER })
    .orderBy("a.registration")
    .first("a.id as aircraft_id", "a.registration", "pt.serial_number", "pn.part_number");
  if (!target) throw new Error(`seed 04: no ${DEMO_FINDING_PART_NUMBER} fitted at ${DEMO_FINDING.positionCode} to exchange`);
  const latest = await db()("utilization").where({ aircraft_id: target.aircraft_id }).orderBy("as_of", "desc").first();
  const performedAt = new Date(Math.max(recordedAt.getTime(), new Date(latest.as_of).getTime()) + 30 * 60_000);
  const swapBody = {
    registration: target.registration,
    positionCode: DEMO_FINDING.positionCode,
    aircraftHours: formatFlightTime(Number(latest.total_minutes)),
    aircraftCycles: Number(latest.total_cycles),
    performedAt: performedAt.toISOString(),
    removed: { partNumber: target.part_number, serialNumber: target.serial_number },
    installed: { partNumber: unit.part_number, serialNumber: unit.serial_number },
    removalType: "unscheduled",
    reason: "Intermittent transponder reply reported by the crew",
    workOrder: "WO-27001",
    taskReference: "AMM task per the position's maintenance manual reference",
    testResult: "Transponder test from the maintenance computer: passed",
  };
  await db().transaction(async (trx: Knex.Transaction) => {
    const mailBefore = await lastOutboxId(trx);
    await recordSwap({
      swap: SwapSchema.parse(swapBody),
      rawBody: swapBody,
      idempotencyKey: "demo-finding-pool-exchange",
      actor: technician,
      now: new Date(performedAt.getTime() + 20 * 60_000),
      id: "00000000-0000-4000-8000-100000000001",
      trx,
    });
    await withdrawQueuedMail({ afterId: mailBefore, reason: WITHDRAWN_MAIL_REASON }, trx);
  });
}

main()
  .then(() => closeDatabase())
  .catch(async (error) => {
    console.error(error);
    await closeDatabase().catch(() => {});
    process.exit(1);
  });
