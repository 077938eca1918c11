import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DocumentList } from "@/components/documents/document-list";
import { ThreadTable } from "@/components/parts/thread-table";
import { PartStatusBadge } from "@/components/status/part-status";
import { FindingsList } from "@/components/trace/findings-list";
import { formatCycles, formatInstant } from "@/lib/format";
import { mayUse } from "@/lib/roles";
import { AppError } from "@/server/errors";
import { requireUserFor } from "@/server/page-guard";
import { getPartDetail } from "@/server/parts";
import { getPartFindings } from "@/server/trace";

type Params = { params: Promise<{ partId: string }> };

export const metadata: Metadata = { title: "Part" };

const LIFE_WORDS = { ok: "Within limit", near: "Near the limit", exceeded: "Limit reached or passed" } as const;
const LIFE_GLYPHS = { ok: "✓", near: "◐", exceeded: "■" } as const;

export default async function PartPage({ params }: Params) {
  const { partId } = await params;
  const user = await requireUserFor("parts", `/parts/${partId}`);
  const id = Number(partId);
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  let part, findings;
  try {
    [part, findings] = await Promise.all([getPartDetail(id), getPartFindings(id)]);
  } catch (error) {
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  }
  return (
    <div className="space-y-5">
      <header className="space-y-1">
        <p className="text-sm font-semibold">
          ATA <span className="num">{part.ataChapter}</span> · {part.description}
        </p>
        <h1 className="text-2xl font-bold">
          P/N <span className="num">{part.partNumber}</span> · S/N <span className="num">{part.serialNumber}</span>
        </h1>
        <p className="flex flex-wrap items-center gap-3">
          <PartStatusBadge status={part.status} />
          <span>
            CAGE <span className="num">{part.cage}</span>
          </span>
          <Link href={`/parts/${part.id}/label`} className="btn btn-secondary">
            Print label
          </Link>
          <span>
            {part.fittedAt ? (
              <>
                Fitted on{" "}
                <Link className="num font-semibold text-[var(--accent)] underline" href={`/aircraft/${part.fittedAt.registration}?position=${encodeURIComponent(part.fittedAt.positionCode)}`}>
                  {part.fittedAt.registration} · {part.fittedAt.positionCode}
                </Link>{" "}
                ({part.fittedAt.positionLabel}) since {formatInstant(part.fittedAt.installedAt)}
              </>
            ) : (
              part.location
            )}
          </span>
        </p>
      </header>

      <section aria-labelledby="times-heading" className="grid gap-4 md:grid-cols-2">
        <div className="panel p-4">
          <h2 id="times-heading" className="mb-2 text-lg font-semibold">
            Times
          </h2>
          <dl className="num grid grid-cols-2 gap-2">
            <dt className="font-sans font-semibold">TSN</dt>
            <dd>{part.tsn}</dd>
            <dt className="font-sans font-semibold">CSN</dt>
            <dd>{formatCycles(part.csn)}</dd>
            <dt className="font-sans font-semibold">TSO</dt>
            <dd>{part.tso ?? "—"}</dd>
            <dt className="font-sans font-semibold">CSO</dt>
            <dd>{part.cso === null ? "—" : formatCycles(part.cso)}</dd>
            <dt className="font-sans font-semibold">Manufactured</dt>
            <dd>{part.manufacturedOn ?? "—"}</dd>
          </dl>
        </div>
        <div className="panel p-4">
          <h2 className="mb-2 text-lg font-semibold">Remaining life</h2>
          {part.life.limits.length ? (
            <table className="w-full text-sm">
              <thead className="text-left">
                <tr>
                  <th scope="col">Limit</th>
                  <th scope="col" className="text-right">Limit</th>
                  <th scope="col" className="text-right">Used</th>
                  <th scope="col" className="text-right">Remaining</th>
                  <th scope="col" className="pl-3">State</th>
                </tr>
              </thead>
              <tbody>
                {part.life.limits.map((limit) => (
                  <tr key={limit.kind}>
                    <td>{limit.kind === "hours" ? "Flight hours" : limit.kind === "cycles" ? "Cycles" : "Calendar days"}</td>
                    <td className="num text-right">{limit.limit}</td>
                    <td className="num text-right">{limit.used}</td>
                    <td className="num text-right">{limit.remaining}</td>
                    <td className="pl-3">
                      <span aria-hidden="true">{LIFE_GLYPHS[limit.status]}</span> {LIFE_WORDS[limit.status]}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p>This part number has no life limit.</p>
          )}
        </div>
      </section>

      <FindingsList findings={findings} hrefFor={mayUse(user.role, "trace") ? (seq) => `/trace/${id}#seq-${seq}` : null} />

      <section aria-labelledby="documents-heading" className="panel p-4">
        <h2 id="documents-heading" className="mb-2 text-lg font-semibold">
          Documents
        </h2>
        <DocumentList documents={part.documents} />
      </section>

      <section aria-labelledby="thread-heading" className="space-y-2">
        <h2 id="thread-heading" className="text-lg font-semibold">
          Thread <span className="num text-sm font-normal">({part.thread.length} entries, newest first)</span>
        </h2>
        <ThreadTable lines={part.thread} />
      </section>
    </div>
  );
}
