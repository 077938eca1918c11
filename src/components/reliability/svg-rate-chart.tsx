"use client";

import { useEffect, useRef } from "react";
import type { RateChartProps } from "./rate-chart";

const WIDTH = 960;
const HEIGHT = 340;
const MARGIN = { top: 34, right: 110, bottom: 52, left: 64 };

const MONTH_NAMES = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const monthLabel = (month: string) => `${MONTH_NAMES[Number(month.slice(5, 7)) - 1]}`;

/** Round tick steps (1, 2, 2.5, 5 × 10^n) giving about `count` ticks up to max. */
export function niceTicks(max: number, count = 5): number[] {
  if (!(max > 0)) return [0, 1];
  const rough = max / count;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= rough) ?? 10 * power;
  const ticks: number[] = [];
  for (let v = 0; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  if (ticks[ticks.length - 1] < max) ticks.push(Number((ticks[ticks.length - 1] + step).toPrecision(12)));
  return ticks;
}

/**
 * Monthly rate bars with the alert level as a stepped dashed line. A month above its alert level
 * is hatched and labelled "▲ Above" (never colour alone); an open month has a dashed outline and
 * the word "open". The same figures are in the table beside the chart for screen readers.
 */
export function SvgRateChart({ points, title, yLabel }: RateChartProps) {
  const plotWidth = WIDTH - MARGIN.left - MARGIN.right;
  const plotHeight = HEIGHT - MARGIN.top - MARGIN.bottom;
  const highest = Math.max(0, ...points.flatMap((p) => [p.rate ?? 0, p.alertLevel ?? 0]));
  const ticks = niceTicks(highest * 1.1 || 1);
  const yMax = ticks[ticks.length - 1];
  const y = (value: number) => MARGIN.top + plotHeight - (value / yMax) * plotHeight;
  const band = plotWidth / Math.max(1, points.length);
  const x = (index: number) => MARGIN.left + index * band;
  const barWidth = Math.max(4, band * 0.62);
  const lastLevel = [...points].reverse().find((p) => p.alertLevel !== null);
  const titleId = "rate-chart-title";
  const scroller = useRef<HTMLDivElement>(null);
  // Where the chart is wider than the screen, start at the newest months: they are what is being watched.
  useEffect(() => {
    if (scroller.current) scroller.current.scrollLeft = scroller.current.scrollWidth;
  }, [points.length]);

  // The alert level as steps: one horizontal segment per month, joined where consecutive months have one.
  let alertPath = "";
  points.forEach((p, i) => {
    if (p.alertLevel === null) return;
    const left = x(i);
    const right = x(i + 1);
    const previous = i > 0 ? points[i - 1].alertLevel : null;
    alertPath += previous === null ? `M${left},${y(p.alertLevel)}` : `L${left},${y(p.alertLevel)}`;
    alertPath += ` L${right},${y(p.alertLevel)} `;
  });

  return (
    <figure className="space-y-2">
      {/* On a phone the chart keeps a readable size and scrolls sideways. */}
      <div ref={scroller} className="overflow-x-auto">
      <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} role="img" aria-labelledby={titleId} className="h-auto w-full min-w-[680px] max-w-[1100px] text-[var(--ink)]">
        <title id={titleId}>{title}</title>
        <defs>
          <pattern id="above-alert-hatch" patternUnits="userSpaceOnUse" width="8" height="8" patternTransform="rotate(45)">
            <rect width="8" height="8" className="fill-red-100 dark:fill-red-950" />
            <line x1="0" y1="0" x2="0" y2="8" strokeWidth="4" className="stroke-red-800 dark:stroke-red-300" />
          </pattern>
        </defs>

        {ticks.map((tick) => (
          <g key={tick}>
            <line x1={MARGIN.left} x2={WIDTH - MARGIN.right} y1={y(tick)} y2={y(tick)} stroke="var(--rule)" strokeWidth={1} />
            <text x={MARGIN.left - 8} y={y(tick) + 5} textAnchor="end" fontSize={14} fill="currentColor" className="num">
              {tick}
            </text>
          </g>
        ))}
        <text x={16} y={MARGIN.top + plotHeight / 2} transform={`rotate(-90 16 ${MARGIN.top + plotHeight / 2})`} textAnchor="middle" fontSize={14} fill="currentColor">
          {yLabel}
        </text>

        {points.map((p, i) => {
          const center = x(i) + band / 2;
          const showYear = i === 0 || p.month.endsWith("-01");
          return (
            <g key={p.month}>
              {p.rate !== null ? (
                <rect
                  x={center - barWidth / 2}
                  y={y(p.rate)}
                  width={barWidth}
                  height={Math.max(0, y(0) - y(p.rate))}
                  fill={p.aboveAlert ? "url(#above-alert-hatch)" : "var(--accent)"}
                  fillOpacity={p.closed ? 1 : 0.45}
                  stroke={p.aboveAlert ? undefined : "var(--accent)"}
                  strokeDasharray={p.closed ? undefined : "4 3"}
                  strokeWidth={p.closed ? 0 : 2}
                  className={p.aboveAlert ? "stroke-red-800 dark:stroke-red-300" : undefined}
                >
                  <title>{`${p.month}: ${p.rate.toFixed(3)}${p.alertLevel !== null ? `, alert level ${p.alertLevel.toFixed(3)}` : ""}${p.aboveAlert ? ", above alert level" : ""}${p.closed ? "" : " (month not closed)"}`}</title>
                </rect>
              ) : (
                <text x={center} y={y(0) - 6} textAnchor="middle" fontSize={12} fill="currentColor">
                  n/a
                </text>
              )}
              {p.aboveAlert && p.rate !== null ? (
                <text x={center} y={y(p.rate) - 8} textAnchor="middle" fontSize={13} fontWeight={700} className="fill-red-900 dark:fill-red-200">
                  ▲ Above
                </text>
              ) : null}
              {!p.closed ? (
                <text x={center} y={y(0) + 40} textAnchor="middle" fontSize={12} fill="currentColor">
                  open
                </text>
              ) : null}
              <text x={center} y={y(0) + 18} textAnchor="middle" fontSize={13} fill="currentColor">
                {monthLabel(p.month)}
              </text>
              {showYear ? (
                <text x={center} y={y(0) + 33} textAnchor="middle" fontSize={12} fill="currentColor" className="num">
                  {p.month.slice(0, 4)}
                </text>
              ) : null}
            </g>
          );
        })}

        <line x1={MARGIN.left} x2={WIDTH - MARGIN.right} y1={y(0)} y2={y(0)} stroke="currentColor" strokeWidth={1.5} />
        {alertPath ? <path d={alertPath} fill="none" strokeWidth={3} strokeDasharray="9 5" className="stroke-amber-700 dark:stroke-amber-300" /> : null}
        {lastLevel?.alertLevel != null ? (
          <text x={WIDTH - MARGIN.right + 8} y={y(lastLevel.alertLevel) + 5} fontSize={13} fontWeight={700} className="fill-amber-800 dark:fill-amber-200">
            Alert level
          </text>
        ) : null}
      </svg>
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
            <rect width="18" height="14" fill="url(#above-alert-hatch)" />
          </svg>
          ▲ Above the alert level
        </span>
        <span className="inline-flex items-center gap-2">
          <svg width="28" height="14" aria-hidden="true">
            <line x1="0" y1="7" x2="28" y2="7" strokeWidth="3" strokeDasharray="9 5" className="stroke-amber-700 dark:stroke-amber-300" />
          </svg>
          Alert level (mean + k·SD of the 12 months before)
        </span>
        <span>Pale, dashed bar: month not closed yet</span>
      </figcaption>
    </figure>
  );
}
