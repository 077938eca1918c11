import type { ReliabilityAnswer } from "@/lib/schemas/reliability";

const integer = new Intl.NumberFormat("en-GB");
const rate = (value: number | null) => (value === null ? "—" : value.toFixed(3));
const percent = (value: number | null) => (value === null ? "—" : `${(value * 100).toFixed(1)} %`);
const hours = (value: number) => integer.format(Math.round(value));
const dateOf = (iso: string) => iso.slice(0, 10);
const lastDayOf = (exclusiveEnd: string) => new Date(Date.parse(exclusiveEnd) - 1).toISOString().slice(0, 10);

function Figure({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="panel p-3">
      <dt className="font-semibold">{label}</dt>
      <dd className="num text-2xl font-bold">{value}</dd>
      {note ? <dd className="text-sm">{note}</dd> : null}
    </div>
  );
}

/** The period's figures, and the alert banner when a closed month went above its level. */
export function RatesSummary({ data, updating }: { data: ReliabilityAnswer; updating: boolean }) {
  const alternates = data.group.filter((g) => g.partNumber !== data.partNumber);
  return (
    <section aria-labelledby="summary-heading" className="space-y-3">
      <div>
        <h2 id="summary-heading" className="text-xl font-bold">
          <span className="num">{data.subject.label}</span>
          {data.group.length ? <span className="font-normal"> — {data.group.find((g) => g.partNumber === data.partNumber)?.description}</span> : null}
        </h2>
        <p>
          <span className="num">{dateOf(data.from)}</span> to <span className="num">{lastDayOf(data.to)}</span> (UTC)
          {alternates.length ? (
            <>
              , counted with its alternates <span className="num">{alternates.map((a) => a.partNumber).join(", ")}</span>
            </>
          ) : null}
          {updating ? <span className="ml-2 text-[var(--ink-soft)]">(updating…)</span> : null}
        </p>
      </div>

      {data.monthsAboveAlert.length ? (
        <div role="alert" className="rounded-md border-l-8 border-red-800 bg-red-50 p-3 text-red-950 dark:border-red-300 dark:bg-red-950 dark:text-red-50">
          <p className="flex items-center gap-2 text-lg font-bold">
            <span aria-hidden="true">▲</span> Above the alert level in <span className="num">{data.monthsAboveAlert.join(", ")}</span>
          </p>
          <p>
            The unscheduled removal rate closed these months above mean + {data.k} SD of the 12 months before each. Investigate as your reliability programme directs; any
            maintenance that follows is done to the maintenance manual, local regulations and licensed judgement.
          </p>
        </div>
      ) : (
        <p className="flex items-center gap-2">
          <span aria-hidden="true">✓</span> No closed month of this period is above its alert level.
        </p>
      )}

      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Figure label="Unit hours" value={data.unitHours} note="Flight hours of the fitted units (fleet FH × positions fitted)" />
        <Figure label="Removals" value={`${integer.format(data.removals)}`} note={`${integer.format(data.unscheduledRemovals)} unscheduled`} />
        <Figure label="Unscheduled rate" value={rate(data.ratePer1000Hours)} note={`per 1,000 unit hours; alert level now ${rate(data.alertLevel)}`} />
        <Figure label="MTBUR" value={data.mtburHours === null ? "—" : `${hours(data.mtburHours)} FH`} note="Unit hours ÷ unscheduled removals" />
        <Figure
          label="MTBF"
          value={data.mtbfHours === null ? "—" : `${hours(data.mtbfHours)} FH`}
          note={
            data.mtbfInterval
              ? `${Math.round(data.mtbfInterval.confidence * 100)} % bounds ${hours(data.mtbfInterval.lowerHours)} to ${data.mtbfInterval.upperHours === null ? "no upper bound" : `${hours(data.mtbfInterval.upperHours)} FH`} (chi-square, time-truncated)`
              : "No unit hours"
          }
        />
        <Figure label="Confirmed failures" value={integer.format(data.confirmedFailures)} note={`${integer.format(data.awaitingFinding)} unscheduled removals still without a shop finding`} />
        <Figure label="No fault found" value={percent(data.noFaultFoundRate)} note={`${integer.format(data.noFaultFound)} of the unscheduled removals`} />
        <Figure label="All removals rate" value={rate(data.removalRatePer1000Hours)} note="scheduled and unscheduled, per 1,000 unit hours" />
      </dl>
    </section>
  );
}
