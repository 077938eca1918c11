import { describe, expect, it } from "vitest";
import { checkSwapRecord, type SwapRecord } from "../../src/domain/record-completeness";
import { testDb } from "../support/api";

// Every demo swap's record, read straight from the tables the swap writes (swaps, its ledger
// entries, the users who signed), must carry each element of 14 CFR 43.9(a) (from memory).
describe("record completeness of the demo swaps", () => {
  it("finds every 43.9(a) element in every demo swap", async () => {
    const swaps = await testDb()("swaps as s")
      .join("positions as p", "p.id", "s.position_id")
      .leftJoin("users as pu", "pu.id", "s.performed_by")
      .leftJoin("users as iu", "iu.id", "s.inspected_by")
      .where("s.idempotency_key", "like", "demo-%")
      .select("s.id", "s.removed_seq", "s.installed_seq", "s.performed_at", "s.performed_by", "s.inspected_by", "s.inspected_at", "p.requires_independent_inspection", "pu.name as performer_name", "pu.licence_number as performer_licence", "iu.name as inspector_name", "iu.licence_number as inspector_licence");
    expect(swaps.length).toBeGreaterThan(500);
    const seqs = swaps.flatMap((s) => [s.removed_seq, s.installed_seq]).filter((seq) => seq !== null);
    const entries = new Map<number, Record<string, any>>();
    for (let i = 0; i < seqs.length; i += 1000) {
      for (const row of await testDb()("ledger_entries").whereIn("seq", seqs.slice(i, i + 1000)).select("seq", "kind", "work_order", "task_reference", "occurred_at", "recorded_by")) entries.set(Number(row.seq), row);
    }

    const problems: string[] = [];
    for (const s of swaps) {
      const record: SwapRecord = {
        swapId: s.id,
        performedAt: s.performed_at ? new Date(s.performed_at).toISOString() : null,
        performedBy: s.performed_by ? { userId: s.performed_by, name: s.performer_name, licenceNumber: s.performer_licence } : null,
        inspectionRequired: Boolean(s.requires_independent_inspection),
        inspectedBy: s.inspected_by ? { userId: s.inspected_by, name: s.inspector_name, licenceNumber: s.inspector_licence } : null,
        inspectedAt: s.inspected_at ? new Date(s.inspected_at).toISOString() : null,
        entries: [s.removed_seq, s.installed_seq]
          .filter((seq) => seq !== null)
          .map((seq) => entries.get(Number(seq)))
          .filter((row): row is Record<string, any> => Boolean(row))
          .map((row) => ({ seq: Number(row.seq), kind: row.kind, workOrder: row.work_order, taskReference: row.task_reference, occurredAt: new Date(row.occurred_at).toISOString(), recordedBy: row.recorded_by })),
      };
      for (const issue of checkSwapRecord(record)) problems.push(`${issue.rule}: ${issue.message}`);
    }
    expect(problems.slice(0, 20)).toEqual([]);
  });
});
