// Chi-square distribution, written here rather than pulled from a statistics
// package so the domain layer stays dependency-free and its accuracy is ours to
// test (the tests compare it with an independent library).
//
// Convention: chiSquareQuantile(p, dof) is the value with LOWER-tail probability
// p, so chiSquareQuantile(0.95, 10) ≈ 18.307 — the same reading as the usual
// table headed by cumulative probability, and as χ²(1−α; ν) in the MTBF bounds.

import { DomainInputError } from "../errors";
import { requireFiniteNonNegative, requireFinitePositive } from "./validate";

// Relative tolerance for the series and continued fraction: a few ulps, since a
// tolerance below double precision (2.2e-16) might never be met.
const EPSILON = 1e-15;
const TINY = 1e-300;
const MAX_SERIES_TERMS = 100_000;

// Lanczos approximation (g = 7, 9 coefficients): about 15 significant digits
// for x > 0, which is all the incomplete gamma needs.
const LANCZOS_G = 7;
const LANCZOS_COEFFICIENTS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
];

/** ln Γ(x) for x > 0. */
export function lnGamma(x: number): number {
  if (x < 0.5) {
    // Reflection keeps the approximation in the range where it is accurate.
    return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x);
  }
  const z = x - 1;
  let sum = LANCZOS_COEFFICIENTS[0];
  for (let i = 1; i < LANCZOS_COEFFICIENTS.length; i++) sum += LANCZOS_COEFFICIENTS[i] / (z + i);
  const t = z + LANCZOS_G + 0.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

/**
 * Regularized incomplete gamma functions P(a, x) (lower) and Q(a, x) = 1 − P
 * (upper). The one that converges fast is computed directly and the other as its
 * complement, so the small tail keeps its relative accuracy: the series for P
 * when x < a + 1, the continued fraction (modified Lentz) for Q otherwise.
 */
export function regularizedGamma(a: number, x: number): { lower: number; upper: number } {
  if (x <= 0) return { lower: 0, upper: 1 };
  if (x === Infinity) return { lower: 1, upper: 0 };
  const logPrefactor = -x + a * Math.log(x) - lnGamma(a);

  if (x < a + 1) {
    let term = 1 / a;
    let sum = term;
    for (let n = 1; n <= MAX_SERIES_TERMS; n++) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * EPSILON) {
        const lower = Math.min(1, sum * Math.exp(logPrefactor));
        return { lower, upper: 1 - lower };
      }
    }
    throw new Error(`regularizedGamma: series did not converge for a = ${a}, x = ${x}`);
  }

  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i <= MAX_SERIES_TERMS; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < EPSILON) {
      const upper = Math.min(1, Math.exp(logPrefactor) * h);
      return { lower: 1 - upper, upper };
    }
  }
  throw new Error(`regularizedGamma: continued fraction did not converge for a = ${a}, x = ${x}`);
}

/** P(χ²_dof ≤ x). dof may be any positive real; x ≤ 0 gives 0. */
export function chiSquareCdf(x: number, dof: number): number {
  requireFinitePositive("chiSquareCdf", "dof", dof);
  if (typeof x !== "number" || Number.isNaN(x)) {
    throw new DomainInputError(`chiSquareCdf: x must be a number (got ${String(x)})`, "x");
  }
  return regularizedGamma(dof / 2, x / 2).lower;
}

/**
 * Standard normal quantile by Acklam's rational approximation (relative error
 * about 1e-9). Used only for the Wilson–Hilferty starting point, so its last
 * digits do not reach the result: the root finder below polishes them away.
 */
function normalQuantileApprox(p: number): number {
  const a = [-39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239];
  const b = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572];
  const c = [-0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const tail = (q: number) =>
    (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
    ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  if (p < 0.02425) return tail(Math.sqrt(-2 * Math.log(p)));
  if (p > 1 - 0.02425) return -tail(Math.sqrt(-2 * Math.log(1 - p)));
  const q = p - 0.5;
  const r = q * q;
  return (
    ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) /
    (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1)
  );
}

/** Starting point for the chi-square quantile: Wilson–Hilferty, or the small-x series when that goes non-positive. */
function initialChiSquareGuess(p: number, dof: number): number {
  const z = normalQuantileApprox(p);
  const s = 2 / (9 * dof);
  const wilsonHilferty = dof * Math.pow(1 - s + z * Math.sqrt(s), 3);
  if (wilsonHilferty > 0) return wilsonHilferty;
  // Deep in the left tail of small dof Wilson–Hilferty goes negative. There
  // P(a, y) ≈ y^a / Γ(a + 1), which inverts in closed form.
  const a = dof / 2;
  return 2 * Math.exp((Math.log(p) + lnGamma(a + 1)) / a);
}

/**
 * The chi-square value with lower-tail probability p: chiSquareCdf(x, dof) = p.
 * p = 0 gives 0 and p = 1 gives Infinity.
 *
 * Safeguarded Newton: every evaluation tightens a bracket [lo, hi] around the
 * root, and a Newton step that would leave the bracket is replaced by
 * bisection, so it converges even where the density is nearly flat or infinite
 * (dof ≤ 2 near zero). For p > 0.5 it solves the upper tail Q = 1 − p instead,
 * which keeps full relative accuracy close to p = 1.
 */
export function chiSquareQuantile(p: number, dof: number): number {
  requireFinitePositive("chiSquareQuantile", "dof", dof);
  requireFiniteNonNegative("chiSquareQuantile", "p", p);
  if (p > 1) throw new DomainInputError(`chiSquareQuantile: p must be between 0 and 1 (got ${p})`, "p");
  if (p === 0) return 0;
  if (p === 1) return Infinity;

  const a = dof / 2;
  const useUpper = p > 0.5;
  const target = useUpper ? 1 - p : p;
  // Increasing in y (the gamma variate, y = x / 2) whichever tail is used.
  const residual = (y: number) => {
    const { lower, upper } = regularizedGamma(a, y);
    return useUpper ? target - upper : lower - target;
  };
  const lnGammaA = lnGamma(a);

  let lo = 0;
  let hi = Infinity;
  let y = initialChiSquareGuess(p, dof) / 2;
  for (let iteration = 0; iteration < 500; iteration++) {
    const r = residual(y);
    if (r === 0) return 2 * y;
    if (r < 0) lo = y;
    else hi = y;
    const density = Math.exp((a - 1) * Math.log(y) - y - lnGammaA);
    let next = y - r / density;
    if (hi === Infinity) {
      // No upper bracket yet: where the density is tiny a raw Newton step can
      // shoot off by many orders of magnitude, so grow by at most 4× per step.
      next = Math.min(next, 4 * y);
    } else if (!(next > lo && next < hi)) {
      next = (lo + hi) / 2;
    }
    if (Math.abs(next - y) <= 1e-15 * y || hi - lo <= 1e-15 * y) return 2 * next;
    y = next;
  }
  throw new Error(`chiSquareQuantile: no convergence for p = ${p}, dof = ${dof}`);
}
