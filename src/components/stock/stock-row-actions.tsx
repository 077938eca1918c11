"use client";

import Link from "next/link";
import { useState } from "react";
import type { MovementKind } from "@/lib/schemas/stock";
import { MovementDialog, type MovementTarget } from "./movement-dialog";

/** The label link and, for roles that move stock, the movement dialog of one row. */
export function StockRowActions({ unit, kinds }: { unit: MovementTarget; kinds: MovementKind[] }) {
  const [open, setOpen] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  return (
    <div>
      <div className="flex items-center gap-2">
        {kinds.length > 0 ? (
          <button type="button" className="btn btn-secondary" onClick={() => (setDone(null), setOpen(true))} aria-label={`Record a movement for S/N ${unit.serialNumber}`}>
            Move…
          </button>
        ) : null}
        <Link href={`/parts/${unit.id}/label`} className="btn btn-secondary" aria-label={`Label for S/N ${unit.serialNumber}`}>
          Label
        </Link>
      </div>
      {open ? (
        <MovementDialog
          unit={unit}
          kinds={kinds}
          onClose={() => setOpen(false)}
          onDone={(message) => {
            setOpen(false);
            setDone(message);
          }}
        />
      ) : null}
      <p role="status" className={done ? "mt-1 max-w-xs text-sm font-semibold" : "sr-only"}>
        {done ?? ""}
      </p>
    </div>
  );
}
