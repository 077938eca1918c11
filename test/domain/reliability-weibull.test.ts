import { describe, expect, it } from "vitest";
import {
  bernardMedianRank,
  weibullMedianRankRegression,
  weibullMedianRanks,
  weibullPlot,
  weibullPlotY,
  weibullTimeAtUnreliability,
  weibullUnreliability,
  type WeibullUnit,
} from "@/domain/reliability";

const failure = (time: number): WeibullUnit => ({ time, failed: true });
const suspension = (time: number): WeibullUnit => ({ time, failed: false });

describe("median ranks with suspensions (Johnson adjusted rank, Bernard)", () => {
  it("W2: 12 units, failures at 43, 67, 92, 94, 149, 7 suspended at 149 → 0.0565, 0.1371, 0.2177, 0.2984, 0.3790 (trade-facts 4.4 [C]: engineeredsoftware.com/nasa/pe_median)", () => {
    const units = [...[43, 67, 92, 94, 149].map(failure), ...Array.from({ length: 7 }, () => suspension(149))];
    const { points, sampleSize, suspensionTimes } = weibullMedianRanks(units);
    expect(sampleSize).toBe(12);
    expect(suspensionTimes).toEqual(Array(7).fill(149));
    expect(points.map((p) => p.time)).toEqual([43, 67, 92, 94, 149]);
    expect(points.map((p) => p.adjustedRank)).toEqual([1, 2, 3, 4, 5]);
    const expected = [0.0565, 0.1371, 0.2177, 0.2984, 0.379];
    points.forEach((p, i) => expect(p.medianRank).toBeCloseTo(expected[i], 4));
    // The same data fits (W2 publishes no β, η to check against).
    const fit = weibullMedianRankRegression(units);
    expect(fit.beta).toBeGreaterThan(0);
    expect(fit.points).toEqual(points);
  });

  // Computed by hand from Johnson's method (trade-facts 4.4); the numbers are ours.
  // n = 5, sorted F10 S20 F30 F40 S50, reverse ranks 5 4 3 2 1:
  //   F10: 0 + (6 − 0)/(1 + 5) = 1
  //   F30: 1 + (6 − 1)/(1 + 3) = 2.25
  //   F40: 2.25 + (6 − 2.25)/(1 + 2) = 3.5
  // Bernard: 0.7/5.4 = 0.129630, 1.95/5.4 = 0.361111, 3.2/5.4 = 0.592593.
  it("raises the ranks of failures that follow a suspension (hand-computed)", () => {
    const units = [failure(40), suspension(50), failure(10), suspension(20), failure(30)]; // unsorted on purpose
    const { points } = weibullMedianRanks(units);
    expect(points.map((p) => p.time)).toEqual([10, 30, 40]);
    expect(points.map((p) => p.adjustedRank)).toEqual([1, 2.25, 3.5]);
    expect(points.map((p) => p.medianRank)).toEqual([0.7 / 5.4, 1.95 / 5.4, 3.2 / 5.4].map((v) => expect.closeTo(v, 12)));
  });

  // Hand-computed: sorted F10 S10 F20 (n = 3): F10 → 1; F20 → 1 + (4 − 1)/(1 + 1) = 2.5.
  // Had the suspension come first, F10 would get 4/3 and F20 8/3.
  it("puts failures before suspensions at tied times", () => {
    const { points } = weibullMedianRanks([suspension(10), failure(10), failure(20)]);
    expect(points.map((p) => p.adjustedRank)).toEqual([1, 2.5]);
  });

  it("complete data (no suspensions): adjusted ranks are 1..n and median ranks equal Bernard's (i − 0.3)/(n + 0.4)", () => {
    const { points } = weibullMedianRanks([700, 150, 420, 260, 980, 560].map(failure));
    expect(points.map((p) => p.adjustedRank)).toEqual([1, 2, 3, 4, 5, 6]);
    points.forEach((p, i) => {
      expect(p.medianRank).toBeCloseTo((i + 1 - 0.3) / 6.4, 14);
      expect(p.medianRank).toBe(bernardMedianRank(i + 1, 6));
      expect(p.x).toBe(Math.log(p.time));
      expect(p.y).toBeCloseTo(Math.log(-Math.log(1 - p.medianRank)), 14);
    });
  });
});

