"use client";

import { useState } from "react";
import type { RatesParams } from "./queries";

/** Subject (a part number or an ATA chapter), period and k; applied together on "Show rates". */
export function RatesForm({
  value,
  errors,
  partNumbers,
  chapters,
  onApply,
}: {
  value: RatesParams;
  errors: Record<string, string>;
  partNumbers: string[];
  chapters: string[];
  onApply: (params: RatesParams) => void;
}) {
  const [mode, setMode] = useState<"partNumber" | "ataChapter">(value.ataChapter ? "ataChapter" : "partNumber");
  const [draft, setDraft] = useState<RatesParams>(value);
  const set = (key: keyof RatesParams) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setDraft((current) => ({ ...current, [key]: event.target.value }));
  const field = (key: string) => (errors[key] ? { "aria-invalid": true as const, "aria-describedby": `rates-${key}-error` } : {});
  const error = (key: string) =>
    errors[key] ? (
      <p id={`rates-${key}-error`} className="field-error">
        {errors[key]}
      </p>
    ) : null;

  return (
    <form
      aria-label="Choose what to analyse"
      className="panel grid gap-3 p-3 md:grid-cols-2 xl:grid-cols-[auto_minmax(14rem,1fr)_auto_auto_auto_auto]"
      onSubmit={(event) => {
        event.preventDefault();
        const subject = mode === "partNumber" ? { partNumber: draft.partNumber?.trim().toUpperCase() || undefined } : { ataChapter: draft.ataChapter || undefined };
        onApply({ ...subject, from: draft.from || undefined, to: draft.to || undefined, k: draft.k || undefined });
      }}
    >
      <fieldset>
        <legend className="field-label">Analyse</legend>
        <div className="flex gap-3">
          <label className="inline-flex min-h-touch items-center gap-2">
            <input type="radio" name="rates-mode" className="h-5 w-5 shrink-0" checked={mode === "partNumber"} onChange={() => setMode("partNumber")} />
            Part number
          </label>
          <label className="inline-flex min-h-touch items-center gap-2">
            <input type="radio" name="rates-mode" className="h-5 w-5 shrink-0" checked={mode === "ataChapter"} onChange={() => setMode("ataChapter")} />
            ATA chapter
          </label>
        </div>
      </fieldset>
      {mode === "partNumber" ? (
        <div>
          <label htmlFor="rates-part-number" className="field-label">
            Part number (with its alternates)
          </label>
          <input id="rates-part-number" list="rates-part-numbers" className="field-input num uppercase" value={draft.partNumber ?? ""} onChange={set("partNumber")} autoComplete="off" maxLength={40} {...field("partNumber")} />
          <datalist id="rates-part-numbers">
            {partNumbers.map((pn) => (
              <option key={pn} value={pn} />
            ))}
          </datalist>
          {error("partNumber")}
        </div>
      ) : (
        <div>
          <label htmlFor="rates-ata" className="field-label">
            ATA chapter (by position)
          </label>
          <select id="rates-ata" className="field-input num" value={draft.ataChapter ?? ""} onChange={set("ataChapter")} {...field("ataChapter")}>
            <option value="">Choose a chapter</option>
            {chapters.map((chapter) => (
              <option key={chapter} value={chapter}>
                {chapter}
              </option>
            ))}
          </select>
          {error("ataChapter")}
        </div>
      )}
      <div>
        <label htmlFor="rates-from" className="field-label">
          From
        </label>
        <input id="rates-from" type="date" className="field-input num" value={draft.from ?? ""} onChange={set("from")} {...field("from")} />
        {error("from")}
      </div>
      <div>
        <label htmlFor="rates-to" className="field-label">
          To (inclusive)
        </label>
        <input id="rates-to" type="date" className="field-input num" value={draft.to ?? ""} onChange={set("to")} {...field("to")} />
        {error("to")}
      </div>
      <div>
        <label htmlFor="rates-k" className="field-label">
          k (SDs)
        </label>
        <input id="rates-k" type="number" inputMode="decimal" min={0.5} max={6} step={0.5} className="field-input num w-24" value={draft.k ?? ""} placeholder="2" onChange={set("k")} {...field("k")} />
        {error("k")}
      </div>
      <div className="flex items-end">
        <button type="submit" className="btn btn-primary w-full">
          Show rates
        </button>
      </div>
      <p className="text-sm md:col-span-2 xl:col-span-6">
        Empty dates give the last 12 closed months. Each month is compared with mean + k standard deviations of the 12 months before it; k = 2 unless your programme says otherwise.
      </p>
    </form>
  );
}
