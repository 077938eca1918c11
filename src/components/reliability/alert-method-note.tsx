/**
 * The Rates page's plain account of how the alert level is computed and when an alert mail goes
 * out, with the rules that are Threadline's own said to be so. The numbers come from the code that
 * applies them (the page passes them in), so the text cannot drift from what is computed.
 */
export function AlertMethodNote({
  baselineMonths,
  minPriorMonths,
  mailK,
  minUnscheduled,
}: {
  baselineMonths: number;
  minPriorMonths: number;
  mailK: number;
  minUnscheduled: number;
}) {
  return (
    <section aria-labelledby="alert-method-heading" className="panel max-w-4xl space-y-2 p-4">
      <h2 id="alert-method-heading" className="text-xl font-bold">
        How the alert level is computed
      </h2>
      <ul className="list-disc space-y-1.5 pl-5">
        <li>
          <strong>Monthly rate:</strong> unscheduled removals × 1,000 ÷ unit hours, for each calendar month (UTC). Unit hours are the flight hours of the aircraft while a
          unit of the part number group was fitted.
        </li>
        <li>
          <strong>Alert level of a month:</strong> the mean plus k standard deviations (sample SD) of the monthly rates of the {baselineMonths} calendar months before it;
          the month itself is not in its own baseline. k is 2 unless you choose another value above. A month with fewer than {minPriorMonths} earlier months that have a rate
          gets no alert level (Threadline&apos;s own rule: a handful of months gives too unsteady a level).
        </li>
        <li>
          <strong>Above the alert level:</strong> the month&apos;s rate is higher than its level. The current month is shown as open: its figures still change.
        </li>
        <li>
          <strong>Alert mail:</strong> when a month closes above its level at k = {mailK} with at least {minUnscheduled} unscheduled removals, the reliability engineers
          get one e-mail for that part number group and month. The minimum of {minUnscheduled} removals is Threadline&apos;s own rule, not a published one: it keeps a part
          that rarely comes off from alerting on its first removal of the year. Such a month is still marked above its level on this page.
        </li>
      </ul>
      <p>
        Mean + k·SD over the previous 12 months is common practice, given here from memory rather than from a published source; other methods (for example a multiple
        of the mean of running averages, or a Poisson test on the month&apos;s count) give somewhat different levels.{" "}
        <strong>Alerting rules are set by the operator&apos;s reliability programme</strong>: its programme document defines the method, k, the baseline, any minimum
        counts and what is done after an alert (programme basis: FAA AC 120-17B). Where it differs from these defaults, the programme applies.
      </p>
    </section>
  );
}
