// Two-parameter Weibull analysis of removal data with suspensions, by median
// rank regression (MRR).
//
// Model: F(t) = 1 − exp[−(t/η)^β]. On Weibull paper x = ln t and
// y = ln(−ln(1 − F)) lie on the line y = β·x − β·ln η.
//
// Units still running (removed for another reason, or still installed) are
// suspensions: they carry no rank of their own but push the ranks of later
// failures up, by Johnson's adjusted-rank method:
//   sort all units by time, failures before suspensions at tied times (a unit
//   suspended at the same time as a failure was known to have survived it);
//   reverse rank of the unit at sorted position i (1-based) = n − i + 1;
//   for each failure, increment = (n + 1 − previous adjusted rank) / (1 + reverse rank),
//   adjusted rank = previous adjusted rank + increment (previous starts at 0).
// Median ranks by Bernard's approximation F ≈ (i − 0.3)/(n + 0.4), with the
// adjusted rank as i and n counting failures and suspensions.
//
// Default regression is X on Y (ln t regressed on the rank), which, from memory,
// The New Weibull Handbook recommends for MRR: the scatter is in the times,
// while the ranks are fixed by the order. "y-on-x" is available for comparison
// with tools that regress the other way.

import { DomainInputError } from "../errors";
import { requireFinitePositive, requireOpenProbability } from "./validate";

export interface WeibullUnit {
  /** Operating time at failure or suspension, in any one unit (hours, cycles) used throughout. */
  time: number;
  /** true = failure, false = suspension (censored). */
  failed: boolean;
}

export type WeibullRegression = "x-on-y" | "y-on-x";

export interface WeibullPoint {
  time: number;
  adjustedRank: number;
  medianRank: number;
  /** ln t */
  x: number;
  /** ln(−ln(1 − medianRank)) */
  y: number;
}

export interface WeibullMedianRanks {
  /** One point per failure, in time order. */
  points: WeibullPoint[];
  /** n: failures plus suspensions. */
  sampleSize: number;
  /** Suspension times, ascending; for charting (they have no plotting position). */
  suspensionTimes: number[];
}

export interface WeibullFit extends WeibullMedianRanks {
  /** Shape β. */
  beta: number;
  /** Scale η (characteristic life, F(η) = 63.2 %), in the units of the input times. */
  eta: number;
  /** Coefficient of determination of the plotted points (the same for either regression direction). */
  r2: number;
  regress: WeibullRegression;
}

/** Bernard's approximation to the median rank of the i-th of n ordered items (i may be an adjusted, fractional rank). */
export function bernardMedianRank(rank: number, sampleSize: number): number {
  return (rank - 0.3) / (sampleSize + 0.4);
}

/** y coordinate on Weibull paper for unreliability F (0 < F < 1). */
export function weibullPlotY(unreliability: number): number {
  requireOpenProbability("weibullPlotY", "unreliability", unreliability);
  return Math.log(-Math.log(1 - unreliability));
}

/** F(t) = 1 − exp[−(t/η)^β]. */
export function weibullUnreliability(time: number, beta: number, eta: number): number {
  requireFinitePositive("weibullUnreliability", "beta", beta);
  requireFinitePositive("weibullUnreliability", "eta", eta);
  if (!Number.isFinite(time) || time < 0) {
    throw new DomainInputError(`weibullUnreliability: time must be a finite number >= 0 (got ${time})`, "time");
  }
  return 1 - Math.exp(-Math.pow(time / eta, beta));
}

/** The time by which a fraction F has failed: t = η·(−ln(1 − F))^(1/β); F = 0.10 gives the B10 life. */
export function weibullTimeAtUnreliability(unreliability: number, beta: number, eta: number): number {
  requireOpenProbability("weibullTimeAtUnreliability", "unreliability", unreliability);
  requireFinitePositive("weibullTimeAtUnreliability", "beta", beta);
  requireFinitePositive("weibullTimeAtUnreliability", "eta", eta);
  return eta * Math.pow(-Math.log(1 - unreliability), 1 / beta);
}

