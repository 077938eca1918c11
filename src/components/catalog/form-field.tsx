import type { InputHTMLAttributes, ReactNode } from "react";

/** What a server action hands back to its form. */
export interface FormState {
  message?: string;
  ok?: boolean;
  errors?: Record<string, string>;
  /** What was typed, so a refused form comes back as it was sent. */
  values?: Record<string, string>;
}

/** Ids that tie a field to its hint and its error, so a screen reader reads both with the field. */
export function describedBy(name: string, hint: boolean, error: boolean): string | undefined {
  const ids = [hint ? `${name}-hint` : null, error ? `${name}-error` : null].filter(Boolean);
  return ids.length ? ids.join(" ") : undefined;
}

export function FieldMessages({ name, hint, error }: { name: string; hint?: ReactNode; error?: string }) {
  return (
    <>
      {hint ? (
        <p id={`${name}-hint`} className="mt-1 text-sm text-[var(--ink-soft)]">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${name}-error`} className="field-error">
          <span aria-hidden="true">✖ </span>
          {error}
        </p>
      ) : null}
    </>
  );
}

interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, "name"> {
  name: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  mono?: boolean;
}

/** A labelled text input whose hint and error are linked through aria-describedby. */
export function TextField({ name, label, hint, error, mono, className, ...input }: TextFieldProps) {
  return (
    <div className={className}>
      <label htmlFor={name} className="field-label">
        {label}
      </label>
      <input
        id={name}
        name={name}
        className={`field-input ${mono ? "num" : ""}`}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(name, Boolean(hint), Boolean(error))}
        {...input}
      />
      <FieldMessages name={name} hint={hint} error={error} />
    </div>
  );
}

/** The banner above a form: what went wrong, or that it was saved. */
export function FormMessage({ message, ok }: { message?: string; ok?: boolean }) {
  if (!message) return null;
  return ok ? (
    <p role="status" className="rounded-md border-2 border-green-800 bg-green-50 p-3 font-semibold text-green-900 dark:bg-green-950 dark:text-green-100">
      <span aria-hidden="true">✔ </span>
      {message}
    </p>
  ) : (
    <p role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 font-semibold text-red-900 dark:bg-red-950 dark:text-red-100">
      <span aria-hidden="true">✖ </span>
      {message}
    </p>
  );
}
