"use client";

import { useState } from "react";
import type { RemovalFilterValues } from "@/lib/schemas/reliability";

export interface FilterOptions {
  aircraft: string[];
  types: Array<{ code: string; name: string }>;
  stations: Array<{ code: string; name: string }>;
  chapters: string[];
}

const FIELDS = ["from", "to", "partNumber", "ataChapter", "registration", "aircraftType", "station", "removalType"] as const;

/**
 * The filters as a plain form: nothing applies until "Apply", so a half-typed part number never
 * starts a query. Field errors from the server are shown under the field they name.
 */
export function RemovalFilters({
  value,
  options,
  errors,
  onApply,
}: {
  value: RemovalFilterValues;
  options: FilterOptions;
  errors: Record<string, string>;
  onApply: (filters: RemovalFilterValues) => void;
}) {
  const [draft, setDraft] = useState<RemovalFilterValues>(value);
  const set = (key: keyof RemovalFilterValues) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setDraft((current) => ({ ...current, [key]: event.target.value || undefined }));
  const described = (key: string) => (errors[key] ? { "aria-describedby": `removals-${key}-error`, "aria-invalid": true as const } : {});
  const error = (key: string) =>
    errors[key] ? (
      <p id={`removals-${key}-error`} className="field-error">
        {errors[key]}
      </p>
    ) : null;

  return (
    <form
      role="search"
      aria-label="Filter removals"
      className="panel grid gap-3 p-3 sm:grid-cols-2 lg:grid-cols-4"
      onSubmit={(event) => {
        event.preventDefault();
        const clean = Object.fromEntries(FIELDS.filter((f) => draft[f]).map((f) => [f, draft[f]!.trim()])) as RemovalFilterValues;
        onApply(clean);
      }}
    >
      <div>
        <label htmlFor="removals-from" className="field-label">
          From
        </label>
        <input id="removals-from" type="date" className="field-input num" value={draft.from ?? ""} onChange={set("from")} {...described("from")} />
        {error("from")}
      </div>
      <div>
        <label htmlFor="removals-to" className="field-label">
          To (inclusive)
        </label>
        <input id="removals-to" type="date" className="field-input num" value={draft.to ?? ""} onChange={set("to")} {...described("to")} />
        {error("to")}
      </div>
      <div>
        <label htmlFor="removals-pn" className="field-label">
          Part number
        </label>
        <input id="removals-pn" type="search" className="field-input num uppercase" value={draft.partNumber ?? ""} onChange={set("partNumber")} maxLength={40} autoComplete="off" {...described("partNumber")} />
        {error("partNumber")}
      </div>
      <div>
        <label htmlFor="removals-ata" className="field-label">
          ATA chapter
        </label>
        <select id="removals-ata" className="field-input num" value={draft.ataChapter ?? ""} onChange={set("ataChapter")} {...described("ataChapter")}>
          <option value="">Any chapter</option>
          {[...new Set(options.chapters.map((c) => c.slice(0, 2)))].map((chapter) => (
            <optgroup key={chapter} label={`Chapter ${chapter}`}>
              <option value={chapter}>{chapter} (whole chapter)</option>
              {options.chapters
                .filter((c) => c.startsWith(`${chapter}-`))
                .map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
            </optgroup>
          ))}
        </select>
        {error("ataChapter")}
      </div>
      <div>
        <label htmlFor="removals-registration" className="field-label">
          Aircraft
        </label>
        <select id="removals-registration" className="field-input num" value={draft.registration ?? ""} onChange={set("registration")} {...described("registration")}>
          <option value="">Any aircraft</option>
          {options.aircraft.map((registration) => (
            <option key={registration} value={registration}>
              {registration}
            </option>
          ))}
        </select>
        {error("registration")}
      </div>
      <div>
        <label htmlFor="removals-type" className="field-label">
          Aircraft type
        </label>
        <select id="removals-type" className="field-input" value={draft.aircraftType ?? ""} onChange={set("aircraftType")}>
          <option value="">Any type</option>
          {options.types.map((type) => (
            <option key={type.code} value={type.code}>
              {type.code} — {type.name}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="removals-station" className="field-label">
          Home station
        </label>
        <select id="removals-station" className="field-input" value={draft.station ?? ""} onChange={set("station")}>
          <option value="">Any station</option>
          {options.stations.map((station) => (
            <option key={station.code} value={station.code}>
              {station.code} — {station.name}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="removals-removal-type" className="field-label">
          Removal type
        </label>
        <select id="removals-removal-type" className="field-input" value={draft.removalType ?? ""} onChange={set("removalType")} {...described("removalType")}>
          <option value="">Both types</option>
          <option value="unscheduled">Unscheduled</option>
          <option value="scheduled">Scheduled</option>
        </select>
        {error("removalType")}
      </div>
      <div className="flex flex-wrap items-end gap-2 sm:col-span-2 lg:col-span-4">
        <button type="submit" className="btn btn-primary">
          Apply filters
        </button>
        <button
          type="button"
          className="btn btn-secondary"
          onClick={() => {
            setDraft({});
            onApply({});
          }}
        >
          Clear
        </button>
      </div>
    </form>
  );
}
