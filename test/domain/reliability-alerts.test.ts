import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import {
  alertLevel,
  alertLevelRunningAverage,
  markAlerts,
  monthlyRates,
  poissonAlert,
  poissonTailProbability,
  type MonthlyValue,
} from "@/domain/reliability";

// Where the expected values come from. No published worked example with numbers (monthly figures
// and the resulting alert level) was found for any of these methods, so every expected value below
// is HAND-COMPUTED by us from the method's definition, on numbers we made up; none is quoted from a
// published table.
//  - mean + k·SD (alertLevel, markAlerts): the method is common practice, recalled [from memory]
//    (trade-facts §4.3 [M]); values hand-computed.
//  - 1.3 × mean of the 3-month running averages (alertLevelRunningAverage): the METHOD is published,
//    Transport Canada AMA 571.101/1 Appendix A "Calculation of alert levels", Example 1 ("Pireps -
//    1.3 Mean Alert Level"; trade-facts §4.3 [C]); the appendix's Figure 1 numbers were not found,
//    so the values are hand-computed, not the published example's.
//  - Poisson alert count (poissonAlert): the method is [from memory] (trade-facts §4.3 [M]); values
//    hand-computed, and the tail probabilities cross-checked against jstat's Poisson CDF (another
//    implementation, not a published table).

interface JStatPoisson {
  poisson: { cdf(k: number, lambda: number): number };
}
const jStat = createRequire(import.meta.url)("jstat") as JStatPoisson;

/** "2025-01" … for consecutive months starting at startYear-01. */
function monthsFrom(startYear: number, count: number): string[] {
  return Array.from({ length: count }, (_, i) => {
    const year = startYear + Math.floor(i / 12);
    return `${year}-${String((i % 12) + 1).padStart(2, "0")}`;
  });
}

describe("monthlyRates", () => {
  it("gives removals per 1,000 unit hours for each month", () => {
    const rates = monthlyRates([
      { month: "2025-01", unitHours: 2500, removals: 3, unscheduledRemovals: 2 },
      { month: "2025-02", unitHours: 2000, removals: 0, unscheduledRemovals: 0 },
      { month: "2025-03", unitHours: 0, removals: 1, unscheduledRemovals: 1 },
    ]);
    expect(rates.map((r) => [r.month, r.removalRate, r.unscheduledRemovalRate])).toEqual([
      ["2025-01", 1.2, 0.8],
      ["2025-02", 0, 0],
      ["2025-03", null, null], // no unit hours: no rate
    ]);
  });

  it("rejects bad months, disorder and inconsistent counts", () => {
    const ok = { unitHours: 100, removals: 1, unscheduledRemovals: 1 };
    expect(() => monthlyRates([{ ...ok, month: "2025-13" }])).toThrow(/month must be "YYYY-MM"/);
    expect(() => monthlyRates([{ ...ok, month: "2025-1" }])).toThrow(/"2025-1"/);
    expect(() => monthlyRates([{ ...ok, month: "2025-02" }, { ...ok, month: "2025-01" }])).toThrow(
      /ascending order without repeats \(2025-02 then 2025-01\)/,
    );
    expect(() => monthlyRates([{ ...ok, month: "2025-02" }, { ...ok, month: "2025-02" }])).toThrow(/without repeats/);
    expect(() => monthlyRates([{ ...ok, month: "2025-01", unitHours: -1 }])).toThrow(
      "monthlyRates (2025-01): unitHours must not be negative (got -1)",
    );
    expect(() => monthlyRates([{ ...ok, month: "2025-01", unscheduledRemovals: 2 }])).toThrow(
      /unscheduledRemovals \(2\) cannot exceed removals \(1\)/,
    );
  });
});

describe("alertLevel: mean + k·SD with the sample SD (n − 1)", () => {
  // Hand-computed from the mean + k·SD definition (method [from memory], trade-facts §4.3 [M]); the rates are ours.
  // Rates 2,4,4,4,5,5,7,9: mean 5, squared deviations sum to 32, sample SD √(32/7) = 2.13809.
  it("k = 2 by default: 5 + 2 × 2.13809 = 9.27618", () => {
    expect(alertLevel([2, 4, 4, 4, 5, 5, 7, 9])).toBeCloseTo(9.27618, 5);
  });

  it("k is configurable: k = 3 gives 5 + 3 × 2.138090 = 11.41427", () => {
    expect(alertLevel([2, 4, 4, 4, 5, 5, 7, 9], 3)).toBeCloseTo(11.41427, 5);
  });

  it("uses n − 1, not n (the population SD would give exactly 5 + 2 × 2 = 9)", () => {
    expect(alertLevel([2, 4, 4, 4, 5, 5, 7, 9])).not.toBeCloseTo(9, 3);
  });

  it("refuses fewer than 2 rates and bad inputs", () => {
    expect(() => alertLevel([1.5])).toThrow(/needs at least 2 monthly rates .* \(got 1\)/);
    expect(() => alertLevel([1, -2])).toThrow("alertLevel: rates[1] must not be negative (got -2)");
    expect(() => alertLevel([1, 2], -1)).toThrow(/k must not be negative/);
  });
});

