import { describe, expect, it } from "vitest";
import { alertLevel, monthWindows, reliabilityReport, weibullSample, type RemovalEvent } from "@/domain/reliability";

const at = (iso: string) => Date.parse(iso);

// 12 baseline months of 2025 and a report period of 2026-01 to 2026-03; every month 10,000 unit hours
// (figures invented for the test).
const windows = [...monthWindows(at("2025-01-01T00:00:00Z"), at("2026-01-01T00:00:00Z")), ...monthWindows(at("2026-01-01T00:00:00Z"), at("2026-04-01T00:00:00Z"))];
const unitMinutes = windows.map(() => 10_000 * 60);
const baselineCounts = [2, 3, 2, 1, 2, 3, 2, 2, 1, 3, 2, 2];

function removalsIn(month: string, count: number, extra: Partial<RemovalEvent> = {}): RemovalEvent[] {
  return Array.from({ length: count }, (_, i) => ({ at: at(`${month}-10T08:00:00Z`) + i * 60_000, unscheduled: true, finding: null, ...extra }));
}

const baseline = baselineCounts.flatMap((count, i) => removalsIn(`2025-${String(i + 1).padStart(2, "0")}`, count));
const input = {
  windows,
  unitMinutes,
  periodStart: at("2026-01-01T00:00:00Z"),
  now: at("2026-03-15T00:00:00Z"),
  k: 2,
};

describe("reliabilityReport", () => {
  it("compares each month with mean + 2 SD of the 12 months before it and marks the closed months above", () => {
    const report = reliabilityReport({
      ...input,
      removals: [...baseline, ...removalsIn("2026-01", 2), ...removalsIn("2026-02", 9), ...removalsIn("2026-03", 9)],
    });
    expect(report.months.map((m) => m.month)).toEqual(["2026-01", "2026-02", "2026-03"]);
    const level = alertLevel(baselineCounts.map((c) => c / 10), 2);
    expect(report.months[0].alertLevel).toBeCloseTo(level, 12);
    expect(report.months[0].priorMonths).toBe(12);
    expect(report.months[0].aboveAlert).toBe(false);
    expect(report.months[1].rate).toBeCloseTo(0.9, 12);
    expect(report.months[1].aboveAlert).toBe(true);
    // March is above its level too but not over yet: marked in the months, not listed as an alert.
    expect(report.months[2].closed).toBe(false);
    expect(report.months[2].aboveAlert).toBe(true);
    expect(report.monthsAboveAlert).toEqual(["2026-02"]);
    expect(report.alertLevel).toBe(report.months[2].alertLevel);
  });

  it("totals the period only (the baseline months are not counted) and derives MTBUR, MTBF, NFF rate and the rates", () => {
    const report = reliabilityReport({
      ...input,
      removals: [
        ...baseline,
        ...removalsIn("2026-01", 3, { finding: "confirmed_failure" }),
        ...removalsIn("2026-02", 1, { finding: "no_fault_found" }),
        ...removalsIn("2026-02", 1, { unscheduled: false, finding: "modification" }),
        ...removalsIn("2026-03", 1),
      ],
    });
    expect(report.unitMinutes).toBe(30_000 * 60);
    expect(report.removals).toBe(6);
    expect(report.unscheduledRemovals).toBe(5);
    expect(report.confirmedFailures).toBe(3);
    expect(report.noFaultFound).toBe(1);
    expect(report.awaitingFinding).toBe(1);
    expect(report.mtburHours).toBe(6_000);
    expect(report.mtbfHours).toBe(10_000);
    expect(report.noFaultFoundRate).toBeCloseTo(0.2, 12);
    expect(report.ratePer1000Hours).toBeCloseTo(5 / 30, 12);
    expect(report.removalRatePer1000Hours).toBeCloseTo(6 / 30, 12);
    expect(report.mtbfInterval?.confidence).toBe(0.9);
    expect(report.mtbfInterval!.lowerHours).toBeLessThan(10_000);
    expect(report.mtbfInterval!.upperHours!).toBeGreaterThan(10_000);
  });

  it("gives no alert level while fewer than 6 earlier months have unit hours, and a null rate for a month with none", () => {
    const sparse = unitMinutes.map((m, i) => (i < 8 ? 0 : m));
    const report = reliabilityReport({ ...input, unitMinutes: sparse, removals: removalsIn("2026-02", 1) });
    expect(report.months[0].priorMonths).toBe(4);
    expect(report.months[0].alertLevel).toBeNull();
    expect(report.months[0].aboveAlert).toBeNull();
    const empty = reliabilityReport({ ...input, unitMinutes: unitMinutes.map(() => 0), removals: [] });
    expect(empty.months.every((m) => m.rate === null)).toBe(true);
    expect(empty.mtburHours).toBeNull();
    expect(empty.mtbfInterval).toBeNull();
  });

  it("counts a removal exactly once, in the month it happened (month edges are UTC)", () => {
    const report = reliabilityReport({
      ...input,
      removals: [
        { at: at("2026-01-31T23:59:59.999Z"), unscheduled: true, finding: null },
        { at: at("2026-02-01T00:00:00Z"), unscheduled: true, finding: null },
        { at: at("2026-04-01T00:00:00Z"), unscheduled: true, finding: null },
      ],
    });
    expect(report.months.map((m) => m.unscheduledRemovals)).toEqual([1, 1, 0]);
  });

  it("refuses unit hours that do not line up with the months", () => {
    expect(() => reliabilityReport({ ...input, unitMinutes: [1, 2], removals: [] })).toThrow(/windows/);
  });
});

describe("weibullSample", () => {
  const items = [
    { hours: 100, ended: "unscheduled" as const, finding: "confirmed_failure" as const },
    { hours: 200, ended: "unscheduled" as const, finding: "no_fault_found" as const },
    { hours: 300, ended: "scheduled" as const, finding: null },
    { hours: 400, ended: "still_fitted" as const, finding: null },
    { hours: 0, ended: "unscheduled" as const, finding: null },
  ];

  it("takes unscheduled removals as failures and units still fitted as suspensions; scheduled ones are left out by default", () => {
    const sample = weibullSample(items, { confirmedOnly: false, scheduledAsSuspensions: false });
    expect(sample.units).toEqual([
      { time: 100, failed: true },
      { time: 200, failed: true },
      { time: 400, failed: false },
    ]);
    expect(sample).toMatchObject({ failures: 2, suspensions: 1, excluded: 2 });
  });

  it("with confirmed failures only, an unconfirmed unscheduled removal becomes a suspension", () => {
    const sample = weibullSample(items, { confirmedOnly: true, scheduledAsSuspensions: true });
    expect(sample.units).toEqual([
      { time: 100, failed: true },
      { time: 200, failed: false },
      { time: 300, failed: false },
      { time: 400, failed: false },
    ]);
    expect(sample).toMatchObject({ failures: 1, suspensions: 3, excluded: 1 });
  });
});
