"use client";

import { useEffect, useId, useRef } from "react";
import {
  Bar,
  CartesianGrid,
  ComposedChart,
  Label,
  Line,
  Rectangle,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
  usePlotArea,
  useXAxisScale,
  useYAxisScale,
  type BarShapeProps,
  type TooltipContentProps,
  type XAxisTickContentProps,
} from "recharts";

// The monthly rate chart of the Rates page, drawn with recharts. Only the Rates page imports it,
// so recharts is in that route's JavaScript and no other page's.

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

const HEIGHT = 380;
/** Narrowest a month's band may get before the plot scrolls sideways (room for "▲ Above"). */
const MIN_BAND = 58;
const MIN_PLOT_WIDTH = 520;
/** The y axis is a chart of its own beside the plot, so it stays in view while a phone scrolls the months. */
const AXIS_WIDTH = 80;
const MARGIN = { top: 30, right: 88, bottom: 8, left: 0 };
const X_AXIS_HEIGHT = 76;
const FONT = 14;

const MONTH_NAMES = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const monthName = (month: string) => MONTH_NAMES[Number(month.slice(5, 7)) - 1] ?? month;
const figure = (value: number | null) => (value === null ? "—" : value.toFixed(3));

/** Round tick steps (1, 2, 2.5, 5 × 10^n) from 0 to at least max, about `count` of them. */
export function niceTicks(max: number, count = 4): number[] {
  if (!(max > 0)) return [0, 0.25, 0.5, 0.75, 1];
  const rough = max / count;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= rough) ?? 10 * power;
  const ticks: number[] = [];
  for (let i = 0; ticks.length === 0 || ticks[ticks.length - 1] < max; i++) ticks.push(Number((i * step).toPrecision(12)));
  return ticks;
}

/**
 * Monthly rate bars with the alert level as a dashed stepped line. A month above its alert level
 * is hatched, outlined and labelled "▲ Above" (never colour alone); an open month is pale with a
 * dashed outline and the word "open" under its name. The same figures are in the month table
 * beside the chart, which is the readable version for screen readers.
 */
