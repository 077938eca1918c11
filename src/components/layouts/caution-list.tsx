/** Cautions as a technician sees them before work: a distinct safety block with the usual reminder. */
export function CautionList({ cautions, independentInspection }: { cautions: string[]; independentInspection: boolean }) {
  if (cautions.length === 0 && !independentInspection) return null;
  return (
    <aside aria-label="Safety cautions" className="rounded-md border-4 border-l-[12px] border-amber-700 bg-amber-50 p-4 text-amber-950 dark:border-amber-400 dark:bg-amber-950 dark:text-amber-50">
      <p className="text-lg font-bold">
        <span aria-hidden="true">⚠ </span>Before work at this position
      </p>
      {cautions.length ? (
        <ul className="mt-2 list-disc space-y-1 pl-6">
          {cautions.map((caution) => (
            <li key={caution}>{caution}</li>
          ))}
        </ul>
      ) : null}
      {independentInspection ? (
        <p className="mt-2 font-semibold">
          <span aria-hidden="true">◆ </span>An independent inspection is required before return to service.
        </p>
      ) : null}
      <p className="mt-2 text-sm">These are reminders only: the maintenance manual, local regulations and licensed practice govern the work.</p>
    </aside>
  );
}
