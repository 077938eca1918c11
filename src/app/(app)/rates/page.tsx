import type { Metadata } from "next";
import Link from "next/link";
import { AlertMethodNote } from "@/components/reliability/alert-method-note";
import { RatesView } from "@/components/reliability/rates-view";
import type { RatesParams } from "@/components/reliability/queries";
import { DEFAULT_BASELINE_MONTHS, DEFAULT_MIN_PRIOR_MONTHS } from "@/domain/reliability";
import { ReliabilityQuerySchema, WeibullQuerySchema, type ReliabilityAnswer, type WeibullAnswer } from "@/lib/schemas/reliability";
import { AppError } from "@/server/errors";
import { requireUserFor } from "@/server/page-guard";
import { getReliability, getWeibull, rateSubjectOptions } from "@/server/reliability";
import { ALERT_K, ALERT_MIN_UNSCHEDULED, checkClosedMonthAlertsLater } from "@/server/reliability-alerts";

export const metadata: Metadata = { title: "Rates" };

const PARAM_NAMES = ["partNumber", "ataChapter", "from", "to", "k"] as const;

export default async function RatesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requireUserFor("rates", "/rates");
  const raw = await searchParams;
  const one = (name: string) => {
    const value = raw[name];
    return typeof value === "string" ? value : Array.isArray(value) ? value[0] : undefined;
  };
  const params: RatesParams = Object.fromEntries(PARAM_NAMES.filter((name) => one(name)).map((name) => [name, one(name)]));
  const now = new Date();
  const parsed = params.partNumber || params.ataChapter ? ReliabilityQuerySchema.safeParse(params) : null;

  let initialData: ReliabilityAnswer | null = null;
  let initialWeibull: WeibullAnswer | null = null;
  if (parsed?.success) {
    try {
      initialData = await getReliability(parsed.data, now);
      if (parsed.data.partNumber) initialWeibull = await getWeibull(WeibullQuerySchema.parse({ partNumber: parsed.data.partNumber }), now);
    } catch (error) {
      // An unknown part number is shown by the client from the API's 404, with the field named.
      if (!(error instanceof AppError)) throw error;
    }
    checkClosedMonthAlertsLater(now);
  }
  const options = await rateSubjectOptions(now);

  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold">Rates</h1>
        <p className="max-w-4xl">
          Unscheduled removal rates per 1,000 unit hours, MTBUR, MTBF from shop-confirmed failures, no-fault-found rate and alert levels, for a part number with its
          alternates or for an ATA chapter. Programme basis: FAA AC 120-17B (12/19/18). The alert method shown (mean + k·SD of the previous 12 months) is common
          practice, from memory; alerting rules are set by the operator&apos;s reliability programme, whose document sets the method and k (see &ldquo;How the alert
          level is computed&rdquo; below).
        </p>
      </div>
      {!params.partNumber && !params.ataChapter && options.busiest.length ? (
        <nav aria-label="Most unscheduled removals" className="panel p-3">
          <h2 className="font-semibold">Most unscheduled removals in the last 12 closed months</h2>
          <ul className="mt-2 flex flex-wrap gap-2">
            {options.busiest.map((b) => (
              <li key={b.partNumber}>
                <Link href={`/rates?partNumber=${encodeURIComponent(b.partNumber)}`} className="btn btn-secondary">
                  <span className="num">{b.partNumber}</span>
                  <span className="font-normal">
                    {b.description} · <span className="num">{b.unscheduled}</span>
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        </nav>
      ) : null}
      <RatesView key={JSON.stringify(params)} initialParams={params} initialData={initialData} initialWeibull={initialWeibull} partNumbers={options.partNumbers} chapters={options.chapters} />
      <AlertMethodNote baselineMonths={DEFAULT_BASELINE_MONTHS} minPriorMonths={DEFAULT_MIN_PRIOR_MONTHS} mailK={ALERT_K} minUnscheduled={ALERT_MIN_UNSCHEDULED} />
    </div>
  );
}