describe("weibullMedianRankRegression", () => {
  // Constructed check (not a published example): times placed exactly on a
  // known Weibull line at the Bernard median ranks, t_i = η·(−ln(1 − F_i))^(1/β),
  // so a correct regression must give back β and η.
  const BETA = 2.7;
  const ETA = 1850;
  const n = 10;
  const onLine = Array.from({ length: n }, (_, i) => failure(ETA * Math.pow(-Math.log(1 - bernardMedianRank(i + 1, n)), 1 / BETA)));

  it.each(["x-on-y", "y-on-x"] as const)("recovers β and η from points on a known line (%s, constructed check)", (regress) => {
    const fit = weibullMedianRankRegression(onLine, { regress });
    expect(fit.regress).toBe(regress);
    expect(Math.abs(fit.beta - BETA)).toBeLessThan(1e-9);
    expect(Math.abs(fit.eta - ETA) / ETA).toBeLessThan(1e-9);
    expect(fit.r2).toBeCloseTo(1, 12);
  });

  it("recovers β and η with suspensions between the failures too (constructed check)", () => {
    // Ranks depend only on the order, so take them from the pattern first, then
    // place each failure on the line at its median rank and each suspension between neighbours.
    const pattern = [true, false, true, true, false, false, true, false, true, true, false, true];
    const ranks = weibullMedianRanks(pattern.map((failed, i) => ({ time: i + 1, failed })));
    const failureTimes = ranks.points.map((p) => weibullTimeAtUnreliability(p.medianRank, BETA, ETA));
    const units: WeibullUnit[] = [];
    let nextFailure = 0;
    pattern.forEach((failed) => {
      if (failed) units.push(failure(failureTimes[nextFailure++]));
      else units.push(suspension(nextFailure === 0 ? failureTimes[0] / 2 : failureTimes[nextFailure - 1] * 1.0001));
    });
    for (const regress of ["x-on-y", "y-on-x"] as const) {
      const fit = weibullMedianRankRegression(units, { regress });
      expect(fit.points.map((p) => p.adjustedRank)).toEqual(ranks.points.map((p) => p.adjustedRank));
      expect(Math.abs(fit.beta - BETA)).toBeLessThan(1e-9);
      expect(Math.abs(fit.eta - ETA) / ETA).toBeLessThan(1e-9);
    }
  });

  it("regresses X on Y by default; on scattered data β(y-on-x) = r² · β(x-on-y) and r² is the same", () => {
    const units = [failure(120), failure(310), suspension(350), failure(390), failure(900), suspension(1000), failure(1100)];
    const byDefault = weibullMedianRankRegression(units);
    const xOnY = weibullMedianRankRegression(units, { regress: "x-on-y" });
    const yOnX = weibullMedianRankRegression(units, { regress: "y-on-x" });
    expect(byDefault).toEqual(xOnY);
    expect(xOnY.r2).toBeLessThan(1);
    expect(yOnX.r2).toBeCloseTo(xOnY.r2, 14);
    expect(yOnX.beta).toBeCloseTo(xOnY.r2 * xOnY.beta, 12);
    expect(yOnX.beta).not.toBeCloseTo(xOnY.beta, 3);
  });

  it("with exactly 2 failures both directions give the line through them", () => {
    const units = [failure(100), failure(400)];
    const a = weibullMedianRankRegression(units, { regress: "x-on-y" });
    const b = weibullMedianRankRegression(units, { regress: "y-on-x" });
    const slope = (weibullPlotY(1.7 / 2.4) - weibullPlotY(0.7 / 2.4)) / Math.log(4);
    expect(a.beta).toBeCloseTo(slope, 12);
    expect(b.beta).toBeCloseTo(slope, 12);
    expect(a.eta).toBeCloseTo(b.eta, 9);
  });

  it("refuses fewer than 2 failures with a clear message", () => {
    expect(() => weibullMedianRankRegression([failure(100), suspension(200), suspension(300)])).toThrow(
      "weibullMedianRankRegression: needs at least 2 failures to fit a Weibull line (got 1 among 3 units)",
    );
    expect(() => weibullMedianRankRegression([suspension(200)])).toThrow(/got 0 among 1 units/);
    expect(() => weibullMedianRankRegression([])).toThrow(/got 0 among 0 units/);
  });

  it("refuses failures all at one time, and bad times or options", () => {
    expect(() => weibullMedianRankRegression([failure(50), failure(50), suspension(60)])).toThrow(
      /all 2 failures are at the same time \(50\)/,
    );
    expect(() => weibullMedianRankRegression([failure(-5), failure(10)])).toThrow(
      "weibullMedianRanks: units[0].time must not be negative (got -5)",
    );
    expect(() => weibullMedianRankRegression([failure(0), failure(10)])).toThrow(/units\[0\]\.time must be greater than zero/);
    expect(() => weibullMedianRankRegression([failure(Number.NaN), failure(10)])).toThrow(/must be a finite number/);
    // @ts-expect-error: checking the run-time guard against an untyped caller
    expect(() => weibullMedianRankRegression([failure(5), failure(10)], { regress: "least-squares" })).toThrow(
      /regress must be "x-on-y" or "y-on-x"/,
    );
  });
});

