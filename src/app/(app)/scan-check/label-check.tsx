"use client";

import { useEffect, useRef, useState } from "react";
import { LazyLabelScanner, type LabelScan } from "@/components/scanner/lazy-label-scanner";

export function LabelCheck() {
  const [open, setOpen] = useState(false);
  const [result, setResult] = useState<LabelScan | null>(null);
  const resultHeadingRef = useRef<HTMLHeadingElement>(null);
  // The scanner that had focus is gone once a reading is accepted: focus goes to what it gave.
  useEffect(() => resultHeadingRef.current?.focus(), [result]);

  return (
    <div className="space-y-4">
      {open ? (
        <LazyLabelScanner
          label="Scan a part label"
          onResult={(scan) => {
            setResult(scan);
            setOpen(false);
          }}
          onCancel={() => setOpen(false)}
        />
      ) : (
        <button type="button" className="btn btn-primary min-h-glove w-full text-lg" onClick={() => setOpen(true)}>
          {result ? "Check another label" : "Open the scanner"}
        </button>
      )}

      {result ? (
        <section aria-labelledby="label-check-result" className="panel space-y-2 p-4">
          <h2 id="label-check-result" ref={resultHeadingRef} tabIndex={-1} className="text-lg font-semibold">
            Accepted reading
          </h2>
          <p>What a swap would receive from this label:</p>
          <pre data-testid="scan-result" className="num overflow-x-auto whitespace-pre-wrap break-all rounded bg-[var(--page)] p-3 text-base">
            {JSON.stringify(result, null, 2)}
          </pre>
        </section>
      ) : null}
    </div>
  );
}
