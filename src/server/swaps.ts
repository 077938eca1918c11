import "server-only";
import { createHash, randomUUID } from "node:crypto";
import type { Knex } from "knex";
import type { User } from "lucia";
import { formatFlightTime } from "@/domain/flight-time";
import type { SwapCheckInput, SwapInput } from "@/lib/schemas/swaps";
import { db } from "./db";
import { AppError } from "./errors";
import { appendLedgerEntries, type AppendedEntry } from "./ledger";
import { assertLicenceValid } from "./licences";
import { kickOutbox, queueMail } from "./mail";
import type { AwaitingInspection, SwapCheck, SwapResponse } from "@/lib/swap-types";
import { checkClosedMonthAlertsLater } from "./reliability-alerts";
import { firstFailure, planSwap } from "./swap-checks";
import { sqlOnKnex, sqlOnPool, sqlTransaction, type Sql } from "./sql";

export interface SwapResult {
  status: 201;
  body: SwapResponse;
}

/** A stable digest of the request, so a reused Idempotency-Key with a different body is caught. */
export function requestDigest(raw: unknown): string {
  const canonical = (value: unknown): unknown =>
    Array.isArray(value)
      ? value.map(canonical)
      : value && typeof value === "object"
        ? Object.fromEntries(Object.keys(value as object).sort().map((k) => [k, canonical((value as Record<string, unknown>)[k])]))
        : value;
  return createHash("sha256").update(JSON.stringify(canonical(raw))).digest("hex");
}

async function storedAnswer(sql: Sql, key: string, digest: string): Promise<SwapResult | null> {
  const [row] = await sql.rows<{ request_hash: string; response: string }>("SELECT request_hash, response FROM swaps WHERE idempotency_key = ? LIMIT 1", [key]);
  if (!row) return null;
  if (row.request_hash !== digest) {
    throw new AppError("invalid", "This Idempotency-Key was already used for a different swap. Use a new key for a new swap.", "idempotency_key_reused", {
      "Idempotency-Key": "already used with a different body",
    });
  }
  return { status: 201, body: JSON.parse(row.response) };
}

const RETRYABLE = new Set(["ER_LOCK_DEADLOCK", "ER_LOCK_WAIT_TIMEOUT", "ER_CHECKREAD"]);

export interface RecordSwapInput {
  swap: SwapInput;
  rawBody: unknown;
  idempotencyKey: string;
  actor: User;
  /** The time of recording: the licence, the future-date and the life checks are judged at it, and it is the entries' recordedAt. */
  now?: Date;
  /** The swap's id; a new UUID unless the caller records a swap whose id is already known (the demo history). */
  id?: string;
  /**
   * The caller's transaction, for recording many swaps as one unit (the demo history): the swap is
   * written in it with the same checks, but not retried, and nothing follows the write here (no
   * outbox kick, no alert check): the caller commits, and its mail waits in the outbox until then.
   */
  trx?: Knex.Transaction;
}

/**
 * Records one off/on change as one transaction: lock and check the current state, then write both
 * units' parts rows, the snapshot, mail and both ledger entries, and last the fitted row with the
 * installation's seq (the head lock is taken late and held briefly).
 * A retry with the same Idempotency-Key returns the first answer.
 */
export async function recordSwap(input: RecordSwapInput): Promise<SwapResult> {
  const now = input.now ?? new Date();
  const digest = requestDigest(input.rawBody);
  const earlier = await storedAnswer(input.trx ? sqlOnKnex(input.trx) : sqlOnPool(), input.idempotencyKey, digest);
  if (earlier) return earlier;
  assertLicenceValid(input.actor, now);
  if (input.swap.performedAt.getTime() > now.getTime() + 5 * 60_000) {
    throw new AppError("invalid", "The swap cannot be dated in the future.", "invalid", { performedAt: "is in the future" });
  }
  if (input.trx) return writeSwap(sqlOnKnex(input.trx), input, digest, now);

  for (let attempt = 1; ; attempt++) {
    try {
      const result = await sqlTransaction((sql) => writeSwap(sql, input, digest, now));
      // Only an unscheduled removal queues mail (see writeSwap); other swaps leave the outbox alone.
      if (result.body.swap.removed && input.swap.removalType === "unscheduled") {
        kickOutbox();
        checkClosedMonthAlertsLater(now, { partIds: [result.body.swap.removed.partId] });
      }
      return result;
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (code === "ER_DUP_ENTRY" && String((error as Error).message).includes("idempotency_key")) {
        const answer = await storedAnswer(sqlOnPool(), input.idempotencyKey, digest);
        if (answer) return answer;
      }
      // Deadlocks and (on a Galera cluster) certification failures are safe to retry: nothing was written.
      if (code && RETRYABLE.has(code) && attempt < 4) continue;
      throw error;
    }
  }
}

