"use client";

import { useActionState } from "react";
import type { PartNumberView } from "@/lib/schemas/catalog";
import { describedBy, FieldMessages, FormMessage, TextField, type FormState as CatalogFormState } from "./form-field";

type Action = (state: CatalogFormState, formData: FormData) => Promise<CatalogFormState>;

const HOURS_HINT = "H:MM (30000:00) or decimal hours (1234.5). Leave empty when there is no limit.";

/** Create or edit one part number; the server action checks it with the catalog schema. */
export function PartNumberForm({ action, current, submitLabel }: { action: Action; current?: PartNumberView; submitLabel: string }) {
  const [state, formAction, pending] = useActionState<CatalogFormState, FormData>(action, {});
  const errors = state.errors ?? {};
  const initial: Record<string, string> = state.values ?? {
    partNumber: current?.partNumber ?? "",
    cage: current?.cage ?? "",
    description: current?.description ?? "",
    ataChapter: current?.ataChapter ?? "",
    serialised: current && !current.serialised ? "" : "on",
    lifeLimitHours: current?.lifeLimitHours ?? "",
    lifeLimitCycles: current?.lifeLimitCycles?.toString() ?? "",
    lifeLimitDays: current?.lifeLimitDays?.toString() ?? "",
    overhaulHours: current?.overhaulHours ?? "",
    overhaulCycles: current?.overhaulCycles?.toString() ?? "",
  };
  const field = (name: string) => ({ name, defaultValue: initial[name], error: errors[name] });

  return (
    <form action={formAction} className="space-y-5" noValidate>
      <FormMessage message={state.message} ok={state.ok} />
      <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="mb-2 text-lg font-semibold">Identity</legend>
        <TextField {...field("partNumber")} label="Part number" mono required autoCapitalize="characters" maxLength={40} />
        <TextField
          {...field("cage")}
          label="CAGE or manufacturer code"
          hint="5 letters or digits"
          mono
          required
          autoCapitalize="characters"
          maxLength={5}
        />
        <TextField {...field("ataChapter")} label="ATA chapter" hint="Chapter-section, like 32-42" mono required inputMode="numeric" maxLength={8} />
        <TextField {...field("description")} label="Description" required maxLength={200} className="sm:col-span-2 lg:col-span-4" />
        <div className="sm:col-span-2 lg:col-span-4">
          <label className="flex min-h-touch items-center gap-3 font-semibold">
            <input
              type="checkbox"
              name="serialised"
              defaultChecked={initial.serialised === "on"}
              className="h-6 w-6"
              aria-invalid={errors.serialised ? true : undefined}
              aria-describedby={describedBy("serialised", true, Boolean(errors.serialised))}
            />
            Serialised (each unit has its own serial number)
          </label>
          <FieldMessages name="serialised" hint="A part number with a life limit or overhaul interval must be serialised." error={errors.serialised} />
        </div>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-lg font-semibold">Life limits</legend>
        <TextField {...field("lifeLimitHours")} label="Flight hours" hint={HOURS_HINT} mono inputMode="decimal" />
        <TextField {...field("lifeLimitCycles")} label="Cycles" hint="Whole number" mono inputMode="numeric" />
        <TextField {...field("lifeLimitDays")} label="Calendar days" hint="Whole number" mono inputMode="numeric" />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-lg font-semibold">Overhaul interval</legend>
        <TextField {...field("overhaulHours")} label="Overhaul flight hours" hint={HOURS_HINT} mono inputMode="decimal" />
        <TextField {...field("overhaulCycles")} label="Overhaul cycles" hint="Whole number" mono inputMode="numeric" />
      </fieldset>

      <button type="submit" className="btn btn-primary" disabled={pending}>
        {pending ? "Saving…" : submitLabel}
      </button>
    </form>
  );
}
