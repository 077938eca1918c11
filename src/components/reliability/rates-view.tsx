"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { ApiError, searchString } from "@/lib/fetch-json";
import { useSearchInAddress } from "@/lib/use-search-in-address";
import type { ReliabilityAnswer, WeibullAnswer } from "@/lib/schemas/reliability";
import { RatesForm } from "./rates-form";
import { MonthTable } from "./month-table";
import { RatesSummary } from "./rates-summary";
import { RateChart } from "./rate-chart";
import { reliabilityQuery, removalsCsvHref, type RatesParams } from "./queries";
import { WeibullPanel } from "./weibull-panel";

/**
 * The Rates page's interactive part. The first answer is rendered on the server; a new subject,
 * period or k is fetched from GET /api/reliability, and the address keeps the choice.
 */
export function RatesView({
  initialParams,
  initialData,
  initialWeibull,
  partNumbers,
  chapters,
}: {
  initialParams: RatesParams;
  initialData: ReliabilityAnswer | null;
  initialWeibull: WeibullAnswer | null;
  partNumbers: string[];
  chapters: string[];
}) {
  const [params, setParams] = useState<RatesParams>(initialParams);
  const hasSubject = Boolean(params.partNumber || params.ataChapter);
  const sameAsInitial = JSON.stringify(params) === JSON.stringify(initialParams);
  const query = useQuery({
    ...reliabilityQuery(params),
    enabled: hasSubject,
    initialData: sameAsInitial && initialData ? initialData : undefined,
    placeholderData: (previous) => previous,
  });

  useSearchInAddress(searchString({ ...params }));

  const errors = query.error instanceof ApiError ? query.error.fields : {};
  const data = hasSubject ? query.data : undefined;

  return (
    <div className="space-y-4">
      <RatesForm value={params} errors={errors} partNumbers={partNumbers} chapters={chapters} onApply={setParams} />

      {query.isError ? (
        <p role="alert" className="field-error text-lg">
          {query.error.message}
        </p>
      ) : null}
      {!hasSubject ? <p className="text-lg">Choose a part number or an ATA chapter to see its rates.</p> : null}
      {hasSubject && !data && query.isFetching ? <p role="status">Computing the rates…</p> : null}

      {data ? (
        <>
          <RatesSummary data={data} updating={query.isFetching} />
          <section aria-labelledby="chart-heading" className="panel space-y-3 p-4">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h2 id="chart-heading" className="text-xl font-bold">
                Monthly unscheduled removal rate against the alert level
              </h2>
              <div className="flex flex-wrap gap-2">
              <Link className="btn btn-secondary" href={`/removals${searchString({ partNumber: data.partNumber ?? undefined, ataChapter: data.ataChapter ?? undefined, from: data.from.slice(0, 10), to: lastDay(data.to) })}`}>
                See the removals
              </Link>
              <a
                className="btn btn-secondary"
                download
                href={removalsCsvHref({ partNumber: data.partNumber ?? undefined, ataChapter: data.ataChapter ?? undefined, from: data.from.slice(0, 10), to: lastDay(data.to) })}
              >
                <span aria-hidden="true">⇩</span> Removals CSV for {data.partNumber ?? `ATA ${data.ataChapter}`}
              </a>
              </div>
            </div>
            <RateChart
              title={`Unscheduled removals per 1,000 unit hours by month, ${data.subject.label}, with the alert level (k = ${data.k})`}
              yLabel="per 1,000 unit hours"
              points={data.months.map((m) => ({ month: m.month, rate: m.rate, alertLevel: m.alertLevel, aboveAlert: m.aboveAlert, closed: m.closed }))}
            />
            <MonthTable months={data.months} />
            {data.partNumber && data.group.length > 1 ? (
              <p className="text-sm">
                The CSV lists removals of <span className="num">{data.partNumber}</span> itself; the rates count its alternates too. Filter the Removals page by each alternate for theirs.
              </p>
            ) : null}
          </section>
          {data.partNumber ? <WeibullPanel key={data.partNumber} partNumber={data.partNumber} initialData={data.partNumber === initialParams.partNumber ? initialWeibull : null} /> : null}
          <p className="max-w-4xl text-sm">{data.method}</p>
        </>
      ) : null}
    </div>
  );
}

/** The API's `to` is the exclusive end; filters take the last day covered. */
function lastDay(exclusiveEnd: string): string {
  return new Date(Date.parse(exclusiveEnd) - 1).toISOString().slice(0, 10);
}