async function writeSwap(sql: Sql, input: RecordSwapInput, digest: string, now: Date): Promise<SwapResult> {
  const { swap, actor } = input;
  const plan = await planSwap(sql, swap, { lock: true, now });
  // A retry with the same key (the same body, so the same aircraft) may have committed while we
  // waited for the aircraft lock. A plain read sees it: the transaction's snapshot is taken at its
  // first plain read, which planSwap makes after the aircraft lock is granted. A locking read here
  // would take a gap lock on the key index that concurrent swaps on other aircraft then deadlock on
  // when they insert their keys. The same key with another body (another aircraft, not serialised
  // by that lock) is caught by the unique key on insert and answered in recordSwap. (Inside a
  // caller's transaction, as in the demo seed's replay, the snapshot may be older; that replay is
  // the only writer.)
  const raced = await storedAnswer(sql, input.idempotencyKey, digest);
  if (raced) return raced;
  const refusal = firstFailure(plan);
  if (refusal) throw refusal;

  const performedAt = swap.performedAt;
  const common = {
    aircraftId: plan.aircraft.id,
    positionId: plan.position.id,
    occurredAt: performedAt.toISOString(),
    recordedAt: now,
    recordedBy: actor.id,
    aircraftMinutes: swap.aircraftHours,
    aircraftCycles: swap.aircraftCycles,
    workOrder: swap.workOrder,
    taskReference: swap.taskReference,
    documentId: null,
    correctsSeq: null,
  };

  // Both units' rows in one statement: the removed unit goes unserviceable with its totals as they
  // stand now, the installed one is installed (its totals move on only when it next comes off).
  const removed = plan.removedUnit;
  const installed = plan.installedUnit;
  if (removed && installed) {
    await sql.run(
      `UPDATE parts SET status = IF(id = ?, 'unserviceable', 'installed'), bin = NULL,
              tsn_minutes = IF(id = ?, ?, tsn_minutes), csn = IF(id = ?, ?, csn), tso_minutes = IF(id = ?, ?, tso_minutes), cso = IF(id = ?, ?, cso), updated_at = ?
        WHERE id IN (?, ?)`,
      [removed.id, removed.id, removed.totals.tsnMinutes, removed.id, removed.totals.csn, removed.id, removed.totals.tsoMinutes, removed.id, removed.totals.cso, now, removed.id, installed.id],
    );
  } else if (removed) {
    await sql.run("UPDATE parts SET status = 'unserviceable', bin = NULL, tsn_minutes = ?, csn = ?, tso_minutes = ?, cso = ?, updated_at = ? WHERE id = ?", [
      removed.totals.tsnMinutes, removed.totals.csn, removed.totals.tsoMinutes, removed.totals.cso, now, removed.id,
    ]);
  } else if (installed) {
    await sql.run("UPDATE parts SET status = 'installed', bin = NULL, updated_at = ? WHERE id = ?", [now, installed.id]);
  }
  // The snapshot becomes the aircraft's newest utilisation when it is newer than the last one.
  if (!plan.latestSnapshot || performedAt > plan.latestSnapshot.asOf) {
    await sql.run("INSERT INTO utilization (aircraft_id, as_of, total_minutes, total_cycles, recorded_by, recorded_at) VALUES (?, ?, ?, ?, ?, ?)", [
      plan.aircraft.id, performedAt, swap.aircraftHours, swap.aircraftCycles, actor.id, now,
    ]);
  }

  if (plan.removedUnit && swap.removalType === "unscheduled") {
    const engineers = await sql.rows<{ email: string }>("SELECT email FROM users WHERE role = 'reliability' AND status = 'active'");
    await queueMail(
      sql,
      engineers.map((e) => ({
        to: e.email,
        subject: `Unscheduled removal: ${plan.removedUnit!.partNumber} S/N ${plan.removedUnit!.serialNumber} from ${plan.aircraft.registration} ${plan.position.code}`,
        text: [
          `An unscheduled removal was recorded in Threadline.`,
          ``,
          `Aircraft: ${plan.aircraft.registration}, position ${plan.position.code} (${plan.position.label}), ATA ${plan.position.ataChapter}`,
          `Removed: P/N ${plan.removedUnit!.partNumber} S/N ${plan.removedUnit!.serialNumber}, TSN ${formatFlightTime(plan.removedUnit!.totals.tsnMinutes)}, CSN ${plan.removedUnit!.totals.csn}`,
          `Reason: ${swap.reason}`,
          `When: ${performedAt.toISOString()} at ${formatFlightTime(swap.aircraftHours)} aircraft hours, ${swap.aircraftCycles} cycles`,
          `Work order: ${swap.workOrder}; task ${swap.taskReference}`,
          `Recorded by: ${actor.name}${actor.licenceNumber ? ` (${actor.licenceNumber})` : ""}`,
        ].join("\n"),
      })),
      now,
    );
  }

  const entries = await appendLedgerEntries(sql, [
    ...(plan.removedUnit
      ? [{
          ...common,
          kind: "removed" as const,
          partId: plan.removedUnit.id,
          tsnMinutes: plan.removedUnit.totals.tsnMinutes,
          csn: plan.removedUnit.totals.csn,
          tsoMinutes: plan.removedUnit.totals.tsoMinutes,
          cso: plan.removedUnit.totals.cso,
          removalType: swap.removalType ?? null,
          reason: swap.reason ?? null,
          testResult: null,
          details: null,
        }]
      : []),
    ...(plan.installedUnit
      ? [{
          ...common,
          kind: "installed" as const,
          partId: plan.installedUnit.id,
          tsnMinutes: plan.installedUnit.totals.tsnMinutes,
          csn: plan.installedUnit.totals.csn,
          tsoMinutes: plan.installedUnit.totals.tsoMinutes,
          cso: plan.installedUnit.totals.cso,
          removalType: null,
          reason: null,
          testResult: swap.testResult ?? null,
          documentId: plan.installedUnit.documentId,
          details: null,
        }]
      : []),
  ]);
  const removedSeq = plan.removedUnit ? entries[0].seq : null;
  const installedSeq = plan.installedUnit ? entries[entries.length - 1].seq : null;
  // The fitted row carries the installation's seq, so it is written once the ledger has numbered it
  // (one statement under the head lock): the new unit replaces the old in its row, takes an empty
  // position's new row, or the row goes with a removal that fits nothing.
  if (installed && installedSeq) {
    const atInstall = [installed.id, installedSeq, performedAt, swap.aircraftHours, swap.aircraftCycles, installed.totals.tsnMinutes, installed.totals.csn, installed.totals.tsoMinutes, installed.totals.cso];
    if (removed) {
      await sql.run(
        `UPDATE fitted SET part_id = ?, installed_seq = ?, installed_at = ?, aircraft_minutes_at_install = ?, aircraft_cycles_at_install = ?,
                tsn_minutes_at_install = ?, csn_at_install = ?, tso_minutes_at_install = ?, cso_at_install = ?
          WHERE aircraft_id = ? AND position_id = ?`,
        [...atInstall, plan.aircraft.id, plan.position.id],
      );
    } else {
      await sql.run(
        `INSERT INTO fitted (part_id, installed_seq, installed_at, aircraft_minutes_at_install, aircraft_cycles_at_install,
                tsn_minutes_at_install, csn_at_install, tso_minutes_at_install, cso_at_install, aircraft_id, position_id)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        [...atInstall, plan.aircraft.id, plan.position.id],
      );
    }
  } else if (removed) {
    await sql.run("DELETE FROM fitted WHERE aircraft_id = ? AND position_id = ?", [plan.aircraft.id, plan.position.id]);
  }

  const id = input.id ?? randomUUID();
  const result: SwapResult = {
    status: 201,
    body: {
      swap: {
        id,
        registration: plan.aircraft.registration,
        positionCode: plan.position.code,
        performedAt: performedAt.toISOString(),
        performedBy: { id: actor.id, name: actor.name, licenceNumber: actor.licenceNumber },
        inspectionRequired: plan.position.requiresInspection,
        status: plan.position.requiresInspection ? "awaiting_inspection" : "complete",
        removed: plan.removedUnit
          ? { partId: plan.removedUnit.id, partNumber: plan.removedUnit.partNumber, serialNumber: plan.removedUnit.serialNumber, tsn: formatFlightTime(plan.removedUnit.totals.tsnMinutes), csn: plan.removedUnit.totals.csn }
          : null,
        installed: plan.installedUnit
          ? { partId: plan.installedUnit.id, partNumber: plan.installedUnit.partNumber, serialNumber: plan.installedUnit.serialNumber, tsn: formatFlightTime(plan.installedUnit.totals.tsnMinutes), csn: plan.installedUnit.totals.csn }
          : null,
      },
      entries,
    },
  };
  await sql.run(
    `INSERT INTO swaps (id, idempotency_key, request_hash, aircraft_id, position_id, removed_seq, installed_seq, performed_by, inspected_by, performed_at, inspected_at, response, created_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, NULL, ?, NULL, ?, ?)`,
    [id, input.idempotencyKey, digest, plan.aircraft.id, plan.position.id, removedSeq, installedSeq, actor.id, performedAt, JSON.stringify(result.body), now],
  );
  return result;
}

/** The pre-install checks the technician sees before anything is written (no locks, no writes). */
export async function checkSwap(swap: SwapCheckInput, now = new Date()): Promise<{ checks: SwapCheck[]; ok: boolean; fitted: { partNumber: string; serialNumber: string; cage: string } | null }> {
  const plan = await planSwap(sqlOnPool(), swap, { lock: false, now });
  return {
    checks: plan.checks,
    ok: !plan.checks.some((c) => c.level === "fail"),
    fitted: plan.fitted ? { partNumber: plan.fitted.partNumber, serialNumber: plan.fitted.serialNumber, cage: plan.fitted.cage } : null,
  };
}

/** An inspector's countersignature of a swap at a position that requires an independent inspection. */
export async function countersignSwap(input: { swapId: string; inspector: User; now?: Date; trx?: Knex.Transaction }) {
  const now = input.now ?? new Date();
  assertLicenceValid(input.inspector, now);
  const inTransaction = <T>(work: (trx: Knex.Transaction) => Promise<T>) => (input.trx ? work(input.trx) : db().transaction(work));
  return inTransaction(async (trx) => {
    const row = await trx("swaps as s").join("positions as p", "p.id", "s.position_id").where("s.id", input.swapId).forUpdate().first("s.*", "p.requires_independent_inspection");
    if (!row) throw new AppError("not_found", `Swap ${input.swapId} was not found.`);
    if (!row.requires_independent_inspection) throw new AppError("conflict", "This position does not require an independent inspection.", "inspection_not_required");
    if (row.inspected_by) throw new AppError("conflict", "This swap has already been countersigned.", "already_inspected");
    if (row.performed_by === input.inspector.id) {
      throw new AppError("conflict", "The independent inspection must be made by someone other than the technician who did the work.", "inspector_is_performer");
    }
    await trx("swaps").where({ id: input.swapId }).update({ inspected_by: input.inspector.id, inspected_at: now });
    return { swap: { id: input.swapId, status: "complete", inspectedBy: { id: input.inspector.id, name: input.inspector.name, licenceNumber: input.inspector.licenceNumber }, inspectedAt: now.toISOString() } };
  });
}

/** Swaps at positions that require an independent inspection and are not yet countersigned, oldest first. */
export async function listAwaitingInspection(): Promise<AwaitingInspection[]> {
  const rows = await db()("swaps as s")
    .join("positions as p", "p.id", "s.position_id")
    .join("aircraft as a", "a.id", "s.aircraft_id")
    .join("users as u", "u.id", "s.performed_by")
    .leftJoin("ledger_entries as r", "r.seq", "s.removed_seq")
    .leftJoin("parts as rp", "rp.id", "r.part_id")
    .leftJoin("ledger_entries as i", "i.seq", "s.installed_seq")
    .leftJoin("parts as ip", "ip.id", "i.part_id")
    .where("p.requires_independent_inspection", true)
    .whereNull("s.inspected_by")
    .orderBy("s.performed_at")
    .limit(200)
    .select("s.id", "a.registration", "p.code", "p.label", "s.performed_at", "u.name", "u.id as user_id", "rp.serial_number as removed", "ip.serial_number as installed", "i.work_order", "r.work_order as removed_work_order");
  return rows.map((row) => ({
    id: row.id,
    registration: row.registration,
    positionCode: row.code,
    positionLabel: row.label,
    performedAt: new Date(row.performed_at).toISOString(),
    performedBy: row.name,
    performedById: row.user_id,
    removed: row.removed,
    installed: row.installed,
    workOrder: row.work_order ?? row.removed_work_order,
  }));
}
