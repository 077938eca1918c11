"use client";

import Papa from "papaparse";
import type { CsvRowError } from "@/lib/schemas/catalog-csv";

/** The per-row error report: found in the browser before sending, or refused by the server. */
export function ImportReport({ errors, final }: { errors: CsvRowError[]; final: boolean }) {
  if (errors.length === 0) return null;
  const sorted = [...errors].sort((a, b) => a.row - b.row);
  const reportCsv = Papa.unparse(sorted.map(({ row, field, message }) => ({ row, field, message })));
  return (
    <div className="space-y-2">
      <h3 id="report-heading" className="text-lg font-semibold">
        <span aria-hidden="true">✖ </span>
        {final ? "Rows not imported" : "Rows with problems (they will not be sent)"} <span className="num">({new Set(sorted.map((e) => e.row)).size})</span>
      </h3>
      <p className="text-sm">Row numbers count the header as row 1, as a spreadsheet does.</p>
      <div className="max-h-[50vh] overflow-auto rounded-md border border-[var(--rule)]">
        <table className="w-full border-collapse text-left" aria-labelledby="report-heading">
          <thead className="sticky top-0 bg-[var(--panel)] shadow-[0_2px_0_var(--ink-soft)]">
            <tr>
              <th scope="col" className="px-3 py-2">Row</th>
              <th scope="col" className="px-3 py-2">Column</th>
              <th scope="col" className="px-3 py-2">Problem</th>
            </tr>
          </thead>
          <tbody>
            {sorted.map((error, index) => (
              <tr key={`${error.row}-${error.field}-${index}`} className="border-b border-[var(--rule)]">
                <td className="num px-3 py-1.5">{error.row}</td>
                <td className="num px-3 py-1.5">{error.field}</td>
                <td className="px-3 py-1.5">{error.message}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {final ? (
        <a href={`data:text/csv;charset=utf-8,${encodeURIComponent(reportCsv)}`} download="catalog-import-report.csv" className="btn btn-secondary">
          Download this report (CSV)
        </a>
      ) : null}
    </div>
  );
}
