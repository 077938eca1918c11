// Records the simulated two years (seeds/lib/history.ts) in time order, through the app's own code:
// every swap through recordSwap (the same pre-install checks, ledger append, fitted projection, part
// updates and outbox mail as POST /api/swaps) and its countersignature through countersignSwap.
// Everything else (receipts, the take-over of the units fitted when the records start, returns to
// stores, shop visits, daily utilisation) is written between the swaps, its entries through the
// ledger's own appendLedgerEntries, so the chain is the app's and seq follows time.
//
// A swap the app refuses stops the seed: the simulation must not pick a unit the app would not let a
// technician fit. The records go in a calendar month per transaction (recordSwap and countersignSwap
// take the caller's transaction), so the demo is not paid for with a disk flush per swap.
//
// Run by seed 03 in a child process under `--conditions=react-server` (see seeds/lib/server-script.ts).
import { formatFlightTime } from "@/domain/flight-time";
import { SwapSchema } from "@/lib/schemas/swaps";
import { closeDatabase, db } from "@/server/db";
import { appendLedgerEntries, type NewLedgerEntry } from "@/server/ledger";
import { lastOutboxId, withdrawQueuedMail } from "@/server/mail";
import { countersignSwap, recordSwap } from "@/server/swaps";
import { checkFindingCounts, getPartFindings } from "@/server/trace";
import type { Knex } from "knex";
import { simulateHistory, type HistoryEvent, type SimulatedSwap } from "../lib/history";
import { historyCertificates, type HistoryCertificate } from "../lib/history-certificates";
import { demoActor, WITHDRAWN_MAIL_REASON } from "./support";

/** Entries are recorded this long after the work (the technician or the stores clerk at the terminal). */
const RECORDING_DELAY_MS = 20 * 60_000;
/** The independent inspector countersigns this long after the work. */
const INSPECTION_DELAY_MS = 40 * 60_000;

const timing = Boolean(process.env.SEED_TIMING);
const log = (message: string) => timing && console.log(`[seed 03] ${message}`);
const started = Date.now();

const hm = (minutes: number) => formatFlightTime(minutes);
const demoSwapId = (number: number) => `00000000-0000-4000-8000-${String(number).padStart(12, "0")}`;

async function main() {
  const [technician, inspector, stores] = await Promise.all([demoActor(db(), "technician"), demoActor(db(), "inspector"), demoActor(db(), "stores")]);
  const { events } = simulateHistory({ technician: technician.id, inspector: inspector.id, stores: stores.id });
  log(`simulated ${events.length} events in ${Date.now() - started} ms`);

  // Every receipt and every return from repair comes with its release certificate; seed 03 uploads the files.
  const certificateOf = historyCertificates(events);

  const removalSeqOf = new Map<number, number>(); // swap number -> seq of its removed entry
  const lastCertificate = new Map<number, number>(); // part id -> document id
  let swaps = 0;
  let countersigned = 0;
  let withdrawn = 0;

  // A month of records per transaction, in time order. Mail the swaps queue is withdrawn before
  // each commit, so no process ever sees it as due.
  const months = new Map<string, HistoryEvent[]>();
  for (const event of events) {
    const month = new Date(event.at).toISOString().slice(0, 7);
    if (!months.has(month)) months.set(month, []);
    months.get(month)!.push(event);
  }
  for (const monthEvents of months.values()) {
    await db().transaction(async (trx: Knex.Transaction) => {
      const mailBefore = await lastOutboxId(trx);
      let batch = newBatch();
      for (const event of monthEvents) {
        if (event.type !== "swap") {
          addToBatch(batch, event, { certificateOf, lastCertificate, removalSeqOf, stores });
          continue;
        }
        await flush(trx, batch);
        batch = newBatch();
        removalSeqOf.set(event.swap.number, await recordHistorySwap(trx, event.swap, event.at, technician));
        swaps++;
        if (event.swap.requiresInspection) {
          await countersignSwap({ swapId: demoSwapId(event.swap.number), inspector, now: new Date(event.at + INSPECTION_DELAY_MS), trx });
          countersigned++;
        }
      }
      await flush(trx, batch);
      withdrawn += await withdrawQueuedMail({ afterId: mailBefore, reason: WITHDRAWN_MAIL_REASON }, trx);
    });
  }
  log(`recorded ${swaps} swaps (${countersigned} countersigned) and withdrew the ${withdrawn} mails they queued, all in ${Date.now() - started} ms`);

  // The history must be continuous as the auditor's trace judges it: the demo's one finding is the
  // deliberate one seed 04 adds, not a flaw of the simulation.
  const partIds = events.flatMap((e) => (e.type === "received" ? [e.part.id] : []));
  const flawed = [...(await checkFindingCounts(partIds))].filter(([, count]) => count > 0);
  if (flawed.length) {
    const examples = await Promise.all(flawed.slice(0, 5).map(async ([partId]) => `part ${partId}: ${(await getPartFindings(partId)).map((f) => f.message).join(" ")}`));
    throw new Error(`the simulated history has continuity findings on ${flawed.length} units, e.g.\n${examples.join("\n")}`);
  }
  log(`checked the threads of ${partIds.length} units: no findings, in ${Date.now() - started} ms`);
}

