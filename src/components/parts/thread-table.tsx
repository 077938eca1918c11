import { formatCycles, formatInstant } from "@/lib/format";
import type { ThreadLine } from "@/server/parts";

export const KIND_WORDS: Record<string, string> = {
  received: "Received",
  issued: "Issued",
  installed: "Installed",
  removed: "Removed",
  returned: "Returned to stores",
  sent_for_repair: "Sent for repair",
  repaired: "Back from repair",
  quarantined: "Quarantined",
  released: "Released from quarantine",
  scrapped: "Scrapped",
  corrected: "Correction",
};

function detailText(line: ThreadLine): string {
  const d = line.details ?? {};
  const bits = [
    line.removalType ? `${line.removalType === "unscheduled" ? "Unscheduled" : "Scheduled"}: ${line.reason ?? ""}` : line.reason,
    d.shop ? `Shop ${d.shop}` : null,
    d.repairOrder ? `order ${d.repairOrder}` : null,
    d.shopFinding ? `finding: ${d.shopFinding.replace(/_/g, " ")}` : null,
    d.statusWork ? `status/work: ${d.statusWork.replace(/_/g, " ")}` : null,
    d.tag ?? null,
    d.bin ? `bin ${d.bin}` : null,
    line.testResult,
    line.correctsSeq ? `corrects seq ${line.correctsSeq}` : null,
  ];
  return bits.filter(Boolean).join(" · ");
}

/** A unit's ledger entries, newest first. */
export function ThreadTable({ lines, timeZone = "UTC" }: { lines: ThreadLine[]; timeZone?: string }) {
  return (
    <>
      {/* On a phone each entry is a card; the full table needs a wider screen. */}
      <ol className="space-y-2 md:hidden">
        {lines.map((line) => (
          <li key={line.seq} className="panel p-3 text-sm">
            <p className="flex justify-between gap-2 font-semibold">
              <span>{KIND_WORDS[line.kind] ?? line.kind}</span>
              <span className="num">seq {line.seq}</span>
            </p>
            <p>{formatInstant(line.occurredAt, timeZone)}</p>
            {line.registration ? (
              <p className="num">
                {line.registration} · {line.positionCode} · A/C {line.aircraftHours} h / {formatCycles(line.aircraftCycles)} cyc
              </p>
            ) : null}
            {line.tsn ? (
              <p className="num">
                TSN {line.tsn} · CSN {formatCycles(line.csn)}
                {line.tso ? ` · TSO ${line.tso} · CSO ${formatCycles(line.cso)}` : ""}
              </p>
            ) : null}
            {line.workOrder ? <p className="num">{line.workOrder}</p> : null}
            {detailText(line) ? <p>{detailText(line)}</p> : null}
            <p>
              Signed {line.recordedBy}
              {line.recordedByLicence ? <span className="num"> ({line.recordedByLicence})</span> : null}
            </p>
          </li>
        ))}
      </ol>
    <div className="panel hidden overflow-x-auto md:block">
      <table className="w-full border-collapse text-sm">
        <thead className="text-left">
          <tr>
            <th scope="col" className="px-2 py-1">Seq</th>
            <th scope="col" className="px-2 py-1">When</th>
            <th scope="col" className="px-2 py-1">Entry</th>
            <th scope="col" className="px-2 py-1">Aircraft · position</th>
            <th scope="col" className="px-2 py-1 text-right">A/C hours · cycles</th>
            <th scope="col" className="px-2 py-1 text-right">TSN · CSN</th>
            <th scope="col" className="px-2 py-1 text-right">TSO · CSO</th>
            <th scope="col" className="px-2 py-1">Work order · task</th>
            <th scope="col" className="px-2 py-1">Details</th>
            <th scope="col" className="px-2 py-1">Signed</th>
          </tr>
        </thead>
        <tbody>
          {lines.map((line) => (
            <tr key={line.seq} className="border-t border-[var(--rule)] align-top">
              <td className="num px-2 py-1">{line.seq}</td>
              <td className="px-2 py-1 whitespace-nowrap">{formatInstant(line.occurredAt, timeZone)}</td>
              <td className="px-2 py-1 font-semibold">{KIND_WORDS[line.kind] ?? line.kind}</td>
              <td className="num px-2 py-1">{line.registration ? `${line.registration} · ${line.positionCode}` : "—"}</td>
              <td className="num px-2 py-1 text-right">{line.aircraftHours ? `${line.aircraftHours} · ${formatCycles(line.aircraftCycles)}` : "—"}</td>
              <td className="num px-2 py-1 text-right">{line.tsn ? `${line.tsn} · ${formatCycles(line.csn)}` : "—"}</td>
              <td className="num px-2 py-1 text-right">{line.tso ? `${line.tso} · ${formatCycles(line.cso)}` : "—"}</td>
              <td className="px-2 py-1">
                <span className="num">{line.workOrder ?? "—"}</span>
                {line.taskReference ? <span className="block">{line.taskReference}</span> : null}
              </td>
              <td className="px-2 py-1">{detailText(line)}</td>
              <td className="px-2 py-1">
                {line.recordedBy}
                {line.recordedByLicence ? <span className="num block">{line.recordedByLicence}</span> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
    </>
  );
}
