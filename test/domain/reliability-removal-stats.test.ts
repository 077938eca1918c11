import { describe, expect, it } from "vitest";
import { DomainInputError } from "@/domain/errors";
import {
  mtbf,
  mtbur,
  mtburLowerBoundZeroEvents,
  noFaultFoundRate,
  removalRatePer1000,
  removalStatistics,
  unitHoursFromMinutes,
} from "@/domain/reliability";

// Hand-computed group used below (our numbers): 10 aircraft × 250 FH × QPA 2
// = 5,000 unit hours; 6 removals, 4 of them unscheduled; 3 shop-confirmed
// failures; 1 no-fault-found finding.
const UNIT_HOURS = 10 * 250 * 2;

describe("removal statistics (definitions of trade-facts 4.2)", () => {
  it("MTBUR = unit hours ÷ unscheduled removals (ATA CSDD definition)", () => {
    expect(mtbur(UNIT_HOURS, 4)).toBe(1250);
  });

  it("MTBF = unit hours ÷ confirmed failures", () => {
    expect(mtbf(UNIT_HOURS, 3)).toBeCloseTo(1666.6667, 4);
  });

  it("removal rate is per 1,000 UNIT hours", () => {
    expect(removalRatePer1000(6, UNIT_HOURS)).toBeCloseTo(1.2, 12);
    expect(removalRatePer1000(4, UNIT_HOURS)).toBeCloseTo(0.8, 12);
  });

  it("NFF rate = NFF findings ÷ unscheduled removals, as a fraction", () => {
    expect(noFaultFoundRate(1, 4)).toBe(0.25);
  });

  it("returns null rather than a division by zero", () => {
    expect(mtbur(UNIT_HOURS, 0)).toBeNull();
    expect(mtbf(UNIT_HOURS, 0)).toBeNull();
    expect(removalRatePer1000(0, 0)).toBeNull();
    expect(noFaultFoundRate(0, 0)).toBeNull();
  });

  it("removalStatistics gathers the same figures", () => {
    expect(
      removalStatistics({ unitHours: UNIT_HOURS, removals: 6, unscheduledRemovals: 4, confirmedFailures: 3, noFaultFound: 1 }),
    ).toEqual({
      unitHours: 5000,
      mtbur: 1250,
      mtbf: 5000 / 3,
      removalRatePer1000: 1.2,
      unscheduledRemovalRatePer1000: 0.8,
      noFaultFoundRate: 0.25,
    });
  });

  it("converts ledger minutes to hours", () => {
    expect(unitHoursFromMinutes(90)).toBe(1.5);
    expect(() => unitHoursFromMinutes(1.5)).toThrow(/unitMinutes must be a whole number/);
  });
});

describe("zero-event MTBUR lower bound, 2T / χ²(CL; 2)", () => {
  it("uses χ²(0.90; 2) = 4.61 at 90 % confidence (formula and χ² value: ATA CSDD definition, trade-facts 4.2 [C]; T is ours)", () => {
    // 2 × 1000 / 4.6052 = 434.29
    expect(mtburLowerBoundZeroEvents(1000, 0.9)).toBeCloseTo(434.294, 3);
  });

  it("equals T / −ln(1 − CL), the 2-dof closed form", () => {
    for (const cl of [0.5, 0.8, 0.95, 0.99]) {
      expect(mtburLowerBoundZeroEvents(2500, cl)).toBeCloseTo(2500 / -Math.log(1 - cl), 9);
    }
  });

  it("rejects a confidence outside (0, 1)", () => {
    expect(() => mtburLowerBoundZeroEvents(1000, 1)).toThrow(/confidence must be strictly between 0 and 1/);
    expect(() => mtburLowerBoundZeroEvents(1000, 90)).toThrow(/confidence/);
  });
});

describe("removal statistics input checks", () => {
  it("throws DomainInputError with the argument as its field", () => {
    let caught: unknown;
    try {
      mtbur(-5, 1);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(DomainInputError);
    expect((caught as DomainInputError).field).toBe("unitHours");
  });

  it("names the bad input", () => {
    expect(() => mtbur(-5, 1)).toThrow("mtbur: unitHours must not be negative (got -5)");
    expect(() => mtbur(100, 1.5)).toThrow(/mtbur: unscheduledRemovals must be a whole number/);
    expect(() => mtbf(Number.NaN, 1)).toThrow(/mtbf: unitHours must be a finite number/);
    expect(() => removalRatePer1000(-1, 100)).toThrow(/removals must not be negative/);
    expect(() => removalRatePer1000(1, Infinity)).toThrow(/unitHours must be a finite number/);
    expect(() => noFaultFoundRate(5, 4)).toThrow(/noFaultFound \(5\) cannot exceed unscheduledRemovals \(4\)/);
  });

  it("rejects counts that contradict each other", () => {
    const base = { unitHours: 100, removals: 2, unscheduledRemovals: 2, confirmedFailures: 1, noFaultFound: 0 };
    expect(() => removalStatistics({ ...base, unscheduledRemovals: 3 })).toThrow(/unscheduledRemovals \(3\) cannot exceed removals \(2\)/);
    expect(() => removalStatistics({ ...base, confirmedFailures: 3 })).toThrow(/confirmedFailures \(3\) cannot exceed removals \(2\)/);
    expect(() => removalStatistics({ ...base, noFaultFound: 3 })).toThrow(/noFaultFound/);
  });
});
