import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PrintButton } from "@/components/swap/print-button";
import { FindingsList } from "@/components/trace/findings-list";
import { TraceHeader } from "@/components/trace/trace-header";
import { TraceThread } from "@/components/trace/trace-thread";
import { ReportVerification } from "@/components/trace/report-verification";
import { formatInstant } from "@/lib/format";
import { AppError } from "@/server/errors";
import { getLedgerHead } from "@/server/ledger-verify";
import { requireUserFor } from "@/server/page-guard";
import { getPartTrace } from "@/server/trace";

type Params = { params: Promise<{ partId: string }> };

export const metadata: Metadata = { title: "Trace report" };

// Black ink on white, rules instead of fills, every state as a word and a glyph: the copy reads
// the same from a grey-scale printer or a photocopy of one.
const PRINT_CSS = `
@media print {
  @page { size: A4 landscape; margin: 10mm; }
  .trace-report { font-size: 9pt; }
  .trace-report table { font-size: 7.5pt; min-width: 0; }
  .trace-report table .text-xs { font-size: 6.5pt; }
  .trace-report, .trace-report * { color: #000 !important; background: #fff !important; border-color: #000 !important; box-shadow: none !important; }
  .trace-report a { text-decoration: none; }
  .trace-report .panel { border-radius: 0; }
  .trace-report thead { display: table-header-group; }
  .trace-report tr, .trace-report .finding, .trace-report .report-check { break-inside: avoid; }
  .trace-report .thread-group h3 { border-bottom: 1.5pt solid #000; }
  .trace-report .overflow-x-auto { overflow: visible !important; }
}
`;

export default async function TraceReportPage({ params }: Params) {
  const { partId } = await params;
  const user = await requireUserFor("trace", `/trace/${partId}/report`);
  const id = Number(partId);
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  let trace;
  try {
    trace = await getPartTrace(id);
  } catch (error) {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  }
  const head = await getLedgerHead();
  const printedAt = new Date().toISOString();
  return (
    <article className="trace-report space-y-4" aria-labelledby="report-title">
      <style>{PRINT_CSS}</style>
      <div className="no-print flex flex-wrap gap-2">
        <Link href={`/trace/${id}`} className="btn btn-secondary">
          ← Back to the trace
        </Link>
        <div className="w-40">
          <PrintButton />
        </div>
      </div>
      <div className="space-y-1 border-b-2 border-[var(--ink)] pb-2">
        <p id="report-title" className="text-sm font-bold tracking-wide uppercase">
          Threadline trace report
        </p>
        <TraceHeader trace={trace} />
        <p className="text-sm">
          Printed {formatInstant(printedAt)} by {user.name}
          {user.licenceNumber ? <span className="num"> ({user.licenceNumber})</span> : null}. Ledger head at printing: seq <span className="num">{head.seq}</span>, hash{" "}
          <span className="num break-all">{head.hash}</span>.
        </p>
      </div>
      <FindingsList findings={trace.findings} hrefFor={(seq) => `#seq-${seq}`} />
      <section aria-labelledby="thread-heading" className="space-y-2">
        <h2 id="thread-heading" className="text-lg font-semibold">
          Thread <span className="num text-sm font-normal">({trace.entries.length} entries, oldest first; each hash in full)</span>
        </h2>
        <TraceThread entries={trace.entries} findings={trace.findings} variant="print" />
      </section>
      <ReportVerification trace={trace} head={head} printedAt={printedAt} />
    </article>
  );
}
