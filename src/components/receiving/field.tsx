import type { ReactNode } from "react";

// One labelled form field with its error linked through aria-describedby; shared by receiving and the stock dialogs.
export function Field(props: {
  id: string;
  label: string;
  error?: string;
  hint?: ReactNode;
  children: (aria: { id: string; "aria-invalid"?: true; "aria-describedby"?: string }) => ReactNode;
  className?: string;
}) {
  const describedBy = [props.hint ? `${props.id}-hint` : null, props.error ? `${props.id}-error` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className={props.className}>
      <label htmlFor={props.id} className="field-label">
        {props.label}
      </label>
      {props.children({ id: props.id, "aria-invalid": props.error ? true : undefined, "aria-describedby": describedBy })}
      {props.hint ? (
        <p id={`${props.id}-hint`} className="mt-1 text-sm text-[var(--ink-soft)]">
          {props.hint}
        </p>
      ) : null}
      {props.error ? (
        <p id={`${props.id}-error`} className="field-error">
          {props.error}
        </p>
      ) : null}
    </div>
  );
}

/** The contract's error body, as the browser receives it. */
export interface ApiError {
  status: number;
  code: string;
  message: string;
  fields: Record<string, string>;
}

export function toApiError(status: number, body: unknown): ApiError {
  const error = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
  return {
    status,
    code: error?.code ?? "unknown",
    message: error?.message ?? (status === 0 ? "The server could not be reached. Check the connection and try again." : `The server answered ${status}.`),
    fields: error?.fields ?? {},
  };
}
