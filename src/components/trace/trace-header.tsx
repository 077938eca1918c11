import { PartStatusBadge } from "@/components/status/part-status";
import type { PartTrace } from "@/server/trace";

/** Who the thread is about, and how far it reaches. */
export function TraceHeader({ trace }: { trace: PartTrace }) {
  const { part, entries } = trace;
  const airframes = new Set(entries.filter((e) => e.kind === "installed" && e.registration).map((e) => e.registration));
  const shopVisits = entries.filter((e) => e.kind === "sent_for_repair").length;
  const first = entries[0];
  return (
    <div className="space-y-1">
      <p className="text-sm font-semibold">
        ATA <span className="num">{part.ataChapter}</span> · {part.description}
      </p>
      <h1 className="text-2xl font-bold">
        Thread of P/N <span className="num">{part.partNumber}</span> · S/N <span className="num">{part.serialNumber}</span>
      </h1>
      <p className="flex flex-wrap items-center gap-x-4 gap-y-1">
        <span>
          CAGE <span className="num">{part.cage}</span>
        </span>
        <PartStatusBadge status={part.status} />
        <span className="num">{entries.length} entries</span>
        <span>
          <span className="num">{airframes.size}</span> {airframes.size === 1 ? "airframe" : "airframes"}: <span className="num">{[...airframes].join(", ") || "none"}</span>
        </span>
        <span>
          <span className="num">{shopVisits}</span> {shopVisits === 1 ? "shop visit" : "shop visits"}
        </span>
        {first ? <span>First entry: {first.kind === "received" ? "receipt" : first.kind.replace(/_/g, " ")}, seq <span className="num">{first.seq}</span></span> : null}
        {part.manufacturedOn ? (
          <span>
            Manufactured <span className="num">{part.manufacturedOn}</span>
          </span>
        ) : null}
      </p>
    </div>
  );
}
