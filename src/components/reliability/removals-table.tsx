import Link from "next/link";
import { formatCycles, formatInstant } from "@/lib/format";
import { SHOP_FINDING_LABELS, type RemovalRow, type RemovalSort, type ShopFinding } from "@/lib/schemas/reliability";

const COLUMNS: Array<{ key: RemovalSort | null; label: string; className?: string }> = [
  { key: "removedAt", label: "Removed (UTC)" },
  { key: "registration", label: "Aircraft" },
  { key: null, label: "Position" },
  { key: "ataChapter", label: "ATA" },
  { key: "partNumber", label: "P/N" },
  { key: "serialNumber", label: "S/N" },
  { key: "removalType", label: "Type" },
  { key: null, label: "Reason" },
  { key: "hoursOnWing", label: "Hours on wing", className: "text-right" },
  { key: "cyclesOnWing", label: "Cycles on wing", className: "text-right" },
  { key: null, label: "TSN / CSN", className: "text-right" },
  { key: null, label: "Fitted in its place" },
  { key: null, label: "Shop finding" },
  { key: null, label: "Removed by" },
];

const FINDING_GLYPH: Record<ShopFinding, string> = { confirmed_failure: "✕", no_fault_found: "○", damage: "◭", modification: "△" };

export function RemovalTypeBadge({ type }: { type: RemovalRow["removalType"] }) {
  if (type === "unscheduled") {
    return (
      <span className="inline-flex items-center gap-1 whitespace-nowrap rounded border-2 border-red-800 bg-red-50 px-1.5 text-sm font-semibold text-red-900 dark:border-red-300 dark:bg-red-950 dark:text-red-100">
        <span aria-hidden="true">!</span>Unscheduled
      </span>
    );
  }
  if (type === "scheduled") {
    return (
      <span className="inline-flex items-center gap-1 whitespace-nowrap rounded border-2 border-thread-700 px-1.5 text-sm font-semibold text-thread-800 dark:border-thread-300 dark:text-thread-100">
        <span aria-hidden="true">◷</span>Scheduled
      </span>
    );
  }
  return <span>—</span>;
}

/** The removal history as a dense table with sticky headers; sorting happens on the server. */
export function RemovalsTable({
  rows,
  sort,
  dir,
  onSort,
}: {
  rows: RemovalRow[];
  sort: RemovalSort;
  dir: "asc" | "desc";
  onSort: (sort: RemovalSort, dir: "asc" | "desc") => void;
}) {
  return (
    <div className="panel max-h-[70vh] overflow-auto">
      <table className="w-full border-collapse text-left text-[15px]">
        <caption className="sr-only">Removals, sorted by {COLUMNS.find((c) => c.key === sort)?.label} {dir === "asc" ? "ascending" : "descending"}</caption>
        <thead className="sticky top-0 z-10 bg-[var(--panel)] shadow-[0_2px_0_var(--ink-soft)]">
          <tr>
            {COLUMNS.map((column) => {
              if (!column.key) {
                return (
                  <th key={column.label} scope="col" className={`whitespace-nowrap px-2 py-2 ${column.className ?? ""}`}>
                    {column.label}
                  </th>
                );
              }
              const active = sort === column.key;
              const next = active && dir === "desc" ? "asc" : active ? "desc" : column.key === "removedAt" ? "desc" : "asc";
              return (
                <th key={column.label} scope="col" className={`px-1 py-1 ${column.className ?? ""}`} aria-sort={active ? (dir === "asc" ? "ascending" : "descending") : undefined}>
                  <button type="button" onClick={() => onSort(column.key!, next)} className="inline-flex min-h-touch items-center gap-1 whitespace-nowrap rounded px-1 font-bold underline-offset-4 hover:underline">
                    {column.label}
                    <span aria-hidden="true">{active ? (dir === "asc" ? "▲" : "▼") : "↕"}</span>
                  </button>
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.seq} className="border-b border-[var(--rule)] align-top hover:bg-thread-50 dark:hover:bg-thread-900">
              <td className="num whitespace-nowrap px-2 py-1.5">{formatInstant(r.removedAt, "UTC")}</td>
              <td className="num whitespace-nowrap px-2 py-1.5">
                {r.registration}
                <span className="block text-sm text-[var(--ink-soft)]">
                  {r.aircraftType} · {r.station}
                </span>
              </td>
              <td className="min-w-40 px-2 py-1.5">
                <span className="num whitespace-nowrap font-semibold">{r.positionCode}</span>
                <span className="block text-sm text-[var(--ink-soft)]">{r.positionLabel}</span>
              </td>
              <td className="num whitespace-nowrap px-2 py-1.5">{r.ataChapter}</td>
              <td className="num whitespace-nowrap px-2 py-1.5">{r.partNumber}</td>
              <td className="num whitespace-nowrap px-2 py-1.5">
                <Link href={`/parts/${r.partId}`} className="font-semibold text-[var(--accent)] underline">
                  {r.serialNumber}
                </Link>
              </td>
              <td className="px-2 py-1.5">
                <RemovalTypeBadge type={r.removalType} />
              </td>
              <td className="min-w-48 px-2 py-1.5">
                {r.reason ?? "—"}
                {r.workOrder ? <span className="num block text-sm text-[var(--ink-soft)]">{r.workOrder}</span> : null}
              </td>
              <td className="num whitespace-nowrap px-2 py-1.5 text-right">{r.hoursOnWing ?? "—"}</td>
              <td className="num whitespace-nowrap px-2 py-1.5 text-right">{formatCycles(r.cyclesOnWing)}</td>
              <td className="num whitespace-nowrap px-2 py-1.5 text-right">
                {r.partTsn ?? "—"}
                <span className="block">{formatCycles(r.partCsn)}</span>
              </td>
              <td className="num whitespace-nowrap px-2 py-1.5">{r.installedSerialNumber ? `${r.installedPartNumber} ${r.installedSerialNumber}` : <span>— none</span>}</td>
              <td className="whitespace-nowrap px-2 py-1.5">
                {r.shopFinding ? (
                  <span>
                    <span aria-hidden="true">{FINDING_GLYPH[r.shopFinding]} </span>
                    {SHOP_FINDING_LABELS[r.shopFinding]}
                  </span>
                ) : (
                  <span className="text-[var(--ink-soft)]">None on file</span>
                )}
              </td>
              <td className="px-2 py-1.5">{r.recordedBy}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