/** One swap as the technician sends it to POST /api/swaps, parsed and recorded the same way. */
async function recordHistorySwap(trx: Knex.Transaction, swap: SimulatedSwap, performedAt: number, technician: Awaited<ReturnType<typeof demoActor>>): Promise<number> {
  const body = {
    registration: swap.registration,
    positionCode: swap.positionCode,
    aircraftHours: hm(swap.hostMinutes),
    aircraftCycles: swap.hostCycles,
    performedAt: new Date(performedAt).toISOString(),
    removed: { partNumber: swap.removed.partNumber, serialNumber: swap.removed.serialNumber },
    installed: { partNumber: swap.installed.partNumber, serialNumber: swap.installed.serialNumber },
    removalType: swap.removalType,
    reason: swap.reason,
    workOrder: swap.workOrder,
    taskReference: swap.taskReference,
    testResult: swap.testResult,
  };
  const id = demoSwapId(swap.number);
  let result;
  try {
    result = await recordSwap({ swap: SwapSchema.parse(body), rawBody: body, idempotencyKey: `demo-${id}`, actor: technician, now: new Date(performedAt + RECORDING_DELAY_MS), id, trx });
  } catch (error) {
    throw new Error(`the app refused demo swap ${swap.number} (${JSON.stringify(body)}): ${(error as Error).message}`, { cause: error });
  }
  const removed = result.body.swap.removed!;
  // The stock entries that follow carry the simulation's times for the removed unit: they must be the app's.
  if (removed.tsn !== hm(swap.removed.tsnMinutes) || removed.csn !== swap.removed.csn) {
    throw new Error(`demo swap ${swap.number}: the app computed TSN ${removed.tsn} CSN ${removed.csn} for S/N ${removed.serialNumber}, the simulation ${hm(swap.removed.tsnMinutes)} / ${swap.removed.csn}`);
  }
  return result.body.entries.find((e) => e.kind === "removed")!.seq;
}

// ---------------------------------------------------------------------------------------
// Everything between two swaps, written together just before the next one

interface Batch {
  parts: Map<number, Record<string, unknown>>; // inserted in this batch, by id
  partUpdates: Map<number, Record<string, unknown>>;
  documents: Array<Record<string, unknown>>;
  entries: NewLedgerEntry[];
  fitted: Array<{ index: number; row: Record<string, unknown> }>; // index into entries
  utilisation: Array<Record<string, unknown>>;
}

function newBatch(): Batch {
  return { parts: new Map(), partUpdates: new Map(), documents: [], entries: [], fitted: [], utilisation: [] };
}

