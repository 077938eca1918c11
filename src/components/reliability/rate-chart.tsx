// The monthly rate chart behind one small interface, so the drawing can move to a charting library
// (recharts, once it is installed) without touching the Rates page: only this file changes.
export { SvgRateChart as RateChart } from "./svg-rate-chart";

export interface RateChartPoint {
  /** "YYYY-MM" */
  month: string;
  /** Rate per 1,000 unit hours, or null when the month had no unit hours. */
  rate: number | null;
  /** The month's alert level, or null when there were too few earlier months. */
  alertLevel: number | null;
  aboveAlert: boolean | null;
  /** The month is over; an open month is drawn as provisional. */
  closed: boolean;
}

export interface RateChartProps {
  points: RateChartPoint[];
  /** Short accessible title, e.g. "Unscheduled removals per 1,000 unit hours, QF-3242-50". */
  title: string;
  /** Unit of the y axis, shown beside it. */
  yLabel: string;
}