/** Johnson's adjusted ranks and Bernard median ranks for each failure (see the file comment). */
export function weibullMedianRanks(units: ReadonlyArray<WeibullUnit>): WeibullMedianRanks {
  units.forEach((u, i) => {
    if (typeof u.failed !== "boolean") {
      throw new DomainInputError(
        `weibullMedianRanks: units[${i}].failed must be true or false (got ${String(u.failed)})`,
        `units[${i}].failed`,
      );
    }
    requireFinitePositive("weibullMedianRanks", `units[${i}].time`, u.time);
  });
  const n = units.length;
  // Stable sort on (time, failures first); equal failures keep input order, which does not change their ranks.
  const sorted = [...units].sort((a, b) => a.time - b.time || Number(b.failed) - Number(a.failed));

  const points: WeibullPoint[] = [];
  const suspensionTimes: number[] = [];
  let previousRank = 0;
  sorted.forEach((unit, index) => {
    if (!unit.failed) {
      suspensionTimes.push(unit.time);
      return;
    }
    const reverseRank = n - index; // n − i + 1 with i = index + 1
    const adjustedRank = previousRank + (n + 1 - previousRank) / (1 + reverseRank);
    previousRank = adjustedRank;
    const medianRank = bernardMedianRank(adjustedRank, n);
    points.push({
      time: unit.time,
      adjustedRank,
      medianRank,
      x: Math.log(unit.time),
      y: Math.log(-Math.log(1 - medianRank)),
    });
  });
  return { points, sampleSize: n, suspensionTimes };
}

/**
 * Fits β and η by median rank regression. Needs at least 2 failures at
 * different times: a line cannot be fitted through fewer distinct points.
 */
export function weibullMedianRankRegression(
  units: ReadonlyArray<WeibullUnit>,
  options: { regress?: WeibullRegression } = {},
): WeibullFit {
  const regress = options.regress ?? "x-on-y";
  if (regress !== "x-on-y" && regress !== "y-on-x") {
    throw new DomainInputError(
      `weibullMedianRankRegression: regress must be "x-on-y" or "y-on-x" (got ${String(regress)})`,
      "regress",
    );
  }
  const ranks = weibullMedianRanks(units);
  const { points } = ranks;
  if (points.length < 2) {
    throw new DomainInputError(
      `weibullMedianRankRegression: needs at least 2 failures to fit a Weibull line (got ${points.length} among ${units.length} units)`,
      "units",
    );
  }

  const m = points.length;
  const meanX = points.reduce((s, p) => s + p.x, 0) / m;
  const meanY = points.reduce((s, p) => s + p.y, 0) / m;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (const p of points) {
    sxx += (p.x - meanX) ** 2;
    syy += (p.y - meanY) ** 2;
    sxy += (p.x - meanX) * (p.y - meanY);
  }
  if (sxx === 0) {
    throw new DomainInputError(
      `weibullMedianRankRegression: all ${m} failures are at the same time (${points[0].time}); the slope is undefined`,
      "units",
    );
  }

  let beta: number;
  let lnEta: number;
  if (regress === "y-on-x") {
    // y = a + b·x, so β = b and ln η = −a/b = meanX − meanY/b.
    beta = sxy / sxx;
    lnEta = meanX - meanY / beta;
  } else {
    // x = c + d·y, so β = 1/d and ln η = c (x where y = 0).
    const d = sxy / syy;
    beta = 1 / d;
    lnEta = meanX - d * meanY;
  }
  return { ...ranks, beta, eta: Math.exp(lnEta), r2: (sxy * sxy) / (sxx * syy), regress };
}

export interface WeibullLinePoint {
  time: number;
  x: number;
  y: number;
  unreliability: number;
}

export interface WeibullPlot {
  /** The plotted failures (x = ln t, y = ln(−ln(1 − F))). */
  points: WeibullPoint[];
  suspensionTimes: number[];
  /** Ends of the fitted line, for drawing it as one segment on Weibull axes. */
  line: { start: WeibullLinePoint; end: WeibullLinePoint };
  beta: number;
  eta: number;
}

/**
 * Chart data for a fit: the points and the fitted line's end points. By default
 * the line spans the first to the last failure; pass a time range to extend it
 * (e.g. to the axis limits), since extrapolating a fit is the chart's choice.
 */
export function weibullPlot(fit: WeibullFit, range?: { fromTime: number; toTime: number }): WeibullPlot {
  const fromTime = range?.fromTime ?? fit.points[0].time;
  const toTime = range?.toTime ?? fit.points[fit.points.length - 1].time;
  requireFinitePositive("weibullPlot", "fromTime", fromTime);
  requireFinitePositive("weibullPlot", "toTime", toTime);
  if (toTime < fromTime) {
    throw new DomainInputError(`weibullPlot: toTime (${toTime}) must not be before fromTime (${fromTime})`, "toTime");
  }
  const at = (time: number): WeibullLinePoint => {
    const x = Math.log(time);
    return {
      time,
      x,
      y: fit.beta * (x - Math.log(fit.eta)),
      unreliability: weibullUnreliability(time, fit.beta, fit.eta),
    };
  };
  return {
    points: fit.points,
    suspensionTimes: fit.suspensionTimes,
    line: { start: at(fromTime), end: at(toTime) },
    beta: fit.beta,
    eta: fit.eta,
  };
}
