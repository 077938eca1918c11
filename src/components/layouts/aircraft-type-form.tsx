"use client";

import { useActionState } from "react";
import { FormMessage, TextField, type FormState } from "@/components/catalog/form-field";

/** Adds an aircraft type with an empty layout; its positions are added on its page. */
export function AircraftTypeForm({ action }: { action: (state: FormState, formData: FormData) => Promise<FormState> }) {
  const [state, formAction, pending] = useActionState<FormState, FormData>(action, {});
  const errors = state.errors ?? {};
  return (
    <form action={formAction} className="panel space-y-3 p-4" noValidate aria-labelledby="new-type-heading">
      <h2 id="new-type-heading" className="text-lg font-semibold">
        Add an aircraft type
      </h2>
      <FormMessage message={state.message} ok={state.ok} />
      <div className="grid gap-3 sm:grid-cols-[12rem_1fr]">
        <TextField name="code" label="Type code" hint="Like QL-72" mono required maxLength={16} defaultValue={state.values?.code} error={errors.code} />
        <TextField name="name" label="Name" required maxLength={120} defaultValue={state.values?.name} error={errors.name} />
      </div>
      <button type="submit" className="btn btn-primary" disabled={pending}>
        {pending ? "Adding…" : "Add type"}
      </button>
    </form>
  );
}