export function RateChart({ points, title, yLabel }: RateChartProps) {
  const hatchId = `above-alert-hatch-${useId().replace(/[^a-zA-Z0-9_-]/g, "")}`;
  const scroller = useRef<HTMLDivElement>(null);
  // Where the chart is wider than the screen, start at the newest months: they are what is being watched.
  useEffect(() => {
    if (scroller.current) scroller.current.scrollLeft = scroller.current.scrollWidth;
  }, [points.length]);

  const highest = Math.max(0, ...points.flatMap((p) => [p.rate ?? 0, p.alertLevel ?? 0]));
  const ticks = niceTicks(highest * 1.08);
  const domain: [number, number] = [0, ticks[ticks.length - 1]];
  const lastLevel = [...points].reverse().find((p) => p.alertLevel !== null)?.alertLevel ?? null;
  const minWidth = Math.max(MIN_PLOT_WIDTH, points.length * MIN_BAND + MARGIN.right);

  const barShape = (props: BarShapeProps) => {
    const point = points[props.index];
    if (!point || point.rate === null) return <g />;
    const above = point.aboveAlert === true;
    return (
      <Rectangle
        x={props.x}
        y={props.y}
        width={props.width}
        height={props.height}
        fill={above ? `url(#${hatchId})` : "var(--accent)"}
        fillOpacity={point.closed ? 1 : 0.45}
        stroke={above ? "var(--above-ink)" : point.closed ? "none" : "var(--accent)"}
        strokeWidth={above ? 2 : point.closed ? 0 : 2}
        strokeDasharray={point.closed ? undefined : "4 3"}
      />
    );
  };

  return (
    <figure
      className="space-y-2 [--above-fill:#fee2e2] [--above-ink:#7f1d1d] [--alert-line:#b45309] [--alert-ink:#92400e] dark:[--above-fill:#450a0a] dark:[--above-ink:#fecaca] dark:[--alert-line:#fcd34d] dark:[--alert-ink:#fde68a]"
    >
      <div className="flex text-[var(--ink)]">
        {/* The y axis and its unit, outside the scrolling part. */}
        <div className="shrink-0" style={{ width: AXIS_WIDTH }} aria-hidden="true">
          <ComposedChart width={AXIS_WIDTH} height={HEIGHT} data={points} margin={{ ...MARGIN, left: 0, right: 0 }} accessibilityLayer={false}>
            <XAxis dataKey="month" height={X_AXIS_HEIGHT} tick={false} tickLine={false} axisLine={false} />
            <YAxis
              width={AXIS_WIDTH - 2}
              domain={domain}
              ticks={ticks}
              interval={0}
              tickLine={false}
              axisLine={false}
              tick={{ fill: "currentColor", fontSize: FONT }}
              tickFormatter={(value: number) => String(Number(value.toFixed(3)))}
            >
              <Label value={yLabel} angle={-90} position="insideLeft" offset={6} fill="currentColor" fontSize={FONT} style={{ textAnchor: "middle" }} />
            </YAxis>
            {/* recharts gives an axis ticks only when a series uses it: an invisible one, on a 2 px plot. */}
            <Line dataKey="rate" stroke="none" dot={false} activeDot={false} isAnimationActive={false} />
          </ComposedChart>
        </div>
        {/* On a phone the months keep a readable width and scroll sideways, starting at the newest. */}
        <div ref={scroller} className="min-w-0 flex-1 overflow-x-auto">
          <div style={{ minWidth }}>
            <ResponsiveContainer width="100%" height={HEIGHT} initialDimension={{ width: minWidth, height: HEIGHT }}>
              <ComposedChart data={points} margin={MARGIN} role="img" title={title} accessibilityLayer={false} barCategoryGap="22%">
                <defs>
                  <pattern id={hatchId} patternUnits="userSpaceOnUse" width="8" height="8" patternTransform="rotate(45)">
                    <rect width="8" height="8" fill="var(--above-fill)" />
                    <line x1="0" y1="0" x2="0" y2="8" strokeWidth="4" stroke="var(--above-ink)" />
                  </pattern>
                </defs>
                <CartesianGrid vertical={false} stroke="var(--rule)" />
                <XAxis
                  dataKey="month"
                  interval={0}
                  height={X_AXIS_HEIGHT}
                  tickLine={false}
                  axisLine={{ stroke: "currentColor", strokeWidth: 1.5 }}
                  tick={(props: XAxisTickContentProps) => <MonthTick x={Number(props.x)} y={Number(props.y)} index={props.index} points={points} />}
                >
                  <Label value="Month (UTC)" position="insideBottom" offset={0} fill="currentColor" fontSize={FONT} />
                </XAxis>
                <YAxis hide domain={domain} ticks={ticks} interval={0} />
                <Tooltip content={(props) => <MonthTooltip {...props} />} cursor={{ fill: "var(--rule)", fillOpacity: 0.35 }} />
                <Bar dataKey="rate" name="Monthly rate" shape={barShape} isAnimationActive={false} maxBarSize={64} />
                <Line
                  dataKey="alertLevel"
                  name="Alert level"
                  type="step"
                  stroke="var(--alert-line)"
                  strokeWidth={3}
                  strokeDasharray="9 5"
                  dot={false}
                  activeDot={false}
                  connectNulls={false}
                  isAnimationActive={false}
                />
                <MonthMarks points={points} />
                {lastLevel !== null ? <AlertLevelTag level={lastLevel} /> : null}
              </ComposedChart>
            </ResponsiveContainer>
          </div>
        </div>
      </div>
      <figcaption className="flex flex-wrap gap-x-6 gap-y-1 text-sm">
        <span className="inline-flex items-center gap-2">
          <svg width="18" height="14" aria-hidden="true">
            <rect width="18" height="14" fill="var(--accent)" />
          </svg>
          Monthly rate
        </span>
        <span className="inline-flex items-center gap-2">
          <svg width="18" height="14" aria-hidden="true">
            <defs>
              <pattern id={`${hatchId}-key`} patternUnits="userSpaceOnUse" width="8" height="8" patternTransform="rotate(45)">
                <rect width="8" height="8" fill="var(--above-fill)" />
                <line x1="0" y1="0" x2="0" y2="8" strokeWidth="4" stroke="var(--above-ink)" />
              </pattern>
            </defs>
            <rect x="1" y="1" width="16" height="12" fill={`url(#${hatchId}-key)`} stroke="var(--above-ink)" strokeWidth="2" />
          </svg>
          ▲ Above the alert level
        </span>
        <span className="inline-flex items-center gap-2">
          <svg width="28" height="14" aria-hidden="true">
            <line x1="0" y1="7" x2="28" y2="7" strokeWidth="3" strokeDasharray="9 5" stroke="var(--alert-line)" />
          </svg>
          Alert level (set from the 12 months before each month)
        </span>
        <span>Pale, dashed bar: month not closed yet</span>
      </figcaption>
    </figure>
  );
}

