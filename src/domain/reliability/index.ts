// Reliability methods for a maintenance reliability programme: removal
// statistics, monthly rates and alert levels, Weibull analysis with
// suspensions, and chi-square bounds on MTBF. Pure functions on plain values.

export {
  unitHoursFromMinutes,
  mtbur,
  mtburLowerBoundZeroEvents,
  mtbf,
  removalRatePer1000,
  noFaultFoundRate,
  removalStatistics,
} from "./removal-stats";
export type { RemovalCounts, RemovalStatistics } from "./removal-stats";

export { monthlyRates, alertLevel, markAlerts, alertLevelRunningAverage, DEFAULT_BASELINE_MONTHS, DEFAULT_MIN_PRIOR_MONTHS } from "./alert-levels";
export type { MonthlyCounts, MonthlyRate, MonthlyValue, MonthlyAlert } from "./alert-levels";

export { poissonAlert, poissonTailProbability } from "./poisson-alert";
export type { PoissonAlert } from "./poisson-alert";

export {
  bernardMedianRank,
  weibullPlotY,
  weibullUnreliability,
  weibullTimeAtUnreliability,
  weibullMedianRanks,
  weibullMedianRankRegression,
  weibullPlot,
} from "./weibull";
export type {
  WeibullUnit,
  WeibullRegression,
  WeibullPoint,
  WeibullMedianRanks,
  WeibullFit,
  WeibullLinePoint,
  WeibullPlot,
} from "./weibull";

export { chiSquareCdf, chiSquareQuantile } from "./chi-square";

export { mtbfLowerBound, mtbfConfidenceInterval } from "./mtbf-bounds";
export type { TestTruncation, MtbfInterval } from "./mtbf-bounds";

export {
  aircraftMinutesAt,
  monthOf,
  monthStart,
  startOfMonth,
  monthWindows,
  unitMinutesByWindow,
  flightMinutesBetween,
} from "./exposure";
export type { UtilizationPoint, FittedInterval, MonthWindow } from "./exposure";

export { reliabilityReport, weibullSample } from "./report";
export type { Finding, RemovalEvent, ReportInput, ReportMonth, Report, TimeOnWing, WeibullSample } from "./report";
