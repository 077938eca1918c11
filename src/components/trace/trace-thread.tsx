import { KIND_WORDS } from "@/components/parts/thread-table";
import { formatCycles, formatInstant } from "@/lib/format";
import type { TraceEntry, TraceFinding } from "@/server/trace";
import { FINDING_STYLE } from "./finding-style";
import { groupThread, type ThreadGroup } from "./thread-groups";

const DOCUMENT_WORDS: Record<string, string> = {
  release_certificate: "Release certificate",
  unserviceable_tag: "Unserviceable tag",
  shop_report: "Shop report",
  photo: "Photo",
};
const FORM_WORDS: Record<string, string> = {
  faa_8130_3: "FAA Form 8130-3",
  easa_form_1: "EASA Form 1",
  national: "national form",
  certificate_of_conformity: "certificate of conformity",
};

function groupTitle(group: ThreadGroup<TraceEntry>): string {
  const first = group.entries[0];
  const last = group.entries[group.entries.length - 1];
  const span = `${formatInstant(first.occurredAt)}${group.entries.length > 1 ? ` to ${formatInstant(last.occurredAt)}` : ""}`;
  if (group.kind === "airframe") return `On ${group.registration ?? "an unrecorded aircraft"} at ${group.positionCode ?? "an unrecorded position"}${group.closed ? "" : " (still fitted)"} · ${span}`;
  if (group.kind === "shop") return `Shop visit${group.shop ? ` at ${group.shop}` : ""}${group.closed ? "" : " (not back yet)"} · ${span}`;
  return `Off wing, in stores · ${span}`;
}

function detailBits(entry: TraceEntry): string[] {
  const d = entry.details ?? {};
  return [
    entry.removalType ? `${entry.removalType === "unscheduled" ? "Unscheduled" : "Scheduled"} removal: ${entry.kind === "corrected" ? (d.entryReason ?? "") : (entry.reason ?? "")}` : entry.kind !== "corrected" ? entry.reason : null,
    d.shop ? `Shop ${d.shop}${d.shopApproval ? ` (${d.shopApproval})` : ""}` : null,
    d.repairOrder ? `repair order ${d.repairOrder}` : null,
    d.shopFinding ? `shop finding: ${d.shopFinding.replace(/_/g, " ")}` : null,
    d.statusWork ? `status/work: ${d.statusWork.replace(/_/g, " ")}` : null,
    d.tag ?? null,
    d.bin ? `bin ${d.bin}` : null,
    d.note ?? null,
    entry.testResult,
  ].filter((bit): bit is string => Boolean(bit));
}

interface Props {
  entries: TraceEntry[];
  findings: TraceFinding[];
  /** Print shows every hash in full and no links but the anchors. */
  variant?: "screen" | "print";
}

