import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FindingsList } from "@/components/trace/findings-list";
import { TraceHeader } from "@/components/trace/trace-header";
import { TraceThread } from "@/components/trace/trace-thread";
import { AppError } from "@/server/errors";
import { requireUserFor } from "@/server/page-guard";
import { getPartTrace } from "@/server/trace";

type Params = { params: Promise<{ partId: string }> };

export const metadata: Metadata = { title: "Trace" };

export default async function PartTracePage({ params }: Params) {
  const { partId } = await params;
  await requireUserFor("trace", `/trace/${partId}`);
  const id = Number(partId);
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  let trace;
  try {
    trace = await getPartTrace(id);
  } catch (error) {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  }
  return (
    <div className="space-y-5">
      <nav aria-label="Trace" className="flex flex-wrap gap-2">
        <Link href="/trace" className="btn btn-secondary">
          ← Another serial
        </Link>
        <Link href={`/parts/${id}`} className="btn btn-secondary">
          Part page
        </Link>
        <Link href={`/trace/${id}/report`} className="btn btn-primary">
          Trace report (printable)
        </Link>
      </nav>
      <TraceHeader trace={trace} />
      <FindingsList findings={trace.findings} hrefFor={(seq) => `#seq-${seq}`} />
      <section aria-labelledby="thread-heading" className="space-y-2">
        <h2 id="thread-heading" className="text-lg font-semibold">
          Thread <span className="num text-sm font-normal">({trace.entries.length} entries, oldest first)</span>
        </h2>
        <TraceThread entries={trace.entries} findings={trace.findings} />
      </section>
    </div>
  );
}
