import type { PositionState } from "@/lib/position-types";

export const POSITION_STATE_STYLE: Record<PositionState, { word: string; glyph: string; fill: string; stroke: string; className: string }> = {
  fitted: { word: "Fitted", glyph: "●", fill: "#1f6f8b", stroke: "#08222d", className: "border-thread-700 text-thread-800 dark:text-thread-100 dark:border-thread-300" },
  empty: { word: "Empty", glyph: "○", fill: "#ffffff", stroke: "#33393f", className: "border-stone-600 text-stone-800 dark:text-stone-100 dark:border-stone-300" },
  near_limit: { word: "Near a life limit", glyph: "◐", fill: "#d97706", stroke: "#451a03", className: "border-amber-700 text-amber-950 dark:text-amber-100 dark:border-amber-300" },
  past_limit: { word: "Past a life limit", glyph: "■", fill: "#b91c1c", stroke: "#450a0a", className: "border-red-800 text-red-900 dark:text-red-100 dark:border-red-300" },
  finding: { word: "Has a finding", glyph: "◆", fill: "#7e22ce", stroke: "#2e1065", className: "border-purple-800 text-purple-900 dark:text-purple-100 dark:border-purple-300" },
};

export function PositionStateBadge({ state }: { state: PositionState }) {
  const style = POSITION_STATE_STYLE[state];
  return (
    <span className={`inline-flex items-center gap-1 rounded border-2 px-2 py-0.5 text-sm font-semibold ${style.className}`}>
      <span aria-hidden="true">{style.glyph}</span>
      {style.word}
    </span>
  );
}
