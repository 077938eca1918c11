"use client";

import { useState } from "react";
import { LazyLabelScanner, type LabelScan } from "@/components/scanner/lazy-label-scanner";
import type { UnitReading } from "./swap-types";

/** One label to read: the camera scanner (loaded only when opened) or what was read already. */
export function UnitStep({ title, reading, onReading }: { title: string; reading: UnitReading | null; onReading: (reading: UnitReading) => void }) {
  const [scanning, setScanning] = useState(false);
  const [refusal, setRefusal] = useState<string | null>(null);

  function accept(scan: LabelScan) {
    setScanning(false);
    if (!scan.parsed.ok) {
      setRefusal(scan.parsed.message);
      return;
    }
    // The part-label scanner refuses position labels itself (not_a_part_label); this narrows the type.
    if (scan.parsed.syntax === "threadline-position") return;
    setRefusal(null);
    onReading({ partNumber: scan.parsed.partNumber, serialNumber: scan.parsed.serialNumber, cage: scan.parsed.cage });
  }

  if (scanning) return <LazyLabelScanner label={title} onResult={accept} onCancel={() => setScanning(false)} />;
  return (
    <div className="space-y-3">
      {reading ? (
        <p className="panel p-3 text-lg" data-testid="unit-reading">
          Read: P/N <span className="num font-bold">{reading.partNumber}</span> · S/N <span className="num font-bold">{reading.serialNumber}</span>
          {reading.cage ? (
            <>
              {" "}
              · CAGE <span className="num">{reading.cage}</span>
            </>
          ) : null}
        </p>
      ) : null}
      {refusal ? (
        <p role="alert" className="field-error">
          {refusal}
        </p>
      ) : null}
      <button type="button" className="btn btn-primary min-h-glove w-full text-lg" onClick={() => setScanning(true)}>
        {reading ? "Scan again" : title}
      </button>
    </div>
  );
}
