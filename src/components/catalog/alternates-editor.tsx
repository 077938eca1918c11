"use client";

import { useActionState, useEffect, useState } from "react";
import type { AlternateView, PartNumberView } from "@/lib/schemas/catalog";
import { describedBy, FieldMessages, FormMessage, type FormState } from "./form-field";
import { PartNumberPicker } from "./part-number-picker";

interface Link {
  other: AlternateView;
  relation: string;
}

/** One line per linked part number, worded from this part number's side. */
function linksOf(partNumber: PartNumberView): Link[] {
  const links: Link[] = partNumber.alternates.map((other) => ({
    other,
    relation:
      other.direction === "two-way"
        ? "Two-way: either may replace the other"
        : `One-way: ${other.partNumber} may replace ${partNumber.partNumber}, not the reverse`,
  }));
  for (const other of partNumber.replaces) {
    if (other.direction === "one-way") {
      links.push({ other, relation: `One-way: ${partNumber.partNumber} may replace ${other.partNumber}, not the reverse` });
    }
  }
  return links.sort((a, b) => a.other.partNumber.localeCompare(b.other.partNumber));
}

export function AlternatesEditor({
  partNumber,
  setAction,
  removeAction,
}: {
  partNumber: PartNumberView;
  setAction: (state: FormState, formData: FormData) => Promise<FormState>;
  removeAction: (id: number, otherId: number) => Promise<void>;
}) {
  const [state, formAction, pending] = useActionState<FormState, FormData>(setAction, {});
  const [picked, setPicked] = useState<PartNumberView | null>(null);
  useEffect(() => {
    if (state.ok) setPicked(null);
  }, [state]);
  const links = linksOf(partNumber);
  const errors = state.errors ?? {};
  const alternateError = errors.alternate ?? errors["alternate.0.partNumber"];

  return (
    <section aria-labelledby="alternates-heading" className="space-y-4">
      <h2 id="alternates-heading" className="text-xl font-semibold">
        Alternates <span className="num text-base font-normal">({links.length})</span>
      </h2>
      {links.length === 0 ? (
        <p>No alternates: only {partNumber.partNumber} itself may be fitted where it is called for.</p>
      ) : (
        <table className="w-full border-collapse text-left">
          <thead>
            <tr className="border-b-2 border-[var(--ink-soft)]">
              <th scope="col" className="py-2 pr-3">Part number</th>
              <th scope="col" className="py-2 pr-3">Description</th>
              <th scope="col" className="py-2 pr-3">Interchangeability</th>
              <th scope="col" className="py-2"><span className="sr-only">Remove</span></th>
            </tr>
          </thead>
          <tbody>
            {links.map(({ other, relation }) => (
              <tr key={other.id} className="border-b border-[var(--rule)]">
                <td className="py-2 pr-3">
                  <a href={`/catalog/${other.id}`} className="num font-semibold underline">
                    {other.partNumber}
                  </a>{" "}
                  <span className="num text-sm">{other.cage}</span>
                </td>
                <td className="py-2 pr-3">{other.description}</td>
                <td className="py-2 pr-3">
                  <span aria-hidden="true">{other.direction === "two-way" ? "⇄ " : "→ "}</span>
                  {relation}
                </td>
                <td className="py-2 text-right">
                  <form action={removeAction.bind(null, partNumber.id, other.id)}>
                    <button type="submit" className="btn btn-secondary" aria-label={`Remove the link with ${other.partNumber}`}>
                      Remove
                    </button>
                  </form>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}

      <form action={formAction} className="panel space-y-4 p-4" noValidate aria-labelledby="add-alternate-heading">
        <h3 id="add-alternate-heading" className="text-lg font-semibold">
          Add or change an alternate
        </h3>
        <FormMessage message={state.message} ok={state.ok} />
        <input type="hidden" name="alternatePartNumber" value={picked?.partNumber ?? ""} />
        <input type="hidden" name="alternateCage" value={picked?.cage ?? ""} />
        {picked ? (
          <p className="flex flex-wrap items-center gap-3">
            <span>
              Alternate: <span className="num font-semibold">{picked.partNumber}</span> <span className="num">{picked.cage}</span> · {picked.description}
            </span>
            <button type="button" className="btn btn-secondary" onClick={() => setPicked(null)}>
              Pick another
            </button>
          </p>
        ) : (
          <PartNumberPicker
            label="Find the alternate part number"
            onPick={setPicked}
            excludeIds={[partNumber.id]}
            describedBy={alternateError ? "alternate-error" : undefined}
            invalid={Boolean(alternateError)}
          />
        )}
        <FieldMessages name="alternate" error={alternateError} />
        <fieldset aria-describedby={describedBy("relation", true, Boolean(errors.relation))}>
          <legend className="field-label">How may they replace each other?</legend>
          {[
            ["replaces-this", `The alternate may replace ${partNumber.partNumber} (one-way)`],
            ["this-replaces", `${partNumber.partNumber} may replace the alternate (one-way)`],
            ["two-way", "Either may replace the other (two-way)"],
          ].map(([value, text]) => (
            <label key={value} className="flex min-h-touch items-center gap-3">
              <input type="radio" name="relation" value={value} defaultChecked={value === "replaces-this"} className="h-5 w-5" />
              {text}
            </label>
          ))}
          <FieldMessages name="relation" hint="Saving replaces any earlier link between the two part numbers." error={errors.relation} />
        </fieldset>
        <button type="submit" className="btn btn-primary" disabled={pending || !picked}>
          {pending ? "Saving…" : "Save alternate"}
        </button>
      </form>
    </section>
  );
}
