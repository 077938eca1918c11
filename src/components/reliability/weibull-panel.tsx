"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import type { WeibullAnswer } from "@/lib/schemas/reliability";
import { weibullQuery } from "./queries";
import { WeibullPlot } from "./weibull-plot";

const hoursFormat = new Intl.NumberFormat("en-GB", { maximumFractionDigits: 0 });

/** How a shape parameter is usually read (general Weibull practice, not a programme rule). */
function readingOf(beta: number): string {
  if (beta < 0.95) return "β below 1: failures come more often early in a unit's time on wing (early-life failures).";
  if (beta <= 1.05) return "β close to 1: failures come at a roughly constant rate, whatever the time on wing.";
  return "β above 1: failures become more likely the longer a unit is on wing (wear-out).";
}

/**
 * Weibull analysis of time on wing for the P/N group: the engineer chooses what counts as a failure
 * and what happens to scheduled removals; units still fitted are always suspensions.
 */
export function WeibullPanel({ partNumber, initialData }: { partNumber: string; initialData: WeibullAnswer | null }) {
  const [confirmedOnly, setConfirmedOnly] = useState(false);
  const [scheduledAsSuspensions, setScheduledAsSuspensions] = useState(false);
  const isInitial = !confirmedOnly && !scheduledAsSuspensions;
  const query = useQuery({
    ...weibullQuery({ partNumber, confirmedOnly, scheduledAsSuspensions }),
    initialData: isInitial && initialData ? initialData : undefined,
    placeholderData: (previous) => previous,
  });
  const data = query.data;

  return (
    <section aria-labelledby="weibull-heading" className="panel space-y-3 p-4">
      <h2 id="weibull-heading" className="text-xl font-bold">
        Weibull: time on wing
      </h2>
      <p className="max-w-3xl">
        Each installation of the group over its whole history: unscheduled removals are failures, units still fitted are suspensions at their time on wing so far.
        Fitted by median rank regression with Johnson&apos;s adjusted ranks and Bernard&apos;s approximation.
      </p>
      <fieldset className="flex flex-wrap gap-x-6 gap-y-2">
        <legend className="field-label">What counts</legend>
        <label className="inline-flex min-h-touch items-center gap-2">
          <input type="checkbox" className="h-6 w-6 shrink-0" checked={confirmedOnly} onChange={(event) => setConfirmedOnly(event.target.checked)} />
          Only shop-confirmed failures are failures (other unscheduled removals become suspensions)
        </label>
        <label className="inline-flex min-h-touch items-center gap-2">
          <input type="checkbox" className="h-6 w-6 shrink-0" checked={scheduledAsSuspensions} onChange={(event) => setScheduledAsSuspensions(event.target.checked)} />
          Count scheduled removals as suspensions
        </label>
      </fieldset>

      {query.isError ? (
        <p role="alert" className="field-error">
          {query.error.message}
        </p>
      ) : !data ? (
        <p role="status">Fitting…</p>
      ) : (
        <div className="grid gap-4 lg:grid-cols-[minmax(0,720px)_1fr]">
          <div className="overflow-x-auto">{data.fit ? <WeibullPlot answer={data} /> : <p className="panel p-3">{data.message}</p>}</div>
          <dl className="grid h-fit grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-lg" aria-live="polite">
            <dt className="font-semibold">Failures</dt>
            <dd className="num">{data.failures}</dd>
            <dt className="font-semibold">Suspensions</dt>
            <dd className="num">{data.suspensions}</dd>
            {data.fit ? (
              <>
                <dt className="font-semibold">Shape β</dt>
                <dd className="num" data-testid="weibull-beta">
                  {data.fit.beta.toFixed(3)}
                </dd>
                <dt className="font-semibold">Scale η</dt>
                <dd className="num">{hoursFormat.format(data.fit.eta)} FH</dd>
                <dt className="font-semibold">r²</dt>
                <dd className="num">{data.fit.r2.toFixed(3)}</dd>
                <dd className="col-span-2 text-base">{readingOf(data.fit.beta)}</dd>
              </>
            ) : null}
            {query.isFetching ? <dd className="col-span-2 text-base text-[var(--ink-soft)]">Updating…</dd> : null}
          </dl>
        </div>
      )}
    </section>
  );
}
