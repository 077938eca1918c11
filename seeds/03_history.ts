import type { Knex } from "knex";
import { GENESIS_HASH, chainEntry } from "../src/domain/ledger-hash";
import { DEMO_USERS, DEMO_NOW } from "./lib/demo";
import { simulateHistory } from "./lib/history";

const userId = (role: string) => DEMO_USERS.find((u) => u.role === role)!.id;

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

  // The chain is computed here exactly as the app appends it, so the ledger check passes on the demo.
  let prevHash = GENESIS_HASH;
  const rows = history.entries.map((entry) => {
    const chained = chainEntry(prevHash, entry);
    prevHash = chained.hash;
    return {
      seq: entry.seq,
      kind: entry.kind,
      part_id: entry.partId,
      aircraft_id: entry.aircraftId,
      position_id: entry.positionId,
      occurred_at: new Date(entry.occurredAt),
      recorded_at: new Date(entry.recordedAt),
      recorded_by: entry.recordedBy,
      aircraft_minutes: entry.aircraftMinutes,
      aircraft_cycles: entry.aircraftCycles,
      tsn_minutes: entry.tsnMinutes,
      csn: entry.csn,
      tso_minutes: entry.tsoMinutes,
      cso: entry.cso,
      removal_type: entry.removalType,
      reason: entry.reason,
      work_order: entry.workOrder,
      task_reference: entry.taskReference,
      test_result: entry.testResult,
      document_id: entry.documentId,
      corrects_seq: entry.correctsSeq,
      details: entry.details ? JSON.stringify(entry.details) : null,
      prev_hash: chained.prevHash,
      hash: chained.hash,
    };
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