function addToBatch(
  batch: Batch,
  event: Exclude<HistoryEvent, { type: "swap" }>,
  context: {
    certificateOf: Map<HistoryEvent, HistoryCertificate>;
    lastCertificate: Map<number, number>;
    removalSeqOf: Map<number, number>;
    stores: { id: string };
  },
) {
  const at = new Date(event.at);
  const recordedAt = new Date(event.at + RECORDING_DELAY_MS);
  const updatePart = (partId: number, fields: Record<string, unknown>) => {
    const target = batch.parts.get(partId) ?? batch.partUpdates.get(partId) ?? (batch.partUpdates.set(partId, {}), batch.partUpdates.get(partId)!);
    Object.assign(target, fields, { updated_at: recordedAt });
  };
  const document = (partId: number) => {
    const doc = context.certificateOf.get(event)!;
    batch.documents.push({
      id: doc.id,
      part_id: partId,
      kind: "release_certificate",
      form_type: doc.id % 3 === 0 ? "easa_form_1" : "faa_8130_3",
      tracking_number: doc.trackingNumber,
      status_work: doc.certificate.statusWork,
      issuer_name: doc.certificate.issuerName,
      issuer_approval: doc.certificate.issuerApproval,
      issued_on: doc.issuedOn,
      object_key: doc.key,
      sha256: doc.sha256,
      size_bytes: doc.body.length,
      content_type: "application/pdf",
      original_name: `${doc.trackingNumber}.pdf`,
      uploaded_by: context.stores.id,
      uploaded_at: recordedAt,
    });
    context.lastCertificate.set(partId, doc.id);
    return doc.id;
  };

  switch (event.type) {
    case "received": {
      const p = event.part;
      batch.parts.set(p.id, {
        id: p.id,
        part_number_id: p.partNumberId,
        serial_number: p.serialNumber,
        status: "serviceable",
        bin: p.bin,
        manufactured_on: p.manufacturedOn,
        tsn_minutes: p.tsnMinutes,
        csn: p.csn,
        tso_minutes: p.tsoMinutes,
        cso: p.cso,
        updated_at: recordedAt,
      });
      batch.entries.push({ ...event.entry, documentId: document(p.id), recordedAt });
      break;
    }
    case "taken_over": {
      // Fitted before the records start: the entry cites the certificate the unit came in with.
      const partId = event.entry.partId;
      const index = batch.entries.push({ ...event.entry, documentId: context.lastCertificate.get(partId) ?? null, recordedAt }) - 1;
      updatePart(partId, { status: "installed", bin: null });
      const e = event.entry;
      batch.fitted.push({
        index,
        row: {
          aircraft_id: e.aircraftId,
          position_id: e.positionId,
          part_id: partId,
          installed_at: at,
          aircraft_minutes_at_install: e.aircraftMinutes,
          aircraft_cycles_at_install: e.aircraftCycles,
          tsn_minutes_at_install: e.tsnMinutes,
          csn_at_install: e.csn,
          tso_minutes_at_install: e.tsoMinutes,
          cso_at_install: e.cso,
        },
      });
      break;
    }
    case "stock": {
      const removedSeq = context.removalSeqOf.get(event.removal);
      if (removedSeq === undefined) throw new Error(`stock entry for swap ${event.removal} before the swap was recorded`);
      const partId = event.entry.partId;
      const details = { ...(event.entry.details ?? {}) };
      if (event.entry.kind === "returned") details.tag = `U/S tag ${removedSeq}`;
      if (event.entry.kind === "sent_for_repair" || event.entry.kind === "repaired") details.repairOrder = `RO-${40000 + removedSeq}`;
      if (event.entry.kind === "repaired") details.removalSeq = String(removedSeq);
      if (event.state.bin) details.bin = event.state.bin;
      const documentId = event.certificate ? document(partId) : null;
      batch.entries.push({ ...event.entry, details, documentId, recordedAt });
      updatePart(partId, { status: event.state.status, bin: event.state.bin, ...(event.state.overhauled ? { tso_minutes: 0, cso: 0 } : {}) });
      break;
    }
    case "utilisation":
      batch.utilisation.push({ aircraft_id: event.aircraftId, as_of: at, total_minutes: event.minutes, total_cycles: event.cycles, recorded_by: null, recorded_at: at });
      break;
  }
}

async function flush(trx: Knex.Transaction, batch: Batch): Promise<void> {
  if (batch.parts.size) await trx.batchInsert("parts", [...batch.parts.values()], 500).transacting(trx);
  if (batch.documents.length) await trx.batchInsert("documents", batch.documents, 500).transacting(trx);
  await updateParts(trx, batch.partUpdates);
  const appended = await appendLedgerEntries(trx, batch.entries);
  if (batch.fitted.length) {
    await trx.batchInsert("fitted", batch.fitted.map((f) => ({ ...f.row, installed_seq: appended[f.index].seq })), 500).transacting(trx);
  }
  if (batch.utilisation.length) await trx.batchInsert("utilization", batch.utilisation, 1000).transacting(trx);
}

/** The batch's changes to units already on record, as one UPDATE (a CASE per column). */
async function updateParts(trx: Knex.Transaction, updates: Map<number, Record<string, unknown>>) {
  if (!updates.size) return;
  const ids = [...updates.keys()];
  const columns = [...new Set([...updates.values()].flatMap((fields) => Object.keys(fields)))];
  const sets: string[] = [];
  const bindings: unknown[] = [];
  for (const column of columns) {
    const cases = ids.filter((id) => column in updates.get(id)!);
    sets.push(`?? = CASE ?? ${cases.map(() => "WHEN ? THEN ?").join(" ")} ELSE ?? END`);
    bindings.push(column, "id", ...cases.flatMap((id) => [id, updates.get(id)![column]]), column);
  }
  await trx.raw(`UPDATE parts SET ${sets.join(", ")} WHERE id IN (${ids.map(() => "?").join(", ")})`, [...bindings, ...ids] as Knex.RawBinding[]);
}

main()
  .then(async () => {
    await closeDatabase();
  })
  .catch(async (error) => {
    console.error(error);
    await closeDatabase().catch(() => {});
    process.exit(1);
  });
