// Poisson alert test on a month's removal COUNT, as an alternative to alert
// levels on the rate (the method is recalled from memory, not from a published
// source). With a baseline rate and this month's unit hours the expected count is
// λ = rate × hours / 1000; the alert count is the smallest c with
// P(X ≥ c | λ) ≤ α, so a month at or above it is unlikely (≤ α) to be chance.
// It suits low-count parts where a single removal swings a monthly rate.

import { regularizedGamma } from "./chi-square";
import { requireFiniteNonNegative, requireNonNegativeInteger, requireOpenProbability } from "./validate";

/** P(X ≥ count) for X ~ Poisson(expected). Uses P(X ≥ c) = P(c, λ), the regularized lower incomplete gamma. */
export function poissonTailProbability(count: number, expected: number): number {
  requireNonNegativeInteger("poissonTailProbability", "count", count);
  requireFiniteNonNegative("poissonTailProbability", "expected", expected);
  if (count === 0) return 1;
  return regularizedGamma(count, expected).lower;
}

export interface PoissonAlert {
  /** λ = baselineRatePer1000 × unitHours / 1000. */
  expectedRemovals: number;
  /** Smallest count c with P(X ≥ c | λ) ≤ alpha: the month is in alert when its count ≥ c. */
  alertCount: number;
  /** P(X ≥ alertCount | λ), at most alpha. */
  tailProbability: number;
}

export function poissonAlert(baselineRatePer1000: number, unitHours: number, alpha = 0.05): PoissonAlert {
  requireFiniteNonNegative("poissonAlert", "baselineRatePer1000", baselineRatePer1000);
  requireFiniteNonNegative("poissonAlert", "unitHours", unitHours);
  requireOpenProbability("poissonAlert", "alpha", alpha);
  const expected = (baselineRatePer1000 * unitHours) / 1000;

  // The tail falls as c rises, so bracket by doubling and then bisect.
  let hi = 1;
  while (poissonTailProbability(hi, expected) > alpha) hi *= 2;
  let lo = 0; // P(X ≥ 0) = 1 > alpha always
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (poissonTailProbability(mid, expected) > alpha) lo = mid;
    else hi = mid;
  }
  return { expectedRemovals: expected, alertCount: hi, tailProbability: poissonTailProbability(hi, expected) };
}
