"use client";

import { useMutation } from "@tanstack/react-query";
import Papa from "papaparse";
import { useState } from "react";
import { checkCsvHeader, IMPORT_MAX_ROWS, validateCsvRecord, type CsvRowError } from "@/lib/schemas/catalog-csv";
import { FormMessage } from "./form-field";
import { chunkRows, type ReadyRow } from "./import-chunks";
import { ImportReport } from "./import-report";

const CHUNK_ROWS = 50;
const MAX_FILE_BYTES = 5 * 1024 * 1024;

interface Checked {
  fileName: string;
  rowsRead: number;
  ready: ReadyRow[];
  errors: CsvRowError[];
}
interface Outcome {
  accepted: number;
  rejected: CsvRowError[];
}

/** Reads the file in the browser and checks every row with the catalog's own schema before anything is sent. */
function checkFile(fileName: string, data: string[][], parseErrors: Papa.ParseError[]): Checked | { problems: string[] } {
  if (data.length === 0) return { problems: ["The file is empty."] };
  const { columns, problems } = checkCsvHeader(data[0]);
  if (problems.length) return { problems };
  const errors: CsvRowError[] = [];
  const ready: ReadyRow[] = [];
  const brokenRows = new Set(parseErrors.filter((e) => e.row !== undefined).map((e) => e.row! + 1));
  for (const error of parseErrors) if (error.row !== undefined) errors.push({ row: error.row + 1, field: "row", message: error.message });
  let rowsRead = 0;
  data.slice(1).forEach((cells, index) => {
    const row = index + 2; // the header is row 1, as in a spreadsheet
    if (cells.every((cellText) => cellText.trim() === "")) return;
    rowsRead++;
    if (brokenRows.has(row)) return;
    if (cells.slice(columns.length).some((cellText) => cellText.trim() !== "")) {
      errors.push({ row, field: "row", message: `This row has ${cells.length} cells, but the header has ${columns.length} columns.` });
      return;
    }
    const record = Object.fromEntries(columns.map((column, j) => [column, cells[j] ?? ""]));
    const result = validateCsvRecord(record);
    if (!result.ok) errors.push(...result.errors.map((error) => ({ row, ...error })));
    else ready.push({ row, record, partNumber: result.value.partNumber, alternateNames: (result.value.alternates ?? []).map((a) => a.partNumber) });
  });
  return { fileName, rowsRead, ready, errors };
}

async function postChunk(chunk: ReadyRow[]): Promise<Outcome> {
  const response = await fetch("/api/part-numbers/import", {
    method: "POST",
    headers: { "content-type": "application/json", accept: "application/json" },
    body: JSON.stringify({ rows: chunk.map(({ row, record }) => ({ ...record, row })) }),
  });
  const body = await response.json().catch(() => null);
  if (!response.ok) throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
  return body as Outcome;
}

