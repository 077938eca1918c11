import type { ReliabilityMonth } from "@/lib/schemas/reliability";

const rate = (value: number | null) => (value === null ? "—" : value.toFixed(3));

function AlertState({ month }: { month: ReliabilityMonth }) {
  if (month.aboveAlert === null) return <span>No level yet</span>;
  const word = month.aboveAlert ? (month.closed ? "Above alert" : "Above (month open)") : "Within";
  return month.aboveAlert ? (
    <span className="inline-flex items-center gap-1 rounded border-2 border-red-800 bg-red-50 px-1.5 font-semibold text-red-900 dark:border-red-300 dark:bg-red-950 dark:text-red-100">
      <span aria-hidden="true">▲</span>
      {word}
    </span>
  ) : (
    <span className="inline-flex items-center gap-1">
      <span aria-hidden="true">✓</span>
      {word}
    </span>
  );
}

/** The chart's figures as a table: the readable version for screen readers, and for copying. */
export function MonthTable({ months }: { months: ReliabilityMonth[] }) {
  return (
    <details className="panel">
      <summary className="min-h-touch cursor-pointer px-3 py-2 font-semibold">Monthly figures ({months.length} months)</summary>
      <div className="overflow-auto">
        <table className="w-full border-collapse text-left text-[15px]">
          <thead>
            <tr className="border-b-2 border-[var(--ink-soft)]">
              <th scope="col" className="px-3 py-2">Month</th>
              <th scope="col" className="px-3 py-2 text-right">Unit hours</th>
              <th scope="col" className="px-3 py-2 text-right">Removals</th>
              <th scope="col" className="px-3 py-2 text-right">Unscheduled</th>
              <th scope="col" className="px-3 py-2 text-right">Confirmed</th>
              <th scope="col" className="px-3 py-2 text-right">NFF</th>
              <th scope="col" className="px-3 py-2 text-right">Rate</th>
              <th scope="col" className="px-3 py-2 text-right">Alert level</th>
              <th scope="col" className="px-3 py-2">Against the level</th>
            </tr>
          </thead>
          <tbody>
            {months.map((m) => (
              <tr key={m.month} className="border-b border-[var(--rule)]" data-month={m.month} data-above-alert={m.aboveAlert ? "true" : "false"}>
                <th scope="row" className="num px-3 py-1.5 font-semibold">
                  {m.month}
                  {m.closed ? "" : " (open)"}
                </th>
                <td className="num px-3 py-1.5 text-right">{m.unitHours}</td>
                <td className="num px-3 py-1.5 text-right">{m.removals}</td>
                <td className="num px-3 py-1.5 text-right">{m.unscheduledRemovals}</td>
                <td className="num px-3 py-1.5 text-right">{m.confirmedFailures}</td>
                <td className="num px-3 py-1.5 text-right">{m.noFaultFound}</td>
                <td className="num px-3 py-1.5 text-right">{rate(m.rate)}</td>
                <td className="num px-3 py-1.5 text-right">{rate(m.alertLevel)}</td>
                <td className="px-3 py-1.5">
                  <AlertState month={m} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