/** A serial's thread, oldest first, grouped by airframe and shop visit; each entry is an anchor (#seq-N). */
export function TraceThread({ entries, findings, variant = "screen" }: Props) {
  const groups = groupThread(entries);
  const findingsAt = new Map<number, TraceFinding[]>();
  for (const finding of findings) findingsAt.set(finding.seq, [...(findingsAt.get(finding.seq) ?? []), finding]);
  const findingIndex = new Map(findings.map((f, i) => [f, i + 1]));
  return (
    <div className="space-y-4">
      {groups.map((group) => (
        <section key={group.entries[0].seq} className="thread-group panel overflow-hidden" aria-label={groupTitle(group)}>
          <h3 className={`flex flex-wrap items-center gap-2 border-b border-[var(--rule)] px-3 py-2 font-semibold ${group.kind === "shop" ? "bg-amber-50 dark:bg-amber-950" : group.kind === "airframe" ? "bg-thread-50 dark:bg-thread-900" : ""}`}>
            <span aria-hidden="true">{group.kind === "airframe" ? "✈" : group.kind === "shop" ? "⚙" : "▤"}</span>
            <span>{groupTitle(group)}</span>
          </h3>
          <div className="overflow-x-auto">
            {/* Fixed columns, so every stretch's table lines up with the next one down the page. */}
            <table className="w-full min-w-[76em] table-fixed border-collapse text-sm">
              <colgroup>
                <col className="w-[4em]" />
                <col className="w-[13%]" />
                <col className="w-[8.5em]" />
                <col className="w-[9%]" />
                <col className="w-[15.5em]" />
                <col className="w-[10%]" />
                <col className="w-[8%]" />
                <col />
                <col className={variant === "print" ? "w-[10em]" : "w-[8em]"} />
              </colgroup>
              <thead className="text-left">
                <tr className="border-b border-[var(--rule)]">
                  <th scope="col" className="px-2 py-1">Seq</th>
                  <th scope="col" className="px-2 py-1">Entry</th>
                  <th scope="col" className="px-2 py-1">When (UTC)</th>
                  <th scope="col" className="px-2 py-1">Aircraft · position</th>
                  <th scope="col" className="px-2 py-1">
                    Times <span className="block text-xs font-normal">A/C hours · cycles; unit TSN · CSN, TSO · CSO</span>
                  </th>
                  <th scope="col" className="px-2 py-1">Work order · task</th>
                  <th scope="col" className="px-2 py-1">Signed (licence)</th>
                  <th scope="col" className="px-2 py-1">Documents</th>
                  <th scope="col" className="px-2 py-1">Hash</th>
                </tr>
              </thead>
              <tbody>
                {group.entries.map((entry) => {
                  const here = findingsAt.get(entry.seq) ?? [];
                  return (
                    <tr key={entry.seq} id={`seq-${entry.seq}`} className={`thread-entry scroll-mt-4 border-b border-[var(--rule)] align-top last:border-b-0 target:bg-purple-50 dark:target:bg-purple-950`}>
                      <td className="num px-2 py-1 font-semibold">{entry.seq}</td>
                      <td className="px-2 py-1">
                        <p className="font-semibold">{KIND_WORDS[entry.kind] ?? entry.kind}</p>
                        {entry.correctedBy.length ? (
                          <p className="font-semibold">
                            <span aria-hidden="true">✎</span> Corrected by{" "}
                            {entry.correctedBy.map((seq, i) => (
                              <span key={seq}>
                                {i > 0 ? ", " : ""}
                                <a className="num text-[var(--accent)] underline" href={`#seq-${seq}`}>
                                  seq {seq}
                                </a>
                              </span>
                            ))}
                          </p>
                        ) : null}
                        {entry.kind === "corrected" && entry.correctsSeq !== null ? (
                          <div>
                            <p className="font-semibold">
                              <span aria-hidden="true">✎</span> Corrects{" "}
                              <a className="num text-[var(--accent)] underline" href={`#seq-${entry.correctsSeq}`}>
                                seq {entry.correctsSeq}
                              </a>
                            </p>
                            <p>Why: {entry.reason}</p>
                            {entry.changes.length ? (
                              <ul className="list-disc pl-4">
                                {entry.changes.map((change) => (
                                  <li key={change.field}>
                                    {change.field}: <span className="num">{change.from ?? "—"}</span> → <span className="num">{change.to ?? "—"}</span>
                                  </li>
                                ))}
                              </ul>
                            ) : null}
                          </div>
                        ) : null}
                        {detailBits(entry).map((bit) => (
                          <p key={bit}>{bit}</p>
                        ))}
                        {here.map((finding) => (
                          <p key={finding.kind} className="font-semibold text-purple-900 dark:text-purple-100">
                            <a href={`#finding-${findingIndex.get(finding)}`} className="underline">
                              <span aria-hidden="true">{FINDING_STYLE[finding.kind].glyph}</span> Finding: {FINDING_STYLE[finding.kind].word}
                            </a>
                          </p>
                        ))}
                      </td>
                      <td className="num px-2 py-1">{formatInstant(entry.occurredAt)}</td>
                      <td className="num px-2 py-1">
                        {entry.registration ? (
                          <>
                            {entry.registration} · {entry.positionCode ?? "—"}
                            {entry.positionLabel ? <span className="block font-sans text-xs">{entry.positionLabel}</span> : null}
                          </>
                        ) : (
                          "—"
                        )}
                      </td>
                      <td className="px-2 py-1">
                        <dl className="grid grid-cols-[max-content_1fr] gap-x-2">
                          <dt className="text-xs font-semibold">A/C</dt>
                          <dd className="num text-right whitespace-nowrap">
                            {entry.aircraftHours ?? "—"} · {formatCycles(entry.aircraftCycles)}
                          </dd>
                          <dt className="text-xs font-semibold">TSN·CSN</dt>
                          <dd className="num text-right whitespace-nowrap">
                            {entry.tsn ?? "—"} · {formatCycles(entry.csn)}
                          </dd>
                          <dt className="text-xs font-semibold">TSO·CSO</dt>
                          <dd className="num text-right whitespace-nowrap">
                            {entry.tso ?? "—"} · {formatCycles(entry.cso)}
                          </dd>
                        </dl>
                      </td>
                      <td className="num px-2 py-1">
                        {entry.workOrder ?? "—"}
                        {entry.taskReference ? <span className="block font-sans text-xs">{entry.taskReference}</span> : null}
                      </td>
                      <td className="px-2 py-1">
                        {entry.signedBy.name}
                        {entry.signedBy.licenceNumber ? <span className="num block text-xs">{entry.signedBy.licenceNumber}</span> : null}
                        {entry.inspectedBy ? (
                          <span className="block text-xs">
                            Inspected: {entry.inspectedBy.name}
                            {entry.inspectedBy.licenceNumber ? <span className="num"> ({entry.inspectedBy.licenceNumber})</span> : null}
                          </span>
                        ) : null}
                      </td>
                      <td className="px-2 py-1">
                        {entry.document ? (
                          <>
                            {variant === "screen" ? (
                              <a className="font-semibold text-[var(--accent)] underline" href={`/api/documents/${entry.document.id}`}>
                                {DOCUMENT_WORDS[entry.document.kind] ?? entry.document.kind}
                              </a>
                            ) : (
                              <span className="font-semibold">{DOCUMENT_WORDS[entry.document.kind] ?? entry.document.kind}</span>
                            )}
                            <span className="block text-xs">
                              {entry.document.formType ? (FORM_WORDS[entry.document.formType] ?? entry.document.formType) : null}
                              {entry.document.trackingNumber ? <span className="num"> · {entry.document.trackingNumber}</span> : null}
                            </span>
                            <span className="num block text-xs break-all">SHA-256 {entry.document.sha256}</span>
                          </>
                        ) : (
                          "—"
                        )}
                      </td>
                      <td className="num px-2 py-1 text-xs break-all">
                        {variant === "print" ? entry.hash : <span title={entry.hash}>{entry.hash.slice(0, 12)}…</span>}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </section>
      ))}
    </div>
  );
}
