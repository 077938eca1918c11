// Removal statistics for one part-number group over one reporting period.
//
// Exposure is UNIT hours: fleet flight hours × quantity per aircraft (QPA), i.e.
// the hours the installed units themselves flew. That is the denominator of the
// ATA CSDD MTBUR definition ("total unit flying hours (airborne) … divided by
// the number of unscheduled unit removals"). Some programmes divide removal
// rates by aircraft flight hours instead; every rate here uses unit hours, so a
// QPA-2 part shows half the per-1,000 rate it would against fleet hours.
//
// The ledger keeps time in integer minutes; convert once with
// unitHoursFromMinutes and work in hours (a plain number) at this layer.

import { DomainInputError } from "../errors";
import { chiSquareQuantile } from "./chi-square";
import {
  requireFiniteNonNegative,
  requireNonNegativeInteger,
  requireOpenProbability,
} from "./validate";

/** Integer flight minutes (as the ledger stores them) → hours for this layer. */
export function unitHoursFromMinutes(unitMinutes: number): number {
  requireNonNegativeInteger("unitHoursFromMinutes", "unitMinutes", unitMinutes);
  return unitMinutes / 60;
}

/**
 * Mean time between unscheduled removals = unit hours ÷ unscheduled removals.
 * Null when there were no unscheduled removals: the ratio is undefined, and
 * "infinite MTBUR" would mislead; use mtburLowerBoundZeroEvents for that case.
 */
export function mtbur(unitHours: number, unscheduledRemovals: number): number | null {
  requireFiniteNonNegative("mtbur", "unitHours", unitHours);
  requireNonNegativeInteger("mtbur", "unscheduledRemovals", unscheduledRemovals);
  return unscheduledRemovals === 0 ? null : unitHours / unscheduledRemovals;
}

/**
 * One-sided lower confidence bound on MTBUR when no unscheduled removal
 * occurred in T unit hours: 2T / χ²(CL; 2), as in the ATA CSDD definition
 * (e.g. CL = 0.90: χ²(0.90; 2) = 4.61, bound ≈ 0.434 T). With 2 degrees of
 * freedom this equals T / −ln(1 − CL); the general chi-square is used so the
 * formula reads as the definition does.
 */
export function mtburLowerBoundZeroEvents(unitHours: number, confidence: number): number {
  requireFiniteNonNegative("mtburLowerBoundZeroEvents", "unitHours", unitHours);
  requireOpenProbability("mtburLowerBoundZeroEvents", "confidence", confidence);
  return (2 * unitHours) / chiSquareQuantile(confidence, 2);
}

/**
 * Mean time between (shop-confirmed) failures = unit hours ÷ confirmed failures.
 * Null when no failure was confirmed.
 */
export function mtbf(unitHours: number, confirmedFailures: number): number | null {
  requireFiniteNonNegative("mtbf", "unitHours", unitHours);
  requireNonNegativeInteger("mtbf", "confirmedFailures", confirmedFailures);
  return confirmedFailures === 0 ? null : unitHours / confirmedFailures;
}

/**
 * Removals per 1,000 UNIT hours (not aircraft flight hours; see the file
 * comment) = removals × 1000 ÷ unit hours. Pass all removals or only the
 * unscheduled ones, as the report needs. Null when there were no unit hours.
 */
export function removalRatePer1000(removals: number, unitHours: number): number | null {
  requireNonNegativeInteger("removalRatePer1000", "removals", removals);
  requireFiniteNonNegative("removalRatePer1000", "unitHours", unitHours);
  return unitHours === 0 ? null : (removals * 1000) / unitHours;
}

/**
 * Share of unscheduled removals that the shop found no fault with, as a
 * fraction 0–1 (multiply by 100 for a percentage). Null with no unscheduled removals.
 */
export function noFaultFoundRate(noFaultFound: number, unscheduledRemovals: number): number | null {
  requireNonNegativeInteger("noFaultFoundRate", "noFaultFound", noFaultFound);
  requireNonNegativeInteger("noFaultFoundRate", "unscheduledRemovals", unscheduledRemovals);
  if (noFaultFound > unscheduledRemovals) {
    throw new DomainInputError(
      `noFaultFoundRate: noFaultFound (${noFaultFound}) cannot exceed unscheduledRemovals (${unscheduledRemovals})`,
      "noFaultFound",
    );
  }
  return unscheduledRemovals === 0 ? null : noFaultFound / unscheduledRemovals;
}

export interface RemovalCounts {
  unitHours: number;
  removals: number;
  unscheduledRemovals: number;
  confirmedFailures: number;
  noFaultFound: number;
}

export interface RemovalStatistics {
  unitHours: number;
  mtbur: number | null;
  mtbf: number | null;
  /** All removals (scheduled + unscheduled) per 1,000 unit hours. */
  removalRatePer1000: number | null;
  /** Unscheduled removals per 1,000 unit hours. */
  unscheduledRemovalRatePer1000: number | null;
  /** NFF findings ÷ unscheduled removals, 0–1. */
  noFaultFoundRate: number | null;
}

/**
 * All the figures for one P/N group and period, after checking the counts
 * agree with each other: unscheduled removals are a subset of removals, NFF
 * findings come from unscheduled removals, and confirmed failures from removals.
 */
export function removalStatistics(counts: RemovalCounts): RemovalStatistics {
  const { unitHours, removals, unscheduledRemovals, confirmedFailures, noFaultFound } = counts;
  requireNonNegativeInteger("removalStatistics", "removals", removals);
  requireNonNegativeInteger("removalStatistics", "unscheduledRemovals", unscheduledRemovals);
  requireNonNegativeInteger("removalStatistics", "confirmedFailures", confirmedFailures);
  if (unscheduledRemovals > removals) {
    throw new DomainInputError(
      `removalStatistics: unscheduledRemovals (${unscheduledRemovals}) cannot exceed removals (${removals})`,
      "unscheduledRemovals",
    );
  }
  if (confirmedFailures > removals) {
    throw new DomainInputError(
      `removalStatistics: confirmedFailures (${confirmedFailures}) cannot exceed removals (${removals})`,
      "confirmedFailures",
    );
  }
  return {
    unitHours,
    mtbur: mtbur(unitHours, unscheduledRemovals),
    mtbf: mtbf(unitHours, confirmedFailures),
    removalRatePer1000: removalRatePer1000(removals, unitHours),
    unscheduledRemovalRatePer1000: removalRatePer1000(unscheduledRemovals, unitHours),
    noFaultFoundRate: noFaultFoundRate(noFaultFound, unscheduledRemovals),
  };
}
