import Link from "next/link";
import type { PartNumberView } from "@/lib/schemas/catalog";

export type SortKey = "partNumber" | "cage" | "description" | "ataChapter";

const COLUMNS: Array<{ key: SortKey; label: string }> = [
  { key: "partNumber", label: "Part number" },
  { key: "cage", label: "CAGE" },
  { key: "description", label: "Description" },
  { key: "ataChapter", label: "ATA" },
];

function limits(hours: string | null, cycles: number | null, days?: number | null): string {
  const parts = [
    hours ? `${hours} FH` : null,
    cycles !== null ? `${cycles.toLocaleString("en")} cyc` : null,
    days !== null && days !== undefined ? `${days.toLocaleString("en")} days` : null,
  ].filter(Boolean);
  return parts.length ? parts.join(" · ") : "—";
}

/** The catalog as a dense, sortable table; sorting is a link, so it works without script and pages on the server. */
export function CatalogTable({
  partNumbers,
  sort,
  dir,
  hrefFor,
}: {
  partNumbers: PartNumberView[];
  sort: SortKey;
  dir: "asc" | "desc";
  hrefFor: (sort: SortKey, dir: "asc" | "desc") => string;
}) {
  return (
    <div className="panel max-h-[70vh] overflow-auto">
      <table className="w-full border-collapse text-left text-[15px]">
        <thead className="sticky top-0 z-10 bg-[var(--panel)] shadow-[0_2px_0_var(--ink-soft)]">
          <tr>
            {COLUMNS.map((column) => {
              const active = sort === column.key;
              const next = active && dir === "asc" ? "desc" : "asc";
              return (
                <th key={column.key} scope="col" className="px-3 py-2" aria-sort={active ? (dir === "asc" ? "ascending" : "descending") : undefined}>
                  <Link href={hrefFor(column.key, next)} className="inline-flex min-h-touch items-center gap-1 underline-offset-4 hover:underline">
                    {column.label}
                    <span aria-hidden="true">{active ? (dir === "asc" ? "▲" : "▼") : "↕"}</span>
                  </Link>
                </th>
              );
            })}
            <th scope="col" className="px-3 py-2">Serialised</th>
            <th scope="col" className="px-3 py-2">Life limit</th>
            <th scope="col" className="px-3 py-2">Overhaul</th>
            <th scope="col" className="px-3 py-2">Alternates</th>
          </tr>
        </thead>
        <tbody>
          {partNumbers.map((p) => (
            <tr key={p.id} className="border-b border-[var(--rule)] hover:bg-thread-50 dark:hover:bg-thread-900">
              <td className="px-3 py-1.5">
                <Link href={`/catalog/${p.id}`} className="num whitespace-nowrap font-semibold text-[var(--accent)] underline">
                  {p.partNumber}
                </Link>
              </td>
              <td className="num px-3 py-1.5">{p.cage}</td>
              <td className="px-3 py-1.5">{p.description}</td>
              <td className="num whitespace-nowrap px-3 py-1.5">{p.ataChapter}</td>
              <td className="px-3 py-1.5">{p.serialised ? <span><span aria-hidden="true">● </span>Yes</span> : <span><span aria-hidden="true">○ </span>No</span>}</td>
              <td className="num px-3 py-1.5">{limits(p.lifeLimitHours, p.lifeLimitCycles, p.lifeLimitDays)}</td>
              <td className="num px-3 py-1.5">{limits(p.overhaulHours, p.overhaulCycles)}</td>
              <td className="px-3 py-1.5">
                {p.alternates.length === 0 ? (
                  "—"
                ) : (
                  <ul>
                    {p.alternates.map((a) => (
                      <li key={a.id} className="num whitespace-nowrap">
                        <span aria-hidden="true">{a.direction === "two-way" ? "⇄ " : "→ "}</span>
                        {a.partNumber} <span className="sr-only">({a.direction})</span>
                      </li>
                    ))}
                  </ul>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
