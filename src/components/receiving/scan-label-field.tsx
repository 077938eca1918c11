"use client";

import { useState } from "react";
import { parseLabel, type LabelReading } from "@/domain/labels";

/**
 * A text field for a keyboard-wedge scanner: the scanner types the label's raw text and ends with
 * Enter, which reads the label here (parseLabel) instead of submitting the form around it.
 */
export function ScanLabelField({ id, onRead }: { id: string; onRead: (reading: LabelReading) => void }) {
  const [raw, setRaw] = useState("");
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);

  function read(text: string) {
    if (!text.trim()) return;
    const reading = parseLabel(text);
    if (reading.ok) {
      onRead(reading);
      const checkNote = reading.inferredSeparators ? " The scanner sent no separators: check the values below against the label." : "";
      setResult({
        ok: true,
        message: `Read P/N ${reading.partNumber}, S/N ${reading.serialNumber}${reading.cage ? `, CAGE ${reading.cage}` : ""}.${checkNote}`,
      });
      setRaw("");
    } else {
      setResult({ ok: false, message: reading.message });
    }
  }

  return (
    <div className="panel p-3">
      <label htmlFor={id} className="field-label">
        Scan a label
      </label>
      <div className="flex gap-2">
        <input
          id={id}
          className="field-input num"
          value={raw}
          autoComplete="off"
          autoCapitalize="off"
          spellCheck={false}
          placeholder="Point the scanner here, or paste the label text"
          aria-describedby={`${id}-result ${id}-hint`}
          onChange={(event) => setRaw(event.target.value)}
          onKeyDown={(event) => {
            if (event.key === "Enter") {
              event.preventDefault();
              read(raw);
            }
          }}
        />
        <button type="button" className="btn btn-secondary shrink-0" onClick={() => read(raw)}>
          Read
        </button>
      </div>
      <p id={`${id}-hint`} className="mt-1 text-sm text-[var(--ink-soft)]">
        Reads ISO/IEC 15434, ATA text element, GS1 and plain P/N–S/N labels, and fills the part number, serial number and CAGE.
      </p>
      <p id={`${id}-result`} role={result && !result.ok ? "alert" : "status"} className={result ? (result.ok ? "mt-1 font-semibold" : "field-error") : "sr-only"}>
        {result?.message ?? ""}
      </p>
    </div>
  );
}
