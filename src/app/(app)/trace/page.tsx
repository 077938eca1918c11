import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { PartStatusBadge } from "@/components/status/part-status";
import { TraceSearchForm } from "@/components/trace/trace-search-form";
import { TraceSearchSchema } from "@/lib/schemas/trace";
import { zodFields } from "@/server/http";
import { requireUserFor } from "@/server/page-guard";
import { findSerials, suggestSerials, type SerialMatch } from "@/server/trace";

export const metadata: Metadata = { title: "Trace" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

const first = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);

function MatchList({ matches, label }: { matches: SerialMatch[]; label: string }) {
  return (
    <ul className="space-y-2" aria-label={label}>
      {matches.map((m) => (
        <li key={m.id}>
          <Link href={`/trace/${m.id}`} className="panel flex min-h-touch flex-wrap items-center gap-x-4 gap-y-1 p-3 hover:border-[var(--accent)]">
            <span className="num font-bold">
              P/N {m.partNumber} · S/N {m.serialNumber}
            </span>
            <span>
              CAGE <span className="num">{m.cage}</span>
            </span>
            <PartStatusBadge status={m.status} />
            <span>{m.description}</span>
            {m.entries ? <span className="num text-sm">{m.entries} ledger entries</span> : null}
          </Link>
        </li>
      ))}
    </ul>
  );
}

export default async function TracePage({ searchParams }: Props) {
  const params = await searchParams;
  await requireUserFor("trace", "/trace");
  const values = { serial: first(params.serial), partNumber: first(params.partNumber), cage: first(params.cage) };
  const searched = values.serial !== undefined;
  const parsed = searched ? TraceSearchSchema.safeParse(values) : null;
  const matches = parsed?.success ? await findSerials(parsed.data) : [];
  // One unit answers the search exactly: show its thread. Several are listed for the auditor to choose.
  if (parsed?.success && matches.length === 1) redirect(`/trace/${matches[0].id}`);
  const suggestions = parsed?.success && matches.length === 0 ? await suggestSerials(parsed.data.serial) : [];

  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Trace a serial</h1>
      <p className="max-w-3xl">
        A unit&apos;s thread: every ledger entry from its first receipt, across every airframe and shop visit, with the continuity findings on it.
      </p>
      <TraceSearchForm values={values} errors={parsed && !parsed.success ? zodFields(parsed.error) : {}} />
      {parsed?.success ? (
        matches.length > 1 ? (
          <section aria-labelledby="matches-heading" className="space-y-2">
            <h2 id="matches-heading" className="text-lg font-semibold">
              <span className="num">{matches.length}</span> units carry serial <span className="num">{parsed.data.serial}</span>: choose one
            </h2>
            <p>Serial numbers are unique only within a part number and CAGE code, so Threadline will not pick one for you.</p>
            <MatchList matches={matches} label="Units with this serial" />
          </section>
        ) : (
          <section aria-live="polite" className="space-y-2">
            <p role="status" className="font-semibold">
              No unit has serial <span className="num">{parsed.data.serial}</span>
              {parsed.data.partNumber ? (
                <>
                  {" "}
                  with P/N <span className="num">{parsed.data.partNumber}</span>
                </>
              ) : null}
              {parsed.data.cage ? (
                <>
                  {" "}
                  and CAGE <span className="num">{parsed.data.cage}</span>
                </>
              ) : null}
              . Check the label, or leave out the part number and CAGE code.
            </p>
            {suggestions.length ? (
              <>
                <h2 className="text-lg font-semibold">Serials that start the same way</h2>
                <MatchList matches={suggestions} label="Serials that start the same way" />
              </>
            ) : null}
          </section>
        )
      ) : null}
    </div>
  );
}
