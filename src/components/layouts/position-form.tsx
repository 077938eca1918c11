"use client";

import { useActionState, useState } from "react";
import { describedBy, FieldMessages, FormMessage, TextField, type FormState } from "@/components/catalog/form-field";
import { PartNumberPicker } from "@/components/catalog/part-number-picker";
import type { EligibleView, PositionView } from "@/lib/schemas/layouts";
import { PositionPreview, type MapPoint } from "./position-preview";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** The first error whose key is the field or sits under it (cautions.2, eligible.0.partNumber). */
const errorFor = (errors: Record<string, string>, name: string) =>
  errors[name] ?? Object.entries(errors).find(([key]) => key.startsWith(`${name}.`))?.[1];

export function PositionForm({
  action,
  typeCode,
  current,
  others,
  zones,
  submitLabel,
}: {
  action: Action;
  typeCode: string;
  current?: PositionView;
  /** The type's other positions: parents to choose from and dots for the preview. */
  others: Array<MapPoint & { label: string }>;
  zones: string[];
  submitLabel: string;
}) {
  const [state, formAction, pending] = useActionState<FormState, FormData>(action, {});
  const errors = state.errors ?? {};
  const initial: Record<string, string> = state.values ?? {
    code: current?.code ?? "",
    label: current?.label ?? "",
    parentCode: current?.parentCode ?? "",
    ataChapter: current?.ataChapter ?? "",
    zone: current?.zone ?? "",
    cautions: current?.cautions.join("\n") ?? "",
    requiresIndependentInspection: current?.requiresIndependentInspection ? "on" : "",
  };
  const [code, setCode] = useState(current?.code ?? "");
  const [x, setX] = useState(current ? String(current.x) : "500");
  const [y, setY] = useState(current ? String(current.y) : "300");
  const [parentCode, setParentCode] = useState(current?.parentCode ?? "");
  const [eligible, setEligible] = useState<EligibleView[]>(current?.eligible ?? []);
  const parent = others.find((p) => p.code === parentCode);
  const eligibleError = errorFor(errors, "eligible");

  return (
    <form action={formAction} className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]" noValidate>
      <div className="space-y-4">
        <FormMessage message={state.message} ok={state.ok} />
        <div className="grid gap-4 sm:grid-cols-2">
          {current ? (
            <div>
              <p className="field-label">Position code</p>
              <p className="num min-h-touch py-2 text-lg font-semibold">{current.code}</p>
            </div>
          ) : (
            <TextField
              name="code"
              label="Position code"
              hint="Letters, digits and '-', like B1-EBA2. It cannot be changed later."
              mono
              required
              maxLength={32}
              autoCapitalize="characters"
              defaultValue={initial.code}
              error={errors.code}
              onChange={(event) => setCode(event.target.value.toUpperCase())}
            />
          )}
          <TextField name="ataChapter" label="ATA chapter" hint="Chapter-section, like 32-42" mono required defaultValue={initial.ataChapter} error={errors.ataChapter} />
          <TextField name="label" label="Label" required maxLength={160} defaultValue={initial.label} error={errors.label} className="sm:col-span-2" />
          <div>
            <label htmlFor="parentCode" className="field-label">
              Parent position
            </label>
            {/* Uncontrolled, so the reset React does after an action restores the saved parent, not the first option. */}
            <select
              key={initial.parentCode}
              id="parentCode"
              name="parentCode"
              defaultValue={initial.parentCode}
              onChange={(event) => setParentCode(event.target.value)}
              className="field-input"
              aria-invalid={errors.parentCode ? true : undefined}
              aria-describedby={describedBy("parentCode", false, Boolean(errors.parentCode))}
            >
              <option value="">None (top level)</option>
              {others.map((p) => (
                <option key={p.code} value={p.code}>
                  {p.code} · {p.label}
                </option>
              ))}
            </select>
            <FieldMessages name="parentCode" error={errors.parentCode} />
          </div>
          <TextField name="zone" label="Zone" list="zones" maxLength={16} defaultValue={initial.zone} error={errors.zone} hint="Like MLG-L or LEFT WING" />
          <datalist id="zones">
            {zones.map((zone) => (
              <option key={zone} value={zone} />
            ))}
          </datalist>
          <TextField
            name="x"
            label="Map x"
            hint="0 at the nose to 1000 at the tail"
            type="number"
            inputMode="decimal"
            step="0.01"
            min={0}
            max={1000}
            mono
            value={x}
            onChange={(event) => setX(event.target.value)}
            error={errors.x}
          />
          <TextField
            name="y"
            label="Map y"
            hint="0 (left) to 600 (right); 300 is the centreline"
            type="number"
            inputMode="decimal"
            step="0.01"
            min={0}
            max={600}
            mono
            value={y}
            onChange={(event) => setY(event.target.value)}
            error={errors.y}
          />
        </div>

        <div>
          <label htmlFor="cautions" className="field-label">
            Cautions shown before work
          </label>
          <textarea
            id="cautions"
            name="cautions"
            rows={5}
            defaultValue={initial.cautions}
            className="field-input"
            aria-invalid={errorFor(errors, "cautions") ? true : undefined}
            aria-describedby={describedBy("cautions", true, Boolean(errorFor(errors, "cautions")))}
          />
          <FieldMessages name="cautions" hint="One caution per line. They are reminders; the maintenance manual governs the work." error={errorFor(errors, "cautions")} />
        </div>

        <label className="flex min-h-touch items-center gap-3 font-semibold">
          <input type="checkbox" name="requiresIndependentInspection" defaultChecked={initial.requiresIndependentInspection === "on"} className="h-6 w-6" />
          An independent inspection is required after work here
        </label>

        <fieldset className="space-y-2" aria-describedby={describedBy("eligible", false, Boolean(eligibleError))}>
          <legend className="field-label">Eligible part numbers ({eligible.length})</legend>
          <input type="hidden" name="eligible" value={JSON.stringify(eligible.map(({ partNumber, cage }) => ({ partNumber, cage })))} />
          {eligible.length === 0 ? <p>None yet: no unit can be fitted here until a part number is added.</p> : null}
          <ul className="flex flex-wrap gap-2">
            {eligible.map((p) => (
              <li key={p.id} className="flex items-center gap-2 rounded-md border-2 border-[var(--ink-soft)] py-1 pl-3 pr-1">
                <span className="num whitespace-nowrap font-semibold">{p.partNumber}</span>
                <span className="text-sm">{p.description}</span>
                <button
                  type="button"
                  className="btn btn-secondary min-h-touch px-2"
                  aria-label={`Remove ${p.partNumber} from the eligible part numbers`}
                  onClick={() => setEligible((list) => list.filter((item) => item.id !== p.id))}
                >
                  ✕
                </button>
              </li>
            ))}
          </ul>
          <PartNumberPicker
            label="Add an eligible part number"
            excludeIds={eligible.map((p) => p.id)}
            onPick={(p) => setEligible((list) => [...list, { id: p.id, partNumber: p.partNumber, cage: p.cage, description: p.description }])}
          />
          <FieldMessages name="eligible" error={eligibleError} />
        </fieldset>

        <button type="submit" className="btn btn-primary" disabled={pending}>
          {pending ? "Saving…" : submitLabel}
        </button>
      </div>

      <div className="space-y-2 lg:sticky lg:top-4 lg:self-start">
        <h2 className="text-lg font-semibold">Where it sits on the {typeCode} map</h2>
        <PositionPreview
          title={`Preview: ${code || "the new position"} at x ${x}, y ${y}${parent ? `, under ${parent.code}` : ""}`}
          points={others}
          current={{ code, x: Number(x === "" ? NaN : x), y: Number(y === "" ? NaN : y) }}
          parent={parent}
        />
        <p className="text-sm">
          <span aria-hidden="true">● </span>this position · <span aria-hidden="true">□ </span>its parent · small dots: the type&apos;s other positions
        </p>
      </div>
    </form>
  );
}