export function CsvImport() {
  const [checked, setChecked] = useState<Checked | null>(null);
  const [problems, setProblems] = useState<string[]>([]);
  const [progress, setProgress] = useState({ sent: 0, total: 0 });
  const [fileKey, setFileKey] = useState(0);

  const importRows = useMutation({
    mutationFn: async (rows: ReadyRow[]) => {
      const outcome: Outcome = { accepted: 0, rejected: [] };
      setProgress({ sent: 0, total: rows.length });
      for (const chunk of chunkRows(rows, CHUNK_ROWS, IMPORT_MAX_ROWS)) {
        try {
          const answer = await postChunk(chunk);
          outcome.accepted += answer.accepted;
          outcome.rejected.push(...answer.rejected);
        } catch (error) {
          const message = error instanceof Error ? error.message : String(error);
          throw new Error(
            `The import stopped at row ${chunk[0].row}: ${message} ${outcome.accepted} rows sent before it are saved; the rest were not sent. Import the file again to send them (saved rows will be reported as already in the catalog).`,
          );
        }
        setProgress((p) => ({ ...p, sent: p.sent + chunk.length }));
      }
      return outcome;
    },
  });

  function reset() {
    setChecked(null);
    setProblems([]);
    setProgress({ sent: 0, total: 0 });
    importRows.reset();
    setFileKey((key) => key + 1);
  }

  function onFile(file: File | undefined) {
    setChecked(null);
    setProblems([]);
    importRows.reset();
    if (!file) return;
    if (file.size > MAX_FILE_BYTES) {
      setProblems([`The file is ${(file.size / 1024 / 1024).toFixed(1)} MB; split it into files of at most 5 MB.`]);
      return;
    }
    Papa.parse<string[]>(file, {
      skipEmptyLines: false,
      complete: (results) => {
        const outcome = checkFile(file.name, results.data, results.errors);
        if ("problems" in outcome) setProblems(outcome.problems);
        else setChecked(outcome);
      },
      error: (error) => setProblems([`The file could not be read: ${error.message}`]),
    });
  }

  const done = importRows.isSuccess ? importRows.data : null;
  const busy = importRows.isPending;

  return (
    <div className="space-y-4">
      <div className="panel space-y-3 p-4">
        <label htmlFor="csv-file" className="field-label">
          CSV file
        </label>
        <input
          key={fileKey}
          id="csv-file"
          type="file"
          accept=".csv,text/csv"
          className="field-input"
          disabled={busy}
          aria-describedby="csv-file-hint"
          onChange={(event) => onFile(event.target.files?.[0])}
        />
        <p id="csv-file-hint" className="text-sm text-[var(--ink-soft)]">
          The file is checked here first; nothing is sent until you press Import.
        </p>
        {problems.length ? (
          <div role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 text-red-900 dark:bg-red-950 dark:text-red-100">
            <p className="font-semibold">
              <span aria-hidden="true">✖ </span>This file cannot be imported:
            </p>
            <ul className="list-disc pl-6">
              {problems.map((problem) => (
                <li key={problem}>{problem}</li>
              ))}
            </ul>
          </div>
        ) : null}
      </div>

      {checked ? (
        <section aria-labelledby="check-heading" className="panel space-y-3 p-4">
          <h2 id="check-heading" className="text-xl font-semibold">
            {checked.fileName}
          </h2>
          <p>
            <span className="num">{checked.rowsRead}</span> rows read: <span className="num">{checked.ready.length}</span> ready to import,{" "}
            <span className="num">{new Set(checked.errors.map((e) => e.row)).size}</span> with problems.
          </p>
          {!done && !busy ? (
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn btn-primary" disabled={checked.ready.length === 0} onClick={() => importRows.mutate(checked.ready)}>
                Import {checked.ready.length} rows
              </button>
              <button type="button" className="btn btn-secondary" onClick={reset}>
                Choose another file
              </button>
            </div>
          ) : null}
          {progress.total > 0 ? (
            <div>
              <label htmlFor="import-progress" className="field-label">
                Import progress
              </label>
              <progress id="import-progress" max={progress.total} value={progress.sent} className="h-6 w-full accent-[var(--accent)]" />
              <p className="num" aria-live="polite">
                Sent {progress.sent} of {progress.total} rows{busy ? "…" : "."}
              </p>
            </div>
          ) : null}
          {importRows.isError ? <FormMessage message={importRows.error.message} /> : null}
          {done ? (
            <FormMessage
              ok={done.accepted > 0 || done.rejected.length + checked.errors.length === 0}
              message={`Imported ${done.accepted} of ${checked.rowsRead} rows.${done.rejected.length + checked.errors.length ? " The rows listed below were not imported: fix them in the file and import those rows again." : ""}`}
            />
          ) : null}
          <ImportReport errors={[...checked.errors, ...(done?.rejected ?? [])]} final={Boolean(done)} />
          {done ? (
            <button type="button" className="btn btn-secondary" onClick={reset}>
              Import another file
            </button>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
