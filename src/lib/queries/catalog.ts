import { queryOptions } from "@tanstack/react-query";
import type { PartNumberView } from "@/lib/schemas/catalog";

export interface PartNumberSearchResult {
  partNumbers: PartNumberView[];
  total: number;
}

async function fetchJson<T>(url: string): Promise<T> {
  const response = await fetch(url, { headers: { accept: "application/json" } });
  const body = await response.json().catch(() => null);
  if (!response.ok) throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
  return body as T;
}

/** Catalog search for pickers: part number or description, a short page of results. */
export const partNumberSearchOptions = (q: string) =>
  queryOptions({
    queryKey: ["part-numbers", "search", q],
    queryFn: () => fetchJson<PartNumberSearchResult>(`/api/part-numbers?${new URLSearchParams({ q, limit: "12", sort: "partNumber" })}`),
    staleTime: 60_000,
  });
