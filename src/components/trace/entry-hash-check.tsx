"use client";

import { useQuery } from "@tanstack/react-query";
import { useId, useState, type FormEvent } from "react";
import { ledgerEntryQuery } from "@/lib/queries/ledger";

/** Compares a seq and hash from a printed trace report with what the ledger holds now. */
export function EntryHashCheck() {
  const [asked, setAsked] = useState<{ seq: number; hash: string } | null>(null);
  const [errors, setErrors] = useState<{ seq?: string; hash?: string }>({});
  const ids = useId();
  const { data, error, isFetching } = useQuery({ ...ledgerEntryQuery(asked?.seq ?? 0), enabled: asked !== null });

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const seq = Number(String(form.get("seq") ?? "").trim());
    const hash = String(form.get("hash") ?? "").trim().toLowerCase();
    const problems: typeof errors = {};
    if (!Number.isSafeInteger(seq) || seq <= 0) problems.seq = "Give the entry's seq, a whole number.";
    if (!/^[0-9a-f]{64}$/.test(hash)) problems.hash = "Give the 64-character hash as printed.";
    setErrors(problems);
    setAsked(Object.keys(problems).length ? null : { seq, hash });
  }

  const matches = data && asked ? data.entry.hash === asked.hash : null;
  return (
    <section aria-labelledby={`${ids}-heading`} className="panel space-y-3 p-4">
      <h2 id={`${ids}-heading`} className="text-lg font-semibold">
        Check a printed entry
      </h2>
      <p>Type a seq and hash from a printed trace report. With the chain intact, a match vouches for that entry and every one before it.</p>
      <form onSubmit={submit} className="flex flex-wrap items-start gap-3" noValidate>
        <div className="w-full sm:w-40">
          <label htmlFor={`${ids}-seq`} className="field-label">
            Seq
          </label>
          <input id={`${ids}-seq`} name="seq" inputMode="numeric" className="field-input num" aria-invalid={errors.seq ? true : undefined} aria-describedby={errors.seq ? `${ids}-seq-error` : undefined} />
          {errors.seq ? (
            <p id={`${ids}-seq-error`} className="field-error">
              {errors.seq}
            </p>
          ) : null}
        </div>
        <div className="w-full flex-1 sm:min-w-96">
          <label htmlFor={`${ids}-hash`} className="field-label">
            Hash (SHA-256)
          </label>
          <input id={`${ids}-hash`} name="hash" className="field-input num" spellCheck={false} autoComplete="off" aria-invalid={errors.hash ? true : undefined} aria-describedby={errors.hash ? `${ids}-hash-error` : undefined} />
          {errors.hash ? (
            <p id={`${ids}-hash-error`} className="field-error">
              {errors.hash}
            </p>
          ) : null}
        </div>
        <div className="w-full sm:w-auto sm:pt-7">
          <button type="submit" className="btn btn-secondary w-full">
            Compare
          </button>
        </div>
      </form>
      <div aria-live="polite">
        {isFetching ? <p role="status">Reading the entry…</p> : null}
        {error ? (
          <p role="alert" className="field-error">
            {error.message}
          </p>
        ) : null}
        {matches === true ? (
          <p className="flex items-center gap-2 font-bold text-emerald-900 dark:text-emerald-100">
            <span aria-hidden="true">✓</span> Seq <span className="num">{data!.entry.seq}</span> ({data!.entry.kind.replace(/_/g, " ")}) still has this hash.
          </p>
        ) : null}
        {matches === false ? (
          <div className="space-y-1 font-bold text-red-900 dark:text-red-100">
            <p className="flex items-center gap-2">
              <span aria-hidden="true">✕</span> Seq <span className="num">{data!.entry.seq}</span> does not have this hash. The ledger holds:
            </p>
            <p className="num break-all">{data!.entry.hash}</p>
          </div>
        ) : null}
      </div>
    </section>
  );
}
