import { describe, expect, it } from "vitest";
import { checkSwapRecord, RULE_43_9_A_1, RULE_43_9_A_2, RULE_43_9_A_3, RULE_43_9_A_4, type SwapRecord } from "@/domain/record-completeness";

// Hand-built records with invented people, licence numbers and work orders.
const technician = { userId: "u-tech-1", name: "Ada Invented", licenceNumber: "TL-B1-0001" };
const inspector = { userId: "u-insp-1", name: "Bo Madeup", licenceNumber: "TL-B1-0002" };

function record(more: Partial<SwapRecord> = {}): SwapRecord {
  return {
    swapId: "swap-1",
    performedAt: "2026-03-01T10:00:00.000Z",
    performedBy: technician,
    inspectionRequired: false,
    inspectedBy: null,
    inspectedAt: null,
    entries: [
      { seq: 11, kind: "removed", workOrder: "WO-1", taskReference: "AMM 32-42-11", occurredAt: "2026-03-01T09:30:00.000Z", recordedBy: technician.userId },
      { seq: 12, kind: "installed", workOrder: "WO-1", taskReference: "AMM 32-42-11", occurredAt: "2026-03-01T10:00:00.000Z", recordedBy: technician.userId },
    ],
    ...more,
  };
}

describe("checkSwapRecord (14 CFR 43.9(a), from memory)", () => {
  it("finds nothing missing in a complete record, with or without an independent inspection", () => {
    expect(checkSwapRecord(record())).toEqual([]);
    expect(checkSwapRecord(record({ inspectionRequired: true, inspectedBy: inspector, inspectedAt: "2026-03-01T10:40:00.000Z" }))).toEqual([]);
  });

  it("names (a)(1) for a missing work order or task reference", () => {
    const issues = checkSwapRecord(record({ entries: [{ seq: 12, kind: "installed", workOrder: " ", taskReference: null, occurredAt: "2026-03-01T10:00:00.000Z", recordedBy: "u" }] }));
    expect(issues.map((i) => i.rule)).toEqual([RULE_43_9_A_1, RULE_43_9_A_1]);
    expect(issues[0].message).toContain("work order");
    expect(issues[1].message).toContain("task reference");
  });

  it("names (a)(2) for a missing or unreadable date", () => {
    expect(checkSwapRecord(record({ performedAt: null })).map((i) => i.rule)).toEqual([RULE_43_9_A_2]);
    expect(checkSwapRecord(record({ performedAt: "not a date" })).map((i) => i.rule)).toEqual([RULE_43_9_A_2]);
  });

  it("names (a)(3) when the performer is not named", () => {
    const issues = checkSwapRecord(record({ performedBy: { userId: "u-tech-1", name: "", licenceNumber: "TL-B1-0001" } }));
    expect(issues.map((i) => i.rule)).toEqual([RULE_43_9_A_3]);
  });

  it("names (a)(4) for an approver without a licence number, an unsigned entry, or an inspection never countersigned", () => {
    expect(checkSwapRecord(record({ performedBy: { ...technician, licenceNumber: null } })).map((i) => i.rule)).toEqual([RULE_43_9_A_4]);
    const unsigned = record();
    unsigned.entries = [{ ...unsigned.entries[0], recordedBy: null }];
    expect(checkSwapRecord(unsigned).map((i) => i.rule)).toEqual([RULE_43_9_A_4]);
    const pending = checkSwapRecord(record({ inspectionRequired: true }));
    expect(pending.map((i) => i.rule)).toEqual([RULE_43_9_A_4]);
    expect(pending[0].message).toContain("countersignature");
    // The inspector, not the technician, approves where an inspection is required.
    expect(checkSwapRecord(record({ inspectionRequired: true, inspectedBy: { ...inspector, licenceNumber: "" }, inspectedAt: "2026-03-01T10:40:00.000Z" }))[0].message).toContain("inspector");
  });

  it("says a swap with no entries describes nothing", () => {
    expect(checkSwapRecord(record({ entries: [] })).map((i) => i.rule)).toEqual([RULE_43_9_A_1]);
  });
});
