import { queryOptions } from "@tanstack/react-query";
import { apiFetch } from "@/lib/api-client";

// Shapes of the ledger check's answers as the browser sees them.
export type LedgerVerifyResponse =
  | { ok: true; entries: number; head: string; headSeq: number; checkedAt: string; durationMs: number; segments: number }
  | { ok: false; brokenAt: number; reason: string; entries: number; foundSeq: number; message: string; detail?: string; checkedAt: string; durationMs: number; segments: number };

export interface LedgerEntryHashResponse {
  entry: { seq: number; kind: string; partId: number; prevHash: string; hash: string };
}

export const ledgerVerifyQuery = () =>
  queryOptions({
    queryKey: ["ledger", "verify"],
    queryFn: () => apiFetch<LedgerVerifyResponse>("/api/ledger/verify"),
    // Each run is a fresh check of the whole chain; an old answer is no answer.
    staleTime: 0,
    gcTime: 0,
    retry: false,
  });

export const ledgerEntryQuery = (seq: number) =>
  queryOptions({
    queryKey: ["ledger", "entry", seq],
    queryFn: () => apiFetch<LedgerEntryHashResponse>(`/api/ledger/entries/${seq}`),
    staleTime: 0,
    retry: false,
  });
