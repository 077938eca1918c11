"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useDeferredValue, useState } from "react";
import { PartStatusBadge } from "@/components/status/part-status";
import { formatCycles } from "@/lib/format";
import { partSearchQuery } from "@/lib/queries";

export function PartSearch() {
  const [q, setQ] = useState("");
  const deferred = useDeferredValue(q.trim());
  const { data, isFetching, error } = useQuery(partSearchQuery(deferred));
  return (
    <div className="space-y-3">
      <label className="block max-w-xl">
        <span className="field-label">Serial or part number (start of it)</span>
        <input className="field-input num text-lg" value={q} onChange={(e) => setQ(e.target.value)} autoFocus autoComplete="off" placeholder="EA01004 or QF-3242" />
      </label>
      {error ? <p role="alert" className="field-error">{error.message}</p> : null}
      {isFetching ? <p role="status">Searching…</p> : null}
      {data ? (
        <ul className="space-y-2" aria-label="Units found">
          {data.parts.map((p) => (
            <li key={p.id}>
              <Link href={`/parts/${p.id}`} className="panel flex flex-wrap items-center gap-x-4 gap-y-1 p-3 hover:border-[var(--accent)]">
                <span className="num font-bold">
                  {p.partNumber} · {p.serialNumber}
                </span>
                <PartStatusBadge status={p.status} />
                <span>{p.description}</span>
                <span className="num text-sm">
                  TSN {p.tsn} · CSN {formatCycles(p.csn)}
                </span>
                <span className="text-sm">{p.location}</span>
              </Link>
            </li>
          ))}
          {data.parts.length === 0 ? <li>No unit matches “{deferred}”.</li> : null}
        </ul>
      ) : null}
    </div>
  );
}