describe("markAlerts", () => {
  // Hand-computed from the mean + k·SD definition (method [from memory], trade-facts §4.3 [M]); the rates are ours.
  // 2025: rates alternate 1, 3, 1, 3, … (Jan = 1, Dec = 3); 2026-01 = 4.5; 2026-02 = 4.0.
  const rates = [1, 3, 1, 3, 1, 3, 1, 3, 1, 3, 1, 3, 4.5, 4.0];
  const series: MonthlyValue[] = monthsFrom(2025, 14).map((month, i) => ({ month, rate: rates[i] }));
  const marked = markAlerts(series);

  it("gives no alert level while fewer than 6 prior months exist", () => {
    expect(marked.slice(0, 6).map((m) => [m.alertLevel, m.priorMonths, m.aboveAlert])).toEqual([
      [null, 0, null],
      [null, 1, null],
      [null, 2, null],
      [null, 3, null],
      [null, 4, null],
      [null, 5, null],
    ]);
  });

  it("2025-07 from 6 prior months: mean 2, SD √(6/5) = 1.095445, level 4.190890; rate 1 not above", () => {
    expect(marked[6]).toMatchObject({ month: "2025-07", priorMonths: 6, aboveAlert: false });
    expect(marked[6].alertLevel).toBeCloseTo(4.19089, 5);
  });

  it("2026-01 from the 12 months of 2025: mean 2, SD √(12/11) = 1.044466, level 4.088932; rate 4.5 above", () => {
    expect(marked[12]).toMatchObject({ month: "2026-01", priorMonths: 12, aboveAlert: true });
    expect(marked[12].alertLevel).toBeCloseTo(4.088932, 5);
  });

  it("2026-02 from 2025-02..2026-01 only (the window slides): mean 2.291667, SD √(16.229167/11) = 1.214652, level 4.720971; rate 4.0 not above", () => {
    expect(marked[13]).toMatchObject({ month: "2026-02", priorMonths: 12, aboveAlert: false });
    expect(marked[13].alertLevel).toBeCloseTo(4.720971, 5);
  });

  it("takes k and the window as parameters", () => {
    const k3 = markAlerts(series, 3);
    expect(k3[12].alertLevel).toBeCloseTo(2 + 3 * Math.sqrt(12 / 11), 12);
    const window6 = markAlerts(series, 2, 6);
    // 2026-01 from 2025-07..12: 1,3,1,3,1,3 → 2 + 2√(6/5)
    expect(window6[12]).toMatchObject({ priorMonths: 6, aboveAlert: true });
    expect(window6[12].alertLevel).toBeCloseTo(4.19089, 5);
  });

  it("a rate equal to the level is not above it", () => {
    const flat = monthsFrom(2025, 13).map((month) => ({ month, rate: 2 }));
    expect(markAlerts(flat)[12]).toMatchObject({ alertLevel: 2, aboveAlert: false });
  });

  it("measures the window in calendar months, so gaps and no-data months shrink the baseline", () => {
    const gappy: MonthlyValue[] = [
      ...monthsFrom(2025, 6).map((month) => ({ month, rate: 1 })), // 2025-01..06
      { month: "2026-03", rate: 5 }, // window 2025-03..2026-02 holds only 4 months
    ];
    expect(markAlerts(gappy)[6]).toMatchObject({ alertLevel: null, priorMonths: 4, aboveAlert: null });

    const withNoData = monthsFrom(2025, 8).map((month, i) => ({ month, rate: i === 3 ? null : i % 2 }));
    const result = markAlerts(withNoData);
    expect(result[3]).toMatchObject({ rate: null, aboveAlert: null });
    expect(result[7].priorMonths).toBe(6); // 7 earlier months, one without a rate
  });

  it("rejects a bad window, k or rate", () => {
    expect(() => markAlerts(series, 2, 0)).toThrow(/window must be at least 1/);
    expect(() => markAlerts(series, 2, 12, 1)).toThrow(/minPriorMonths must be between 2 and window/);
    expect(() => markAlerts(series, 2, 12, 13)).toThrow(/minPriorMonths/);
    expect(() => markAlerts([{ month: "2025-01", rate: -1 }])).toThrow("markAlerts (2025-01): rate must not be negative (got -1)");
  });
});

