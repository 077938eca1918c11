// Chi-square confidence bounds on MTBF for a constant failure rate
// (exponential times between failures). Formulas as given, from memory, in
// MIL-HDBK-338B §8 and MIL-HDBK-781A; the choice of degrees of freedom is the
// usual one (see also Sundberg 2000 and Nelson 1982 on the conventions):
//
//  time-truncated test (observation stops at a fixed T; the normal case for
//  fleet data over a reporting period):
//    lower one-sided θ_L = 2T / χ²(1 − α; 2r + 2)
//    two-sided [2T / χ²(1 − α/2; 2r + 2), 2T / χ²(α/2; 2r)]
//  failure-truncated test (stops at the r-th failure): 2r dof throughout.
//
// χ²(p; ν) has LOWER-tail probability p (chiSquareQuantile). T is total unit
// hours, r the number of failures, confidence = 1 − α. For a two-sided interval
// the confidence is the whole interval's: 0.90 puts 5 % in each tail.
// With r = 0 (time-truncated) there is no upper bound: it is returned as null.

import { DomainInputError } from "../errors";
import { chiSquareQuantile } from "./chi-square";
import {
  requireFiniteNonNegative,
  requireNonNegativeInteger,
  requireOpenProbability,
} from "./validate";

/** "time": the test or period ended at a fixed time; "failure": it ended at the r-th failure. */
export type TestTruncation = "time" | "failure";

export interface MtbfInterval {
  /** T / r, or null when r = 0. */
  pointEstimate: number | null;
  lower: number;
  /** null when there is no finite upper bound (r = 0, time-truncated). */
  upper: number | null;
}

function checkInputs(where: string, totalHours: number, failures: number, confidence: number, truncation: TestTruncation): void {
  requireFiniteNonNegative(where, "totalHours", totalHours);
  requireNonNegativeInteger(where, "failures", failures);
  requireOpenProbability(where, "confidence", confidence);
  if (truncation !== "time" && truncation !== "failure") {
    throw new DomainInputError(
      `${where}: truncation must be "time" or "failure" (got ${String(truncation)})`,
      "truncation",
    );
  }
  if (truncation === "failure" && failures === 0) {
    throw new DomainInputError(
      `${where}: a failure-truncated test ends at a failure, so failures must be at least 1 (got 0)`,
      "failures",
    );
  }
}

/** One-sided lower confidence bound on MTBF: the MTBF is at least this with the given confidence. */
export function mtbfLowerBound(
  totalHours: number,
  failures: number,
  confidence: number,
  truncation: TestTruncation = "time",
): number {
  checkInputs("mtbfLowerBound", totalHours, failures, confidence, truncation);
  const dof = truncation === "time" ? 2 * failures + 2 : 2 * failures;
  return (2 * totalHours) / chiSquareQuantile(confidence, dof);
}

/** Two-sided confidence interval on MTBF, with the point estimate T / r. */
export function mtbfConfidenceInterval(
  totalHours: number,
  failures: number,
  confidence: number,
  truncation: TestTruncation = "time",
): MtbfInterval {
  checkInputs("mtbfConfidenceInterval", totalHours, failures, confidence, truncation);
  const alpha = 1 - confidence;
  const lowerDof = truncation === "time" ? 2 * failures + 2 : 2 * failures;
  const lower = (2 * totalHours) / chiSquareQuantile(1 - alpha / 2, lowerDof);
  const upper = failures === 0 ? null : (2 * totalHours) / chiSquareQuantile(alpha / 2, 2 * failures);
  return { pointEstimate: failures === 0 ? null : totalHours / failures, lower, upper };
}
