"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import { formatInstant } from "@/lib/format";
import type { AwaitingInspection } from "@/lib/swap-types";

export function InspectionList({ swaps, inspectorId }: { swaps: AwaitingInspection[]; inspectorId: string }) {
  const router = useRouter();
  const [messages, setMessages] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState<string | null>(null);

  async function countersign(id: string) {
    setBusy(id);
    try {
      await apiFetch(`/api/swaps/${id}/inspection`, { method: "POST" });
      setMessages((m) => ({ ...m, [id]: "Countersigned." }));
      router.refresh();
    } catch (error) {
      setMessages((m) => ({ ...m, [id]: error instanceof ApiError ? error.message : "The countersignature could not be sent; try again." }));
    } finally {
      setBusy(null);
    }
  }

  if (swaps.length === 0) return <p className="panel p-4">No swap is waiting for an independent inspection.</p>;
  return (
    <ul className="space-y-3" aria-label="Swaps waiting for inspection">
      {swaps.map((swap) => (
        <li key={swap.id} className="panel flex flex-wrap items-center gap-3 p-3">
          <div className="min-w-0 flex-1">
            <p className="font-semibold">
              <Link className="num text-[var(--accent)] underline" href={`/aircraft/${swap.registration}?position=${encodeURIComponent(swap.positionCode)}`}>
                {swap.registration} · {swap.positionCode}
              </Link>{" "}
              {swap.positionLabel}
            </p>
            <p className="num text-sm">
              off {swap.removed ?? "—"} · on {swap.installed ?? "—"} · {swap.workOrder}
            </p>
            <p className="text-sm">
              by {swap.performedBy}, {formatInstant(swap.performedAt)}
            </p>
            {messages[swap.id] ? <p role="status" className="font-semibold">{messages[swap.id]}</p> : null}
          </div>
          {swap.performedById === inspectorId ? (
            <p className="text-sm font-semibold">You did this work: another inspector must countersign.</p>
          ) : (
            <button type="button" className="btn btn-primary min-h-glove" disabled={busy === swap.id || messages[swap.id] === "Countersigned."} onClick={() => countersign(swap.id)}>
              Countersign
            </button>
          )}
        </li>
      ))}
    </ul>
  );
}
