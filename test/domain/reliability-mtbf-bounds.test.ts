import { describe, expect, it } from "vitest";
import {
  chiSquareQuantile,
  mtbfConfidenceInterval,
  mtbfLowerBound,
  mtburLowerBoundZeroEvents,
} from "@/domain/reliability";

// Formulas from memory of MIL-HDBK-338B §8 and MIL-HDBK-781A (trade-facts 4.5 [M]).
// The χ² figures are from memory of the standard chi-square table; T and r are ours:
// T = 1000 h, r = 2 failures.

describe("MTBF confidence bounds, time-truncated (from memory: MIL-HDBK-338B §8, MIL-HDBK-781A)", () => {
  it("lower one-sided θ_L = 2T/χ²(1−α; 2r+2): 90 % → 2000/10.645 = 187.9", () => {
    expect(mtbfLowerBound(1000, 2, 0.9)).toBeCloseTo(2000 / 10.645, 1);
    expect(mtbfLowerBound(1000, 2, 0.9)).toBeCloseTo(2000 / chiSquareQuantile(0.9, 6), 10);
  });

  it("two-sided 90 %: [2T/χ²(0.95; 2r+2), 2T/χ²(0.05; 2r)] = [2000/12.592, 2000/0.711]", () => {
    const interval = mtbfConfidenceInterval(1000, 2, 0.9);
    expect(interval.pointEstimate).toBe(500);
    expect(interval.lower).toBeCloseTo(158.83, 1); // 2000 / 12.592
    expect(interval.upper! / (2000 / 0.7107)).toBeCloseTo(1, 3);
    expect(interval.lower).toBeLessThan(500);
    expect(interval.upper!).toBeGreaterThan(500);
  });

  it("with no failures has a lower bound only; one-sided it equals the zero-event MTBUR bound", () => {
    const interval = mtbfConfidenceInterval(1000, 0, 0.9);
    expect(interval.pointEstimate).toBeNull();
    expect(interval.upper).toBeNull();
    expect(interval.lower).toBeCloseTo(2000 / chiSquareQuantile(0.95, 2), 10);
    expect(mtbfLowerBound(1000, 0, 0.9)).toBeCloseTo(mtburLowerBoundZeroEvents(1000, 0.9), 10);
  });
});

describe("MTBF confidence bounds, failure-truncated: 2r dof throughout (from memory: MIL-HDBK-338B §8, MIL-HDBK-781A)", () => {
  it("lower one-sided 90 %: 2000/χ²(0.90; 4) = 2000/7.779 = 257.1", () => {
    expect(mtbfLowerBound(1000, 2, 0.9, "failure")).toBeCloseTo(2000 / 7.779, 1);
  });

  it("two-sided uses 2r dof at both ends", () => {
    const interval = mtbfConfidenceInterval(1000, 2, 0.9, "failure");
    expect(interval.lower).toBeCloseTo(2000 / chiSquareQuantile(0.95, 4), 10);
    expect(interval.upper!).toBeCloseTo(2000 / chiSquareQuantile(0.05, 4), 10);
    // The time-truncated interval adds a phantom failure to the lower end only, so it is lower there.
    expect(mtbfConfidenceInterval(1000, 2, 0.9, "time").lower).toBeLessThan(interval.lower);
  });

  it("refuses zero failures: such a test cannot have ended at a failure", () => {
    expect(() => mtbfLowerBound(1000, 0, 0.9, "failure")).toThrow(/failure-truncated .* failures must be at least 1/);
  });
});

describe("MTBF bound input checks", () => {
  it("names the bad input", () => {
    expect(() => mtbfLowerBound(-1, 1, 0.9)).toThrow("mtbfLowerBound: totalHours must not be negative (got -1)");
    expect(() => mtbfLowerBound(100, 1.5, 0.9)).toThrow(/failures must be a whole number/);
    expect(() => mtbfConfidenceInterval(100, 1, 0)).toThrow(/confidence must be strictly between 0 and 1/);
    // @ts-expect-error: checking the run-time guard against an untyped caller
    expect(() => mtbfLowerBound(100, 1, 0.9, "sequential")).toThrow(/truncation must be "time" or "failure"/);
  });
});
