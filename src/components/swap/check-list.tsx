import type { SwapCheck } from "@/lib/swap-types";

const LEVEL = {
  ok: { glyph: "✓", word: "OK", className: "border-emerald-800 bg-emerald-50 text-emerald-950 dark:bg-emerald-950 dark:text-emerald-50" },
  warn: { glyph: "◐", word: "Warning", className: "border-amber-700 bg-amber-50 text-amber-950 dark:bg-amber-950 dark:text-amber-50" },
  fail: { glyph: "✕", word: "Refused", className: "border-red-800 bg-red-50 text-red-950 dark:bg-red-950 dark:text-red-50" },
} as const;

export function CheckList({ checks }: { checks: SwapCheck[] }) {
  return (
    <ul className="space-y-2" aria-label="Pre-install checks">
      {checks.map((check) => {
        const level = LEVEL[check.level];
        return (
          <li key={check.name} className={`rounded-md border-2 p-3 ${level.className}`}>
            <p className="font-bold">
              <span aria-hidden="true">{level.glyph}</span> {level.word}: {check.name}
            </p>
            <p>{check.message}</p>
          </li>
        );
      })}
    </ul>
  );
}
