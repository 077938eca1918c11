import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { encodeIso15434Format06 } from "@/domain/labels";
import { Code128Barcode } from "@/components/swap/code128-barcode";
import { PrintButton } from "@/components/swap/print-button";
import { formatCycles, formatInstant, formatMinutes } from "@/lib/format";
import { db } from "@/server/db";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Unserviceable tag" };

export default async function UnserviceableTagPage({ params }: { params: Promise<{ swapId: string }> }) {
  const { swapId } = await params;
  await requireUserFor("fleet", `/swaps/${swapId}/tag`);
  const row = await db()("swaps as s")
    .join("ledger_entries as e", "e.seq", "s.removed_seq")
    .join("parts as pt", "pt.id", "e.part_id")
    .join("part_numbers as pn", "pn.id", "pt.part_number_id")
    .join("aircraft as a", "a.id", "s.aircraft_id")
    .join("positions as p", "p.id", "s.position_id")
    .join("stations as st", "st.id", "a.station_id")
    .join("users as u", "u.id", "s.performed_by")
    .where("s.id", swapId)
    .first("e.*", "pn.part_number", "pn.cage", "pn.description", "pt.serial_number", "a.registration", "p.code as position_code", "p.label as position_label", "u.name as removed_by", "u.licence_number", "st.time_zone");
  if (!row) notFound();
  const message = encodeIso15434Format06({ partNumber: row.part_number, serialNumber: row.serial_number, cage: row.cage });
  return (
    <div className="mx-auto max-w-xl space-y-4">
      <article className="tag-print rounded-md border-4 border-black bg-white p-5 text-black" aria-labelledby="tag-heading">
        <h1 id="tag-heading" className="border-b-4 border-black pb-2 text-3xl font-black tracking-wide">
          ✕ UNSERVICEABLE
        </h1>
        <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-lg">
          <dt className="font-bold">P/N</dt>
          <dd className="num">{row.part_number}</dd>
          <dt className="font-bold">S/N</dt>
          <dd className="num">{row.serial_number}</dd>
          <dt className="font-bold">CAGE</dt>
          <dd className="num">{row.cage}</dd>
          <dt className="font-bold">Description</dt>
          <dd>{row.description}</dd>
          <dt className="font-bold">Removed from</dt>
          <dd className="num">
            {row.registration} · {row.position_code}
          </dd>
          <dt className="font-bold">Date</dt>
          <dd>{formatInstant(new Date(row.occurred_at).toISOString(), row.time_zone)}</dd>
          <dt className="font-bold">Reason</dt>
          <dd>
            {row.removal_type === "unscheduled" ? "Unscheduled" : "Scheduled"}: {row.reason}
          </dd>
          <dt className="font-bold">TSN · CSN</dt>
          <dd className="num">
            {formatMinutes(Number(row.tsn_minutes))} · {formatCycles(Number(row.csn))}
          </dd>
          <dt className="font-bold">Work order</dt>
          <dd className="num">{row.work_order}</dd>
          <dt className="font-bold">Removed by</dt>
          <dd>
            {row.removed_by} <span className="num">{row.licence_number}</span>
          </dd>
          <dt className="font-bold">Ledger seq</dt>
          <dd className="num">{row.seq}</dd>
        </dl>
        <div className="mt-3">
          <Code128Barcode value={message} label={`Barcode for P/N ${row.part_number} S/N ${row.serial_number}`} />
        </div>
      </article>
      <PrintButton />
    </div>
  );
}
