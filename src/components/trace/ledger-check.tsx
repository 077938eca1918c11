"use client";

import { useQuery } from "@tanstack/react-query";
import { formatInstant } from "@/lib/format";
import { ledgerVerifyQuery } from "@/lib/queries/ledger";

/** Runs the ledger check on arrival and on request, and shows what it found. */
export function LedgerCheck() {
  const { data, error, isFetching, refetch } = useQuery(ledgerVerifyQuery());
  return (
    <section aria-labelledby="check-result-heading" className="panel space-y-3 p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="check-result-heading" className="text-lg font-semibold">
          Hash chain
        </h2>
        <button type="button" className="btn btn-primary" onClick={() => refetch()} disabled={isFetching}>
          {isFetching ? "Checking…" : "Check again"}
        </button>
      </div>
      <div aria-live="polite" aria-busy={isFetching}>
        {isFetching && !data ? <p role="status">Recomputing every entry&apos;s hash…</p> : null}
        {error ? (
          <p role="alert" className="field-error">
            {error.message}
          </p>
        ) : null}
        {data?.ok ? (
          <div className="space-y-2" data-testid="ledger-result">
            <p className="flex items-center gap-2 text-xl font-bold text-emerald-900 dark:text-emerald-100">
              <span aria-hidden="true">✓</span> Chain intact: nothing was altered, removed or reordered.
            </p>
            <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[max-content_1fr]">
              <dt className="font-semibold">Entries verified</dt>
              <dd className="num">{data.entries.toLocaleString("en-GB")}</dd>
              <dt className="font-semibold">Head</dt>
              <dd>
                seq <span className="num">{data.headSeq}</span>, hash <span className="num break-all">{data.head}</span>
              </dd>
              <dt className="font-semibold">Time taken</dt>
              <dd className="num">{(data.durationMs / 1000).toFixed(2)} s</dd>
              <dt className="font-semibold">Checked</dt>
              <dd>{formatInstant(data.checkedAt)}</dd>
            </dl>
          </div>
        ) : null}
        {data && !data.ok ? (
          <div className="space-y-2 rounded border-l-8 border-red-800 bg-red-50 p-3 text-red-950 dark:bg-red-950 dark:text-red-50" data-testid="ledger-result">
            <p className="flex items-center gap-2 text-xl font-bold">
              <span aria-hidden="true">✕</span> Chain broken at seq <span className="num">{data.brokenAt}</span>
            </p>
            <p>{data.message}</p>
            <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[max-content_1fr]">
              <dt className="font-semibold">Intact before the break</dt>
              <dd className="num">{data.entries.toLocaleString("en-GB")} entries</dd>
              <dt className="font-semibold">Time taken</dt>
              <dd className="num">{(data.durationMs / 1000).toFixed(2)} s</dd>
              <dt className="font-semibold">Checked</dt>
              <dd>{formatInstant(data.checkedAt)}</dd>
            </dl>
            <p className="font-semibold">Keep the record as it is and report this to quality: the stored entry must be compared with its paper or backup copy.</p>
          </div>
        ) : null}
      </div>
    </section>
  );
}
