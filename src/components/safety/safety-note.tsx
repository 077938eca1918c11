import type { ReactNode } from "react";

/** Cautions look the same everywhere: a plain-language block that defers to the manual and local rules. */
export function SafetyNote({ cautions, children }: { cautions: string[]; children?: ReactNode }) {
  return (
    <aside
      aria-label="Safety"
      className="rounded-md border-l-8 border-amber-500 bg-amber-50 p-3 text-amber-950 dark:bg-amber-950 dark:text-amber-50"
    >
      <p className="flex items-center gap-2 font-bold">
        <span aria-hidden="true" className="text-xl">
          ⚠
        </span>
        Caution before work
      </p>
      {cautions.length ? (
        <ul className="mt-1 list-disc space-y-1 pl-6">
          {cautions.map((caution) => (
            <li key={caution}>{caution}</li>
          ))}
        </ul>
      ) : null}
      {children}
      <p className="mt-2 text-sm font-semibold">
        These are reminders only. The manufacturer&apos;s maintenance manual, local regulations and your licensed judgement govern the task.
      </p>
    </aside>
  );
}
