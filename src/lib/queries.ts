import { queryOptions } from "@tanstack/react-query";
import { apiFetch } from "./api-client";
import type { AircraftDetailResponse, PartDetailResponse, PartSearchResponse } from "./api-types";

// Query keys and fetchers in one place, so a swap can invalidate exactly what it changed.
export const queryKeys = {
  aircraft: (registration: string) => ["aircraft", registration] as const,
  part: (partId: number) => ["part", partId] as const,
  partSearch: (q: string) => ["parts", "search", q] as const,
};

export const aircraftQuery = (registration: string) =>
  queryOptions({
    queryKey: queryKeys.aircraft(registration),
    queryFn: () => apiFetch<AircraftDetailResponse>(`/api/aircraft/${encodeURIComponent(registration)}`),
  });

export const partQuery = (partId: number) =>
  queryOptions({
    queryKey: queryKeys.part(partId),
    queryFn: () => apiFetch<PartDetailResponse>(`/api/parts/${partId}`),
  });

export const partSearchQuery = (q: string) =>
  queryOptions({
    queryKey: queryKeys.partSearch(q),
    queryFn: () => apiFetch<PartSearchResponse>(`/api/parts?q=${encodeURIComponent(q)}`),
    enabled: q.trim().length > 0,
  });
