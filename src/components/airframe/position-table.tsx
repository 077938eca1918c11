"use client";

import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { useState } from "react";
import { POSITION_STATE_STYLE } from "@/components/status/position-state";
import { formatCycles, formatDate } from "@/lib/format";
import type { MapPosition } from "@/lib/position-types";

const column = createColumnHelper<MapPosition>();

/** H:MM sorts as minutes, not as text. */
const minutesOf = (hm: string | null | undefined) => {
  if (!hm) return -1;
  const negative = hm.startsWith("-");
  const [h, m] = hm.replace("-", "").split(":").map(Number);
  return (negative ? -1 : 1) * (h * 60 + m);
};

const columns = [
  column.accessor("code", { header: "Position", cell: (c) => <span className="num font-semibold">{c.getValue()}</span> }),
  column.accessor("label", { header: "Label" }),
  column.accessor("ataChapter", { header: "ATA", cell: (c) => <span className="num">{c.getValue()}</span> }),
  column.accessor((p) => p.fitted?.partNumber ?? "", { id: "partNumber", header: "P/N", cell: (c) => <span className="num">{c.getValue() || "—"}</span> }),
  column.accessor((p) => p.fitted?.serialNumber ?? "", { id: "serialNumber", header: "S/N", cell: (c) => <span className="num">{c.getValue() || "—"}</span> }),
  column.accessor((p) => p.fitted?.installedAt ?? "", { id: "installedAt", header: "Installed", cell: (c) => formatDate(c.getValue() || null) }),
  column.accessor((p) => p.fitted?.hoursOnWing ?? null, { id: "hoursOnWing", header: "Hours on wing", sortingFn: (a, b) => minutesOf(a.original.fitted?.hoursOnWing) - minutesOf(b.original.fitted?.hoursOnWing), cell: (c) => <span className="num">{c.getValue() ?? "—"}</span> }),
  column.accessor((p) => p.fitted?.cyclesOnWing ?? -1, { id: "cyclesOnWing", header: "Cycles on wing", cell: (c) => <span className="num">{c.getValue() < 0 ? "—" : formatCycles(c.getValue())}</span> }),
  column.accessor((p) => p.fitted?.tsn ?? null, { id: "tsn", header: "TSN", sortingFn: (a, b) => minutesOf(a.original.fitted?.tsn) - minutesOf(b.original.fitted?.tsn), cell: (c) => <span className="num">{c.getValue() ?? "—"}</span> }),
  column.accessor((p) => p.fitted?.csn ?? -1, { id: "csn", header: "CSN", cell: (c) => <span className="num">{c.getValue() < 0 ? "—" : formatCycles(c.getValue())}</span> }),
  column.accessor((p) => remainingText(p), { id: "remaining", header: "Remaining life", cell: (c) => <span className="num">{c.getValue()}</span> }),
  column.accessor("state", {
    header: "State",
    cell: (c) => {
      const style = POSITION_STATE_STYLE[c.getValue()];
      return (
        <span className="whitespace-nowrap">
          <span aria-hidden="true" style={{ color: style.fill === "#ffffff" ? style.stroke : style.fill }}>
            {style.glyph}
          </span>{" "}
          {style.word}
        </span>
      );
    },
  }),
];

function remainingText(p: MapPosition): string {
  const life = p.fitted?.life;
  if (!life) return "—";
  const parts = [
    life.hoursRemaining !== null ? `${life.hoursRemaining} h` : null,
    life.cyclesRemaining !== null ? `${formatCycles(life.cyclesRemaining)} cyc` : null,
    life.daysRemaining !== null ? `${formatCycles(life.daysRemaining)} d` : null,
  ].filter(Boolean);
  return parts.length ? parts.join(" · ") : "No limit";
}

export function PositionTable({ positions, selectedCode, onSelect }: { positions: MapPosition[]; selectedCode: string | null; onSelect: (code: string) => void }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filter, setFilter] = useState("");
  const table = useReactTable({
    data: positions,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    globalFilterFn: "includesString",
  });
  const rows = table.getRowModel().rows;

  return (
    <section aria-labelledby="positions-heading" className="space-y-2">
      <div className="flex flex-wrap items-end gap-3">
        <h2 id="positions-heading" className="text-lg font-semibold">
          Positions
        </h2>
        <p className="num text-sm" aria-live="polite">
          {rows.length} of {positions.length}
        </p>
        <label className="ml-auto w-full sm:w-80">
          <span className="field-label">Filter positions</span>
          <input className="field-input" value={filter} onChange={(e) => setFilter(e.target.value)} placeholder="Code, P/N, S/N, ATA, label…" />
        </label>
      </div>
      <div className="panel max-h-[70vh] overflow-auto">
        <table className="w-full border-collapse text-sm">
          <thead className="sticky top-0 z-10 bg-[var(--panel)] shadow-[0_1px_0_var(--rule)]">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"} className="px-2 py-1 text-left align-bottom">
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="flex min-h-touch items-center gap-1 font-semibold">
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr
                key={row.id}
                tabIndex={0}
                aria-selected={row.original.code === selectedCode}
                onClick={() => onSelect(row.original.code)}
                onKeyDown={(event) => {
                  if (event.key === "Enter" || event.key === " ") {
                    event.preventDefault();
                    onSelect(row.original.code);
                  }
                }}
                className="cursor-pointer border-t border-[var(--rule)] hover:bg-thread-50 aria-selected:bg-thread-100 dark:hover:bg-thread-900 dark:aria-selected:bg-thread-800"
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-2 align-top">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
