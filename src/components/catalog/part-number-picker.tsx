"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect, useId, useState } from "react";
import { partNumberSearchOptions } from "@/lib/queries/catalog";
import type { PartNumberView } from "@/lib/schemas/catalog";

/** Searches the catalog as the user types and offers the matches as buttons; picking one calls `onPick`. */
export function PartNumberPicker({
  label,
  onPick,
  excludeIds = [],
  describedBy,
  invalid,
}: {
  label: string;
  onPick: (partNumber: PartNumberView) => void;
  excludeIds?: number[];
  describedBy?: string;
  invalid?: boolean;
}) {
  const id = useId();
  const [text, setText] = useState("");
  const [query, setQuery] = useState("");
  useEffect(() => {
    // Wait for a pause in typing rather than asking the server on every key.
    const timer = setTimeout(() => setQuery(text.trim()), 250);
    return () => clearTimeout(timer);
  }, [text]);
  const search = useQuery({ ...partNumberSearchOptions(query), enabled: query.length >= 2 });
  const matches = (search.data?.partNumbers ?? []).filter((p) => !excludeIds.includes(p.id));

  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input
        id={id}
        type="search"
        value={text}
        onChange={(event) => setText(event.target.value)}
        placeholder="Type 2 or more characters of a P/N or description"
        className="field-input"
        autoComplete="off"
        aria-describedby={[describedBy, `${id}-status`].filter(Boolean).join(" ")}
        aria-invalid={invalid ? true : undefined}
      />
      <p id={`${id}-status`} className="mt-1 text-sm text-[var(--ink-soft)]" aria-live="polite">
        {query.length < 2
          ? ""
          : search.isPending
            ? "Searching…"
            : search.isError
              ? `Search failed: ${search.error.message}`
              : `${matches.length} match${matches.length === 1 ? "" : "es"}${search.data && search.data.total > search.data.partNumbers.length ? ` (first ${search.data.partNumbers.length} of ${search.data.total}; type more to narrow)` : ""}`}
      </p>
      {matches.length > 0 && query.length >= 2 ? (
        <ul className="mt-1 max-h-72 overflow-auto rounded-md border border-[var(--rule)]" aria-label={`Matches for ${query}`}>
          {matches.map((p) => (
            <li key={p.id} className="border-b border-[var(--rule)] last:border-b-0">
              <button
                type="button"
                className="flex min-h-touch w-full flex-wrap items-center gap-x-3 px-3 py-2 text-left hover:bg-thread-50 focus:bg-thread-50 dark:hover:bg-thread-900 dark:focus:bg-thread-900"
                onClick={() => {
                  onPick(p);
                  setText("");
                  setQuery("");
                }}
              >
                <span className="num font-semibold">{p.partNumber}</span>
                <span className="num text-sm">CAGE {p.cage}</span>
                <span>{p.description}</span>
                <span className="sr-only">, pick</span>
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
