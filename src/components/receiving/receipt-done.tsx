import Link from "next/link";
import type { PartStatus } from "@/domain/ledger-types";
import { StatusBadge } from "@/components/stock/status-badge";

export interface ReceiptAnswer {
  part: { id: number; partNumber: string; serialNumber: string; cage: string; description: string; status: PartStatus; bin: string; tsn: string; csn: number };
  document: { id: number; trackingNumber: string; sha256: string; sizeBytes: number };
}

/** What the clerk sees once the unit is on file: where it went and the label to print next. */
export function ReceiptDone({ answer, onAnother }: { answer: ReceiptAnswer; onAnother: () => void }) {
  const { part, document } = answer;
  return (
    <section aria-labelledby="receipt-done-heading" className="panel space-y-4 p-4" role="status">
      <h2 id="receipt-done-heading" className="text-xl font-bold">
        Received: P/N <span className="num">{part.partNumber}</span> S/N <span className="num">{part.serialNumber}</span>
      </h2>
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold">Status</dt>
        <dd>
          <StatusBadge status={part.status} />
        </dd>
        <dt className="font-semibold">Description</dt>
        <dd>{part.description}</dd>
        <dt className="font-semibold">Bin</dt>
        <dd className="num">{part.bin}</dd>
        <dt className="font-semibold">TSN / CSN</dt>
        <dd className="num">
          {part.tsn} / {part.csn.toLocaleString("en-GB")}
        </dd>
        <dt className="font-semibold">Certificate</dt>
        <dd>
          <span className="num">{document.trackingNumber}</span>, SHA-256 <span className="num break-all">{document.sha256}</span>
        </dd>
      </dl>
      {part.status === "quarantined" ? (
        <p className="rounded-md border-2 border-red-800 bg-red-50 p-3 font-semibold text-red-950 dark:bg-red-950 dark:text-red-50">
          Booked in as quarantined with a receiving discrepancy; quality has been told. Keep the unit in the quarantine area.
        </p>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Link href={`/parts/${part.id}/label`} className="btn btn-primary">
          Print its label
        </Link>
        <Link href={`/parts/${part.id}`} className="btn btn-secondary">
          Open the part page
        </Link>
        <button type="button" className="btn btn-secondary" onClick={onAnother}>
          Receive another unit
        </button>
      </div>
    </section>
  );
}