describe("Weibull helpers and plot data", () => {
  it("F(η) = 1 − 1/e and the B-life inverts F", () => {
    expect(weibullUnreliability(1000, 1.8, 1000)).toBeCloseTo(1 - Math.exp(-1), 14);
    const b10 = weibullTimeAtUnreliability(0.1, 1.8, 1000);
    expect(weibullUnreliability(b10, 1.8, 1000)).toBeCloseTo(0.1, 14);
  });

  it("gives the fitted line's end points at the first and last failure by default", () => {
    const fit = weibullMedianRankRegression([failure(120), failure(310), suspension(350), failure(390), failure(900)]);
    const plot = weibullPlot(fit);
    expect(plot.points).toBe(fit.points);
    expect(plot.suspensionTimes).toEqual([350]);
    expect(plot.line.start.time).toBe(120);
    expect(plot.line.end.time).toBe(900);
    for (const end of [plot.line.start, plot.line.end]) {
      expect(end.x).toBe(Math.log(end.time));
      expect(end.y).toBeCloseTo(fit.beta * (end.x - Math.log(fit.eta)), 12);
      expect(weibullPlotY(end.unreliability)).toBeCloseTo(end.y, 10);
    }
  });

  it("takes a time range for the line, and the line goes through points that lie on it", () => {
    const units = Array.from({ length: 5 }, (_, i) => failure(weibullTimeAtUnreliability(bernardMedianRank(i + 1, 5), 1.5, 600)));
    const fit = weibullMedianRankRegression(units);
    const plot = weibullPlot(fit, { fromTime: 10, toTime: 10_000 });
    expect(plot.line.start.time).toBe(10);
    expect(plot.line.end.time).toBe(10_000);
    const atEta = weibullPlot(fit, { fromTime: 600, toTime: 600 }).line.start;
    expect(atEta.y).toBeCloseTo(0, 9);
    expect(weibullPlot(fit).line.start.y).toBeCloseTo(fit.points[0].y, 9);
    expect(() => weibullPlot(fit, { fromTime: 100, toTime: 10 })).toThrow(/toTime \(10\) must not be before fromTime \(100\)/);
    expect(() => weibullPlot(fit, { fromTime: 0, toTime: 10 })).toThrow(/fromTime must be greater than zero/);
  });
});
