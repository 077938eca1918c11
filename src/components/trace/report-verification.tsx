import { formatInstant } from "@/lib/format";
import type { PartTrace } from "@/server/trace";

/** How a reader checks this paper copy against the ledger later, with the values to compare. */
export function ReportVerification({ trace, head, printedAt }: { trace: PartTrace; head: { seq: number; hash: string }; printedAt: string }) {
  const last = trace.entries[trace.entries.length - 1];
  return (
    <section aria-labelledby="check-heading" className="report-check panel space-y-2 p-4">
      <h2 id="check-heading" className="text-lg font-semibold">
        Checking this copy against the ledger
      </h2>
      <p>
        Every ledger entry&apos;s hash covers its own contents and the hash of the entry before it, so one matching hash vouches for every entry up to it. To check this
        copy, someone with the auditor or administrator role:
      </p>
      <ol className="list-decimal space-y-1 pl-6">
        <li>
          opens <span className="font-semibold">Ledger check</span> and runs the check: it must say the chain is intact;
        </li>
        {last ? (
          <li>
            verifies that entry seq <span className="num font-semibold">{last.seq}</span> (this thread&apos;s last) still has hash{" "}
            <span className="num font-semibold break-all">{last.hash}</span> (Ledger check → Check a printed entry). If it does, every entry printed here is as the
            ledger holds it; compare any other seq and hash above the same way;
          </li>
        ) : null}
        <li>
          verifies that entry seq <span className="num font-semibold">{head.seq}</span> still has hash <span className="num font-semibold break-all">{head.hash}</span>: the
          ledger as it stood when this copy was printed ({formatInstant(printedAt)});
        </li>
        <li>opens this serial&apos;s trace again: entries after seq {head.seq}, if any, were recorded after printing.</li>
      </ol>
    </section>
  );
}