/** The month's name under its bar, the year under January (and the first month), "open" under an open month. */
function MonthTick({ x, y, index, points }: { x: number; y: number; index: number; points: RateChartPoint[] }) {
  const point = points[index];
  if (!point) return <g />;
  const showYear = index === 0 || point.month.endsWith("-01");
  return (
    <g transform={`translate(${x},${y})`} fill="currentColor" fontSize={FONT} textAnchor="middle">
      <text dy={16}>{monthName(point.month)}</text>
      {showYear ? (
        <text dy={33} fontSize={13} className="num">
          {point.month.slice(0, 4)}
        </text>
      ) : null}
      {!point.closed ? (
        <text dy={50} fontSize={13} fontStyle="italic">
          open
        </text>
      ) : null}
    </g>
  );
}

/** "▲ Above" over each month above its alert level, "no FH" on a month without unit hours. */
function MonthMarks({ points }: { points: RateChartPoint[] }) {
  const x = useXAxisScale();
  const y = useYAxisScale();
  if (!x || !y) return null;
  const baseline = y(0);
  return (
    <g fontSize={13} textAnchor="middle">
      {points.map((p) => {
        const center = x(p.month, { position: "middle" });
        if (center === undefined || baseline === undefined) return null;
        if (p.rate === null) {
          return (
            <text key={p.month} x={center} y={baseline - 6} fill="currentColor">
              no FH
            </text>
          );
        }
        if (p.aboveAlert !== true) return null;
        const top = y(p.rate);
        return top === undefined ? null : (
          <text key={p.month} x={center} y={top - 8} fontWeight={700} fill="var(--above-ink)">
            ▲ Above
          </text>
        );
      })}
    </g>
  );
}

/** Names the dashed line once, in the right margin at the newest level. */
function AlertLevelTag({ level }: { level: number }) {
  const area = usePlotArea();
  const y = useYAxisScale();
  const at = y?.(level);
  if (!area || at === undefined) return null;
  return (
    <text x={area.x + area.width + 8} y={at + 5} fontSize={13} fontWeight={700} fill="var(--alert-ink)">
      Alert level
    </text>
  );
}

function MonthTooltip({ active, payload }: TooltipContentProps) {
  const point = active ? (payload?.[0]?.payload as RateChartPoint | undefined) : undefined;
  if (!point) return null;
  return (
    <div className="panel space-y-0.5 p-2 text-sm shadow-md">
      <p className="num font-semibold">
        {point.month}
        {point.closed ? "" : " (open)"}
      </p>
      <p>
        Rate <span className="num">{figure(point.rate)}</span>
      </p>
      <p>
        Alert level <span className="num">{figure(point.alertLevel)}</span>
      </p>
      {point.aboveAlert ? (
        <p className="font-semibold">
          <span aria-hidden="true">▲</span> Above the alert level
        </p>
      ) : null}
    </div>
  );
}
