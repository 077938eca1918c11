"use client";

import { useQueryClient } from "@tanstack/react-query";
import Papa from "papaparse";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import { formatCycles, formatInstant } from "@/lib/format";
import { queryKeys } from "@/lib/queries";

interface Snapshot {
  asOf: string;
  hours: string;
  cycles: number;
}

interface ImportResult {
  accepted: number;
  rejected: Array<{ row: number; field: string; message: string }>;
}

const CHUNK = 500;

export function UtilizationPanel({ registration, timeZone, snapshots, canRecord }: { registration: string; timeZone: string; snapshots: Snapshot[]; canRecord: boolean }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [progress, setProgress] = useState<number | null>(null);
  const [importResult, setImportResult] = useState<ImportResult | null>(null);

  const refresh = () => {
    router.refresh();
    void queryClient.invalidateQueries({ queryKey: queryKeys.aircraft(registration) });
  };

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const local = String(form.get("asOf") ?? "");
    const hoursText = String(form.get("hours") ?? "").trim();
    const body = {
      asOf: local ? new Date(local).toISOString() : "",
      hours: /^\d+(\.\d+)?$/.test(hoursText) ? Number(hoursText) : hoursText,
      cycles: Number(form.get("cycles")),
    };
    setBusy(true);
    setErrors({});
    setMessage(null);
    try {
      await apiFetch(`/api/aircraft/${registration}/utilization`, { method: "POST", body: JSON.stringify(body) });
      setMessage("Snapshot recorded.");
      refresh();
    } catch (error) {
      if (error instanceof ApiError) {
        setErrors(error.fields ?? {});
        setMessage(error.message);
      } else setMessage("The snapshot could not be sent. Check the connection and try again.");
    } finally {
      setBusy(false);
    }
  }

  function importFile(file: File) {
    setImportResult(null);
    Papa.parse<Record<string, string>>(file, {
      header: true,
      skipEmptyLines: true,
      complete: async (parsed) => {
        const rows = parsed.data.map((r) => ({
          asOf: r.as_of ?? r.asOf ?? "",
          hours: /^\d+(\.\d+)?$/.test(r.hours ?? "") ? Number(r.hours) : (r.hours ?? ""),
          cycles: Number(r.cycles),
        }));
        const total: ImportResult = { accepted: 0, rejected: [] };
        setProgress(0);
        try {
          for (let start = 0; start < rows.length; start += CHUNK) {
            const result = await apiFetch<ImportResult>(`/api/aircraft/${registration}/utilization/import`, {
              method: "POST",
              body: JSON.stringify({ rows: rows.slice(start, start + CHUNK) }),
            });
            total.accepted += result.accepted;
            total.rejected.push(...result.rejected.map((r) => ({ ...r, row: r.row + start })));
            setProgress(Math.round(((start + CHUNK) / rows.length) * 100));
          }
        } catch (error) {
          total.rejected.push({ row: 0, field: "file", message: error instanceof Error ? error.message : "import failed" });
        }
        setProgress(100);
        setImportResult(total);
        refresh();
      },
    });
  }

  return (
    <section aria-labelledby="utilisation-heading" className="panel space-y-4 p-4">
      <h2 id="utilisation-heading" className="text-lg font-semibold">
        Utilisation
      </h2>
      <table className="text-sm">
        <thead>
          <tr className="text-left">
            <th scope="col" className="pr-6">As of</th>
            <th scope="col" className="pr-6 text-right">Hours</th>
            <th scope="col" className="text-right">Cycles</th>
          </tr>
        </thead>
        <tbody>
          {snapshots.map((s) => (
            <tr key={s.asOf}>
              <td className="pr-6">{formatInstant(s.asOf, timeZone)}</td>
              <td className="num pr-6 text-right">{s.hours}</td>
              <td className="num text-right">{formatCycles(s.cycles)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {canRecord ? (
        <div className="grid gap-6 lg:grid-cols-2">
          <form onSubmit={submit} className="space-y-3" noValidate aria-describedby={message ? "utilisation-message" : undefined}>
            <h3 className="font-semibold">Record a snapshot</h3>
            <div className="grid gap-3 sm:grid-cols-3">
              <div>
                <label htmlFor="asOf" className="field-label">As of (your device&apos;s time)</label>
                <input id="asOf" name="asOf" type="datetime-local" required className="field-input" aria-invalid={errors.asOf ? true : undefined} aria-describedby={errors.asOf ? "asOf-error" : undefined} />
                {errors.asOf ? <p id="asOf-error" className="field-error">{errors.asOf}</p> : null}
              </div>
              <div>
                <label htmlFor="hours" className="field-label">Total hours (H:MM)</label>
                <input id="hours" name="hours" inputMode="decimal" required className="field-input num" placeholder="24512:40" aria-invalid={errors.hours ? true : undefined} aria-describedby={errors.hours ? "hours-error" : undefined} />
                {errors.hours ? <p id="hours-error" className="field-error">{errors.hours}</p> : null}
              </div>
              <div>
                <label htmlFor="cycles" className="field-label">Total cycles</label>
                <input id="cycles" name="cycles" inputMode="numeric" required className="field-input num" aria-invalid={errors.cycles ? true : undefined} aria-describedby={errors.cycles ? "cycles-error" : undefined} />
                {errors.cycles ? <p id="cycles-error" className="field-error">{errors.cycles}</p> : null}
              </div>
            </div>
            {message ? (
              <p id="utilisation-message" role="status" className="font-semibold">
                {message}
              </p>
            ) : null}
            <button type="submit" className="btn btn-primary" disabled={busy}>
              {busy ? "Recording…" : "Record snapshot"}
            </button>
          </form>
          <div className="space-y-2">
            <h3 className="font-semibold">Import a CSV</h3>
            <p className="text-sm">
              Header row <span className="num">as_of,hours,cycles</span>; <span className="num">as_of</span> as ISO 8601 with a zone, hours as H:MM or decimal. Rows that fail are listed; the others are kept.
            </p>
            <label className="btn btn-secondary cursor-pointer">
              Choose CSV file
              <input type="file" accept=".csv,text/csv" className="sr-only" onChange={(e) => e.target.files?.[0] && importFile(e.target.files[0])} />
            </label>
            {progress !== null ? <progress max={100} value={progress} className="w-full" aria-label="Import progress" /> : null}
            {importResult ? (
              <div role="status">
                <p className="font-semibold">
                  {importResult.accepted} rows recorded, {importResult.rejected.length} refused.
                </p>
                {importResult.rejected.length ? (
                  <ul className="list-disc pl-6 text-sm">
                    {importResult.rejected.map((r, i) => (
                      <li key={i}>
                        Row <span className="num">{r.row}</span> ({r.field}): {r.message}
                      </li>
                    ))}
                  </ul>
                ) : null}
              </div>
            ) : null}
          </div>
        </div>
      ) : null}
    </section>
  );
}
