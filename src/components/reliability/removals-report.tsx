"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { ApiError, searchString } from "@/lib/fetch-json";
import { useSearchInAddress } from "@/lib/use-search-in-address";
import type { RemovalFilterValues, RemovalListAnswer, RemovalSort } from "@/lib/schemas/reliability";
import { RemovalFilters, type FilterOptions } from "./removal-filters";
import { RemovalsTable } from "./removals-table";
import { removalsCsvHref, removalsQuery, type RemovalPageParams } from "./queries";

const numberFormat = new Intl.NumberFormat("en-GB");

/**
 * The Removals page's interactive part: filters, the server-paged table and the CSV download. The
 * first page comes rendered from the server; later pages and filters are fetched from
 * GET /api/removals with TanStack Query, and the address keeps the filters so a link shows the same list.
 */
export function RemovalsReport({
  initialFilters,
  initialPage,
  initialData,
  options,
}: {
  initialFilters: RemovalFilterValues;
  initialPage: RemovalPageParams;
  initialData: RemovalListAnswer | null;
  options: FilterOptions;
}) {
  const [filters, setFilters] = useState<RemovalFilterValues>(initialFilters);
  const [page, setPage] = useState<RemovalPageParams>(initialPage);
  const sameAsInitial = JSON.stringify([filters, page]) === JSON.stringify([initialFilters, initialPage]);
  const query = useQuery({
    ...removalsQuery(filters, page),
    initialData: sameAsInitial && initialData ? initialData : undefined,
    placeholderData: (previous) => previous,
  });

  const { pageSize: _pageSize, ...pageRest } = page;
  const withoutDefaults = { ...pageRest, page: pageRest.page === 1 ? undefined : pageRest.page, sort: pageRest.sort === "removedAt" ? undefined : pageRest.sort, dir: pageRest.dir === "desc" ? undefined : pageRest.dir };
  useSearchInAddress(searchString({ ...filters, ...withoutDefaults }));

  const fieldErrors = query.error instanceof ApiError ? query.error.fields : {};
  const data = query.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const first = data && data.total > 0 ? (data.page - 1) * data.pageSize + 1 : 0;
  const last = data ? Math.min(data.total, data.page * data.pageSize) : 0;

  return (
    <div className="space-y-3">
      <RemovalFilters
        value={filters}
        options={options}
        errors={fieldErrors}
        onApply={(next) => {
          setFilters(next);
          setPage((current) => ({ ...current, page: 1 }));
        }}
      />

      <div className="flex flex-wrap items-center justify-between gap-3">
        <p aria-live="polite" className="text-lg">
          {query.isError ? (
            <span role="alert" className="field-error">
              {query.error.message}
            </span>
          ) : !data ? (
            "Loading removals…"
          ) : data.total === 0 ? (
            "No removals match these filters. Widen the dates or clear a filter."
          ) : (
            <>
              Showing <span className="num">{numberFormat.format(first)}</span>–<span className="num">{numberFormat.format(last)}</span> of{" "}
              <span className="num font-semibold">{numberFormat.format(data.total)}</span> removals, <span className="num">{numberFormat.format(data.unscheduled)}</span> unscheduled
              {query.isFetching ? <span className="ml-2 text-[var(--ink-soft)]">(updating…)</span> : null}
            </>
          )}
        </p>
        <a href={removalsCsvHref(filters)} download className="btn btn-primary" aria-describedby="csv-hint">
          <span aria-hidden="true">⇩</span> Download CSV
        </a>
      </div>
      <p id="csv-hint" className="-mt-2 text-sm text-[var(--ink-soft)]">
        The CSV holds every removal that matches the filters (not just this page), in ledger order, with UTC instants and H:MM flight time.
      </p>

      {data && data.total > 0 ? (
        <RemovalsTable rows={data.removals} sort={data.sort} dir={data.dir} onSort={(sort: RemovalSort, dir) => setPage((current) => ({ ...current, sort, dir, page: 1 }))} />
      ) : null}

      {data && data.total > data.pageSize ? (
        <nav aria-label="Pages of removals" className="flex flex-wrap items-center gap-2">
          <button type="button" className="btn btn-secondary" disabled={data.page <= 1} onClick={() => setPage((current) => ({ ...current, page: 1 }))}>
            « First
          </button>
          <button type="button" className="btn btn-secondary" disabled={data.page <= 1} onClick={() => setPage((current) => ({ ...current, page: current.page - 1 }))}>
            ← Previous
          </button>
          <span className="px-2">
            Page <span className="num">{data.page}</span> of <span className="num">{numberFormat.format(pages)}</span>
          </span>
          <button type="button" className="btn btn-secondary" disabled={data.page >= pages} onClick={() => setPage((current) => ({ ...current, page: current.page + 1 }))}>
            Next →
          </button>
          <button type="button" className="btn btn-secondary" disabled={data.page >= pages} onClick={() => setPage((current) => ({ ...current, page: pages }))}>
            Last »
          </button>
        </nav>
      ) : null}
    </div>
  );
}
