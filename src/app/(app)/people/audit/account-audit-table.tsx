"use client";

import { useInfiniteQuery } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { AccountEventTable } from "@/components/people/account-event-list";
import { ACCOUNT_EVENT_KINDS, ACCOUNT_EVENT_LABELS } from "@/lib/account-events";
import { searchString } from "@/lib/fetch-json";
import { useSearchInAddress } from "@/lib/use-search-in-address";
import { accountEventsQuery, type AccountEventFilters, type AccountEventsAnswer } from "@/lib/people-queries";

export function AccountAuditTable({
  initialFilters,
  initialPage,
  timeZone,
}: {
  initialFilters: AccountEventFilters;
  initialPage: AccountEventsAnswer;
  timeZone: string;
}) {
  const [filters, setFilters] = useState<AccountEventFilters>(initialFilters);
  const [search, setSearch] = useState(initialFilters.q ?? "");
  const sameAsInitial = JSON.stringify(filters) === JSON.stringify(initialFilters);
  const query = useInfiniteQuery({
    ...accountEventsQuery(filters),
    initialData: sameAsInitial ? { pages: [initialPage], pageParams: [null] } : undefined,
  });

  useEffect(() => {
    const q = search.trim() || undefined;
    const timer = setTimeout(() => setFilters((current) => (current.q === q ? current : { ...current, q })), 250);
    return () => clearTimeout(timer);
  }, [search]);
  useSearchInAddress(searchString({ ...filters }));

  const set = (key: keyof AccountEventFilters) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setFilters((current) => ({ ...current, [key]: event.target.value || undefined }));
  const events = query.data?.pages.flatMap((page) => page.events) ?? [];

  return (
    <div className="space-y-3">
      <form role="search" aria-label="Filter account events" className="panel grid gap-3 p-3 sm:grid-cols-2 lg:grid-cols-4" onSubmit={(event) => event.preventDefault()}>
        <div>
          <label htmlFor="audit-kind" className="field-label">
            What
          </label>
          <select id="audit-kind" className="field-input" value={filters.kind ?? ""} onChange={set("kind")}>
            <option value="">Every kind</option>
            {ACCOUNT_EVENT_KINDS.map((kind) => (
              <option key={kind} value={kind}>
                {ACCOUNT_EVENT_LABELS[kind]}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="audit-q" className="field-label">
            Person, e-mail or address
          </label>
          <input id="audit-q" type="search" className="field-input" value={search} onChange={(event) => setSearch(event.target.value)} />
        </div>
        <div>
          <label htmlFor="audit-from" className="field-label">
            From (UTC day)
          </label>
          <input id="audit-from" type="date" className="field-input num" value={filters.from ?? ""} onChange={set("from")} />
        </div>
        <div>
          <label htmlFor="audit-to" className="field-label">
            To (UTC day)
          </label>
          <input id="audit-to" type="date" className="field-input num" value={filters.to ?? ""} onChange={set("to")} />
        </div>
        {filters.user ? (
          <p className="sm:col-span-2 lg:col-span-4">
            Showing one person&apos;s events only.{" "}
            <button type="button" className="btn btn-secondary" onClick={() => setFilters((current) => ({ ...current, user: undefined }))}>
              Show everyone
            </button>
          </p>
        ) : null}
      </form>
      <p aria-live="polite" className="text-sm font-semibold">
        {query.isFetching && !query.isFetchingNextPage ? "Updating… " : null}
        {events.length} event{events.length === 1 ? "" : "s"} shown{query.hasNextPage ? "; older ones below" : ""}
        {query.isError ? ` · could not load: ${query.error.message}` : null}
      </p>
      <AccountEventTable events={events} timeZone={timeZone} caption="Account events, newest first" />
      {query.hasNextPage ? (
        <button type="button" className="btn btn-secondary" disabled={query.isFetchingNextPage} onClick={() => void query.fetchNextPage()}>
          {query.isFetchingNextPage ? "Loading…" : "Load older events"}
        </button>
      ) : null}
    </div>
  );
}
