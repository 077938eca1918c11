"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Field, toApiError, type ApiError } from "@/components/receiving/field";
import { uploadWithProgress } from "@/components/receiving/upload-with-progress";
import { MOVEMENT_LABELS, type MovementKind } from "@/lib/schemas/stock";
import { MOVEMENT_FIELDS, type MovementField } from "./movement-fields";

export interface MovementTarget {
  id: number;
  partNumber: string;
  serialNumber: string;
  bin: string | null;
}

interface MovementAnswer {
  part: { status: string; bin: string | null };
}

const SCRAP_CAUTION =
  "Make the unit unusable so it cannot re-enter service (for example by cutting through a critical feature), as the manufacturer's instructions and local regulations require. Take care with stored energy, springs and sharp edges while doing so.";

async function postJson(partId: number, body: Record<string, unknown>): Promise<MovementAnswer> {
  const response = await fetch(`/api/parts/${partId}/movements`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  const answer = await response.json().catch(() => null);
  if (!response.ok) throw toApiError(response.status, answer);
  return answer;
}

/** A modal form for one movement of one unit; the kinds offered are those the server would accept. */
export function MovementDialog({ unit, kinds, onClose, onDone }: { unit: MovementTarget; kinds: MovementKind[]; onClose: () => void; onDone: (message: string) => void }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const router = useRouter();
  const [kind, setKind] = useState<MovementKind | null>(kinds.length === 1 ? kinds[0] : null);
  const [values, setValues] = useState<Record<string, string>>({});
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState(0);
  const [error, setError] = useState<ApiError | null>(null);

  useEffect(() => {
    const element = dialog.current;
    element?.showModal();
    return () => element?.close();
  }, []);

  const save = useMutation<MovementAnswer, ApiError, MovementKind>({
    mutationFn: (chosen) => {
      if (chosen === "repaired") {
        const body = new FormData();
        body.append("kind", chosen);
        for (const [name, value] of Object.entries(values)) if (value.trim() !== "") body.append(name, value.trim());
        if (file) body.append("certificate", file);
        return uploadWithProgress<MovementAnswer>(`/api/parts/${unit.id}/movements`, body, setProgress);
      }
      const body: Record<string, unknown> = { kind: chosen };
      for (const field of MOVEMENT_FIELDS[chosen]) {
        const value = values[field.name] ?? "";
        if (field.type === "checkbox") body[field.name] = value === "true";
        else if (value.trim() !== "") body[field.name] = value.trim();
      }
      return postJson(unit.id, body);
    },
    onSuccess: (answer, chosen) => {
      onDone(`${MOVEMENT_LABELS[chosen]}: recorded. S/N ${unit.serialNumber} is now ${answer.part.status.replace("_", " ")}${answer.part.bin ? ` in bin ${answer.part.bin}` : ""}.`);
      router.refresh();
    },
    onError: (failure) => setError(failure),
  });

  const set = (name: string, value: string) => setValues((current) => ({ ...current, [name]: value }));
  const fieldId = (name: string) => `movement-${unit.id}-${name}`;

  function control(field: MovementField, aria: { id: string; "aria-invalid"?: true; "aria-describedby"?: string }) {
    const common = { ...aria, name: field.name, className: `field-input${field.mono ? " num" : ""}` };
    switch (field.type) {
      case "textarea":
        return <textarea {...common} rows={2} value={values[field.name] ?? ""} onChange={(e) => set(field.name, e.target.value)} />;
      case "select":
        return (
          <select {...common} value={values[field.name] ?? ""} onChange={(e) => set(field.name, e.target.value)}>
            <option value="">Choose…</option>
            {field.options!.map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        );
      case "date":
        return <input {...common} type="date" value={values[field.name] ?? ""} onChange={(e) => set(field.name, e.target.value)} />;
      case "file":
        return <input {...common} type="file" className="field-input py-2" accept="application/pdf,image/jpeg,image/png,.pdf,.jpg,.jpeg,.png" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />;
      default:
        return <input {...common} autoComplete="off" value={values[field.name] ?? ""} onChange={(e) => set(field.name, e.target.value)} />;
    }
  }

  function renderField(field: MovementField) {
    if (field.when && values[field.when.field] !== field.when.value) return null;
    const message = error?.fields[field.name];
    if (field.type === "checkbox") {
      return (
        <label key={field.name} className="flex min-h-touch cursor-pointer items-center gap-3">
          <input type="checkbox" className="h-6 w-6" checked={values[field.name] === "true"} onChange={(e) => set(field.name, e.target.checked ? "true" : "")} aria-describedby={field.hint ? `${fieldId(field.name)}-hint` : undefined} />
          <span className="font-semibold">{field.label}</span>
          {field.hint ? <span id={`${fieldId(field.name)}-hint`} className="text-sm">({field.hint})</span> : null}
        </label>
      );
    }
    if (field.type === "yesno") {
      return (
        <fieldset key={field.name} aria-describedby={message ? `${fieldId(field.name)}-error` : undefined}>
          <legend className="field-label">{field.label}</legend>
          <div className="flex flex-wrap gap-3">
            {[
              ["true", "Yes"],
              ["false", "No: quarantine it"],
            ].map(([value, label]) => (
              <label key={value} className="flex min-h-touch cursor-pointer items-center gap-2 rounded-md border-2 border-[var(--ink-soft)] px-3">
                <input type="radio" className="h-5 w-5" name={fieldId(field.name)} checked={values[field.name] === value} onChange={() => set(field.name, value)} />
                {label}
              </label>
            ))}
          </div>
          {message ? (
            <p id={`${fieldId(field.name)}-error`} className="field-error">
              {message}
            </p>
          ) : null}
        </fieldset>
      );
    }
    return (
      <Field key={field.name} id={fieldId(field.name)} label={field.label} error={message} hint={field.hint}>
        {(aria) => control(field, aria)}
      </Field>
    );
  }

  return (
    <dialog ref={dialog} onCancel={onClose} className="panel m-auto w-[min(40rem,calc(100vw-1.5rem))] p-0 text-[var(--ink)] backdrop:bg-black/60" aria-labelledby={`movement-${unit.id}-title`}>
      <div className="max-h-[85dvh] space-y-4 overflow-y-auto p-4">
        <h2 id={`movement-${unit.id}-title`} className="text-xl font-bold">
          {kind ? MOVEMENT_LABELS[kind] : "Record a movement"}: <span className="num">{unit.partNumber}</span> S/N <span className="num">{unit.serialNumber}</span>
        </h2>
        {!kind ? (
          <div className="grid gap-2 sm:grid-cols-2">
            {kinds.map((choice) => (
              <button key={choice} type="button" className="btn btn-secondary justify-start" onClick={() => setKind(choice)}>
                {MOVEMENT_LABELS[choice]}
              </button>
            ))}
          </div>
        ) : (
          <form
            noValidate
            className="space-y-3"
            onSubmit={(event) => {
              event.preventDefault();
              setError(null);
              save.mutate(kind);
            }}
          >
            {error ? (
              <p role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 font-semibold text-red-950 dark:bg-red-950 dark:text-red-50">
                {error.message}
              </p>
            ) : null}
            {kind === "scrapped" ? (
              <div role="note" className="rounded-md border-l-8 border-amber-600 bg-amber-50 p-3 text-amber-950 dark:bg-amber-950 dark:text-amber-50">
                <p className="font-bold">Caution</p>
                <p>{SCRAP_CAUTION}</p>
              </div>
            ) : null}
            {MOVEMENT_FIELDS[kind].map(renderField)}
            {save.isPending && kind === "repaired" ? (
              <div>
                <label htmlFor={fieldId("progress")} className="field-label">
                  Uploading the certificate: <span className="num">{Math.round(progress * 100)}%</span>
                </label>
                <progress id={fieldId("progress")} max={1} value={progress} className="h-4 w-full" />
              </div>
            ) : null}
            <div className="flex flex-wrap gap-3 pt-2">
              <button type="submit" className="btn btn-primary" disabled={save.isPending}>
                {save.isPending ? "Recording…" : "Record"}
              </button>
              {kinds.length > 1 ? (
                <button type="button" className="btn btn-secondary" onClick={() => (setKind(null), setError(null))}>
                  Another movement
                </button>
              ) : null}
              <button type="button" className="btn btn-secondary" onClick={onClose}>
                Cancel
              </button>
            </div>
          </form>
        )}
        {!kind ? (
          <button type="button" className="btn btn-secondary" onClick={onClose}>
            Cancel
          </button>
        ) : null}
      </div>
    </dialog>
  );
}
