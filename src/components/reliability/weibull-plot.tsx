import type { WeibullAnswer } from "@/lib/schemas/reliability";

const WIDTH = 640;
const HEIGHT = 400;
const MARGIN = { top: 20, right: 24, bottom: 70, left: 64 };
/** Unreliability gridlines on Weibull paper, as percentages. */
const F_TICKS = [1, 2, 5, 10, 20, 30, 50, 63.2, 80, 90, 95, 99];

const yOfF = (percent: number) => Math.log(-Math.log(1 - percent / 100));

function hourTicks(minLn: number, maxLn: number): number[] {
  const ticks: number[] = [];
  for (let power = Math.floor(minLn / Math.LN10); power <= Math.ceil(maxLn / Math.LN10); power++) {
    for (const m of [1, 2, 5]) {
      const value = m * 10 ** power;
      const ln = Math.log(value);
      if (ln >= minLn - 1e-9 && ln <= maxLn + 1e-9) ticks.push(value);
    }
  }
  return ticks;
}

/**
 * A Weibull probability plot: log time on the x axis, ln(−ln(1 − F)) on the y axis (labelled as
 * unreliability F), failures as points at their median ranks, the fitted line, and suspensions as
 * ticks under the axis (they carry no plotting position of their own).
 */
export function WeibullPlot({ answer }: { answer: WeibullAnswer }) {
  const { points, suspensionHours, line } = answer;
  if (!line || points.length === 0) return null;
  const allHours = [...points.map((p) => p.hours), ...suspensionHours, line.start.hours, line.end.hours].filter((h) => h > 0);
  const minLn = Math.log(Math.min(...allHours)) - 0.2;
  const maxLn = Math.log(Math.max(...allHours)) + 0.2;
  const ys = [...points.map((p) => p.y), line.start.y, line.end.y];
  const visibleF = F_TICKS.filter((f) => yOfF(f) >= Math.min(...ys) - 0.6 && yOfF(f) <= Math.max(...ys) + 0.6);
  const minY = Math.min(...ys, ...visibleF.map(yOfF)) - 0.2;
  const maxY = Math.max(...ys, ...visibleF.map(yOfF)) + 0.2;
  const plotWidth = WIDTH - MARGIN.left - MARGIN.right;
  const plotHeight = HEIGHT - MARGIN.top - MARGIN.bottom;
  const px = (hours: number) => MARGIN.left + ((Math.log(hours) - minLn) / (maxLn - minLn)) * plotWidth;
  const py = (yValue: number) => MARGIN.top + plotHeight - ((yValue - minY) / (maxY - minY)) * plotHeight;
  const bottom = MARGIN.top + plotHeight;

  return (
    <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} role="img" aria-labelledby="weibull-plot-title" className="h-auto w-full min-w-[520px] max-w-[720px] text-[var(--ink)]">
      <title id="weibull-plot-title">{`Weibull probability plot of time on wing, ${answer.partNumber}: ${answer.failures} failures, ${answer.suspensions} suspensions`}</title>
      {visibleF.map((f) => (
        <g key={f}>
          <line x1={MARGIN.left} x2={WIDTH - MARGIN.right} y1={py(yOfF(f))} y2={py(yOfF(f))} stroke="var(--rule)" strokeDasharray={f === 63.2 ? "6 3" : undefined} />
          <text x={MARGIN.left - 6} y={py(yOfF(f)) + 4} textAnchor="end" fontSize={12} fill="currentColor" className="num">
            {f}%
          </text>
        </g>
      ))}
      {hourTicks(minLn, maxLn).map((h) => (
        <g key={h}>
          <line x1={px(h)} x2={px(h)} y1={MARGIN.top} y2={bottom} stroke="var(--rule)" />
          <text x={px(h)} y={bottom + 16} textAnchor="middle" fontSize={12} fill="currentColor" className="num">
            {h.toLocaleString("en-GB")}
          </text>
        </g>
      ))}
      <line x1={MARGIN.left} x2={WIDTH - MARGIN.right} y1={bottom} y2={bottom} stroke="currentColor" />
      <line x1={MARGIN.left} x2={MARGIN.left} y1={MARGIN.top} y2={bottom} stroke="currentColor" />
      <text x={MARGIN.left + plotWidth / 2} y={HEIGHT - 8} textAnchor="middle" fontSize={13} fill="currentColor">
        Flight hours on wing (log scale); ticks below the axis: suspensions
      </text>
      <text x={14} y={MARGIN.top + plotHeight / 2} transform={`rotate(-90 14 ${MARGIN.top + plotHeight / 2})`} textAnchor="middle" fontSize={13} fill="currentColor">
        Unreliability F (median rank)
      </text>

      <line x1={px(line.start.hours)} y1={py(line.start.y)} x2={px(line.end.hours)} y2={py(line.end.y)} strokeWidth={2.5} className="stroke-amber-700 dark:stroke-amber-300" />
      {points.map((p, i) => (
        <circle key={i} cx={px(p.hours)} cy={py(p.y)} r={4} fill="none" stroke="var(--accent)" strokeWidth={2}>
          <title>{`${p.hours.toFixed(1)} h, median rank ${(p.medianRank * 100).toFixed(1)}%`}</title>
        </circle>
      ))}
      {suspensionHours.map((h, i) => (
        <line key={i} x1={px(h)} x2={px(h)} y1={bottom + 22} y2={bottom + 32} stroke="currentColor" strokeWidth={1} />
      ))}
    </svg>
  );
}