describe("alertLevelRunningAverage: the method of TC AMA 571.101/1 App. A Example 1, on hand-computed values", () => {
  // Method: TC AMA 571.101/1 Appendix A, Example 1 (published). Values: hand-computed by us on rates we made up;
  // the appendix's own Figure 1 data and alert level were not found, so this is not the published example.
  // Rates 1.2, 0.9, 1.5, 1.8, 0.6, 1.2 → 3-month running averages 1.2, 1.4, 1.3, 1.2;
  // their mean 5.1 / 4 = 1.275; × 1.3 = 1.6575.
  it("is 1.3 × the mean of the 3-month running averages: 1.6575", () => {
    expect(alertLevelRunningAverage([1.2, 0.9, 1.5, 1.8, 0.6, 1.2])).toBeCloseTo(1.6575, 12);
  });

  it("takes the factor as a parameter", () => {
    expect(alertLevelRunningAverage([1.2, 0.9, 1.5, 1.8, 0.6, 1.2], 1.5)).toBeCloseTo(1.9125, 12);
  });

  it("with exactly 3 months is the factor × their mean", () => {
    expect(alertLevelRunningAverage([1, 2, 3])).toBeCloseTo(2.6, 12);
  });

  it("refuses fewer than 3 rates and negative rates", () => {
    expect(() => alertLevelRunningAverage([1, 2])).toThrow(/needs at least 3 monthly rates .* \(got 2\)/);
    expect(() => alertLevelRunningAverage([1, 2, -3])).toThrow(/rates\[2\] must not be negative/);
  });
});

describe("poissonAlert", () => {
  // Hand-computed from the Poisson alert definition (method [from memory], trade-facts §4.3 [M]); the numbers are ours.
  // Baseline 0.8 per 1,000 unit hours × 2,500 unit hours → λ = 2.
  // P(X ≤ 4) = e⁻²(1 + 2 + 2 + 4/3 + 2/3) = 7e⁻² = 0.947347, so P(X ≥ 5) = 0.052653;
  // P(X = 5) = e⁻² · 32/120 = 0.036089, so P(X ≥ 6) = 0.016564.
  it("α = 0.05: alert at 6 removals (P(X ≥ 6) = 0.016564; P(X ≥ 5) = 0.0527 is too likely)", () => {
    const alert = poissonAlert(0.8, 2500);
    expect(alert.expectedRemovals).toBeCloseTo(2, 12);
    expect(alert.alertCount).toBe(6);
    expect(alert.tailProbability).toBeCloseTo(0.016564, 6);
  });

  it("α = 0.06: alert at 5 removals (P(X ≥ 5) = 0.052653)", () => {
    const alert = poissonAlert(0.8, 2500, 0.06);
    expect(alert.alertCount).toBe(5);
    expect(alert.tailProbability).toBeCloseTo(0.052653, 6);
  });

  it("with a zero baseline any removal is an alert", () => {
    expect(poissonAlert(0, 1000).alertCount).toBe(1);
  });

  it("tail probabilities agree with jstat (an independent implementation, not a published table)", () => {
    // (kept to counts where jstat's factorial-based Poisson CDF stays finite)
    for (const lambda of [0.1, 2, 7.5, 40, 90]) {
      for (const count of [1, 2, 5, 10, 50, 100, 120]) {
        expect(poissonTailProbability(count, lambda)).toBeCloseTo(1 - jStat.poisson.cdf(count - 1, lambda), 10);
      }
    }
    expect(poissonTailProbability(0, 3)).toBe(1);
  });

  it("finds the smallest such count for large exposure too", () => {
    const { expectedRemovals, alertCount } = poissonAlert(2, 50_000, 0.01); // λ = 100
    expect(expectedRemovals).toBeCloseTo(100, 9);
    expect(poissonTailProbability(alertCount, 100)).toBeLessThanOrEqual(0.01);
    expect(poissonTailProbability(alertCount - 1, 100)).toBeGreaterThan(0.01);
  });

  it("rejects bad inputs", () => {
    expect(() => poissonAlert(-1, 100)).toThrow("poissonAlert: baselineRatePer1000 must not be negative (got -1)");
    expect(() => poissonAlert(1, 100, 0)).toThrow(/alpha must be strictly between 0 and 1/);
    expect(() => poissonTailProbability(1.5, 2)).toThrow(/count must be a whole number/);
  });
});
