import "server-only";
import type { User } from "lucia";
import type { LedgerEntryFields } from "@/domain/ledger-types";
import type { CorrectionInput } from "@/lib/schemas/trace";
import { db } from "./db";
import { AppError, invalidField } from "./errors";
import { appendLedgerEntries, rowToEntry, type AppendedEntry } from "./ledger";
import { assertLicenceValid } from "./licences";

// A mistake in the ledger is never edited: it is mended by a `corrected` entry that names the
// entry it corrects and says why. Per the rule in src/domain/continuity.ts, the correction
// restates the whole entry (every value field), so a reader of the correction alone knows what
// the entry now says, and the original stays in the thread exactly as it was written.
//
// The correction's own `reason` column holds why it was made (the audit trail asks for that);
// the corrected entry's own reason (a removal reason, say) travels in details.entryReason.
//
// Corrections mend the record; they do not move units. The `parts` and `fitted` projections are
// left as they are: a unit physically elsewhere than recorded is a swap or a discrepancy report.

export interface CorrectionResult {
  entry: AppendedEntry & { correctsSeq: number };
  changed: string[];
}

type Restated = Pick<
  LedgerEntryFields,
  | "aircraftId" | "positionId" | "occurredAt" | "aircraftMinutes" | "aircraftCycles" | "tsnMinutes" | "csn" | "tsoMinutes" | "cso"
  | "removalType" | "workOrder" | "taskReference" | "testResult" | "documentId" | "details"
> & { entryReason: string | null };

function restatedOf(entry: LedgerEntryFields): Restated {
  const { entryReason, ...details } = entry.details ?? {};
  return {
    aircraftId: entry.aircraftId,
    positionId: entry.positionId,
    occurredAt: entry.occurredAt,
    aircraftMinutes: entry.aircraftMinutes,
    aircraftCycles: entry.aircraftCycles,
    tsnMinutes: entry.tsnMinutes,
    csn: entry.csn,
    tsoMinutes: entry.tsoMinutes,
    cso: entry.cso,
    removalType: entry.removalType,
    workOrder: entry.workOrder,
    taskReference: entry.taskReference,
    testResult: entry.testResult,
    documentId: entry.documentId,
    details: entry.details === null ? null : details,
    // A correction keeps the entry's own reason in details; an original entry in `reason`.
    entryReason: entry.kind === "corrected" ? (entryReason ?? null) : entry.reason,
  };
}

/** Appends a correction of entry `correctsSeq`, restating it with the given values changed. */
export async function recordCorrection(input: { correction: CorrectionInput; actor: User; now?: Date }): Promise<CorrectionResult> {
  const now = input.now ?? new Date();
  const c = input.correction;
  assertLicenceValid(input.actor, now);
  if (c.occurredAt && c.occurredAt.getTime() > now.getTime() + 5 * 60_000) throw invalidField("occurredAt", "cannot be in the future");

  return db().transaction(async (trx) => {
    const named = await trx("ledger_entries").where({ seq: c.correctsSeq }).first();
    if (!named) throw invalidField("correctsSeq", `there is no ledger entry seq ${c.correctsSeq}`);
    // A correction of a correction applies to the original: find it, and the entry as it stands now.
    let root = named;
    for (let hops = 0; root.kind === "corrected" && root.corrects_seq !== null && hops < 1000; hops++) {
      root = await trx("ledger_entries").where({ seq: root.corrects_seq }).first();
      if (!root) throw invalidField("correctsSeq", `seq ${c.correctsSeq} corrects an entry that does not exist`);
    }
    const latest = await trx("ledger_entries")
      .where({ part_id: root.part_id, kind: "corrected" })
      .andWhere("seq", ">", root.seq)
      .orderBy("seq")
      .select("*")
      .then((rows) => {
        // Follow the chain of corrections that lead back to this root; keep the newest.
        const inChain = new Set<number>([Number(root.seq)]);
        let newest = root;
        for (const row of rows) {
          if (row.corrects_seq !== null && inChain.has(Number(row.corrects_seq))) {
            inChain.add(Number(row.seq));
            newest = row;
          }
        }
        return newest;
      });
    const base = restatedOf(rowToEntry(latest));
    const next: Restated = { ...base, details: base.details === null ? null : { ...base.details } };

    if (c.registration !== undefined || c.positionCode !== undefined) {
      const registration = c.registration !== undefined ? c.registration : base.aircraftId === null ? null : (await trx("aircraft").where({ id: base.aircraftId }).first("registration"))?.registration ?? null;
      if (registration === null) {
        if (c.positionCode) throw invalidField("positionCode", "a position needs an aircraft: give the registration too");
        next.aircraftId = null;
        next.positionId = null;
      } else {
        const aircraft = await trx("aircraft").where({ registration }).first("id", "aircraft_type_id");
        if (!aircraft) throw invalidField("registration", `${registration} is not in the fleet`);
        next.aircraftId = aircraft.id;
        const code = c.positionCode !== undefined ? c.positionCode : base.positionId === null ? null : (await trx("positions").where({ id: base.positionId }).first("code"))?.code ?? null;
        if (code === null) next.positionId = null;
        else {
          const position = await trx("positions").where({ aircraft_type_id: aircraft.aircraft_type_id, code: code.toUpperCase() }).first("id");
          if (!position) throw invalidField("positionCode", `${registration} has no position ${code}`);
          next.positionId = position.id;
        }
      }
    }
    if (c.occurredAt !== undefined) next.occurredAt = c.occurredAt.toISOString();
    if (c.aircraftHours !== undefined) next.aircraftMinutes = c.aircraftHours;
    if (c.aircraftCycles !== undefined) next.aircraftCycles = c.aircraftCycles;
    if (c.tsn !== undefined) next.tsnMinutes = c.tsn;
    if (c.csn !== undefined) next.csn = c.csn;
    if (c.tso !== undefined) next.tsoMinutes = c.tso;
    if (c.cso !== undefined) next.cso = c.cso;
    if (c.removalType !== undefined) next.removalType = c.removalType;
    if (c.workOrder !== undefined) next.workOrder = c.workOrder;
    if (c.taskReference !== undefined) next.taskReference = c.taskReference;
    if (c.testResult !== undefined) next.testResult = c.testResult;
    if (c.entryReason !== undefined) next.entryReason = c.entryReason;
    if (c.documentId !== undefined) {
      if (c.documentId !== null && !(await trx("documents").where({ id: c.documentId }).first("id"))) {
        throw invalidField("documentId", `there is no document ${c.documentId}`);
      }
      next.documentId = c.documentId;
    }

    const changed = (Object.keys(next) as Array<keyof Restated>).filter((key) => JSON.stringify(next[key]) !== JSON.stringify(base[key]));
    if (changed.length === 0) {
      throw new AppError("invalid", `Nothing to correct: the values given are what seq ${root.seq} already says.`, "nothing_to_correct", { correctsSeq: "the correction changes no value" });
    }

    const { entryReason, details, ...values } = next;
    const detailsOut = entryReason === null ? details : { ...(details ?? {}), entryReason };
    const [entry] = await appendLedgerEntries(trx, [
      {
        ...values,
        kind: "corrected",
        partId: Number(root.part_id),
        recordedBy: input.actor.id,
        reason: c.reason,
        correctsSeq: c.correctsSeq,
        details: detailsOut,
      },
    ]);
    return { entry: { ...entry, correctsSeq: c.correctsSeq }, changed };
  });
}
