import { queryOptions } from "@tanstack/react-query";
import { fetchJson, searchString } from "@/lib/fetch-json";
import type { ReliabilityAnswer, RemovalFilterValues, RemovalListAnswer, WeibullAnswer } from "@/lib/schemas/reliability";

// Query keys and fetchers of the reliability area: the removals report, the rates and the Weibull panel.

export interface RemovalPageParams {
  page: number;
  pageSize: number;
  sort: string;
  dir: "asc" | "desc";
}

export const removalsQuery = (filters: RemovalFilterValues, page: RemovalPageParams) =>
  queryOptions({
    queryKey: ["removals", filters, page],
    queryFn: () => fetchJson<RemovalListAnswer>(`/api/removals${searchString({ ...filters, ...page })}`),
    staleTime: 60_000,
  });

/** The export link for the filters on screen (the same names the JSON route takes). */
export const removalsCsvHref = (filters: RemovalFilterValues) => `/api/exports/removals.csv${searchString({ ...filters })}`;

export interface RatesParams {
  partNumber?: string;
  ataChapter?: string;
  from?: string;
  to?: string;
  k?: string;
}

export const reliabilityQuery = (params: RatesParams) =>
  queryOptions({
    queryKey: ["reliability", params],
    queryFn: () => fetchJson<ReliabilityAnswer>(`/api/reliability${searchString({ ...params })}`),
    staleTime: 60_000,
  });

export interface WeibullParams {
  partNumber: string;
  confirmedOnly: boolean;
  scheduledAsSuspensions: boolean;
}

export const weibullQuery = (params: WeibullParams) =>
  queryOptions({
    queryKey: ["reliability", "weibull", params],
    queryFn: () =>
      fetchJson<WeibullAnswer>(
        `/api/reliability/weibull${searchString({ partNumber: params.partNumber, confirmedOnly: String(params.confirmedOnly), scheduledAsSuspensions: String(params.scheduledAsSuspensions) })}`,
      ),
    staleTime: 60_000,
  });
