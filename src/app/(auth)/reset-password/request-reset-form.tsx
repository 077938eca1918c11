"use client";

import Link from "next/link";
import { useActionState } from "react";
import { requestResetAction, type RequestResetState } from "./request-reset-action";

export function RequestResetForm() {
  const [state, action, pending] = useActionState<RequestResetState, FormData>(requestResetAction, {});
  if (state.sent) {
    return (
      <div className="space-y-4">
        <p role="status" className="rounded-md border-2 border-[var(--accent)] p-3 font-semibold">
          <span aria-hidden="true" className="mr-2">
            ✉
          </span>
          {state.sent}
        </p>
        <Link href="/sign-in" className="btn btn-secondary">
          Back to sign-in
        </Link>
      </div>
    );
  }
  return (
    <form action={action} className="space-y-4" noValidate>
      {state.message ? (
        <p role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 font-semibold text-red-900">
          {state.message}
        </p>
      ) : null}
      <div>
        <label htmlFor="email" className="field-label">
          E-mail address
        </label>
        <input
          id="email"
          name="email"
          type="email"
          autoComplete="username"
          required
          defaultValue={state.email}
          className="field-input"
          aria-invalid={state.errors?.email ? true : undefined}
          aria-describedby={state.errors?.email ? "email-error" : undefined}
        />
        {state.errors?.email ? (
          <p id="email-error" className="field-error">
            {state.errors.email}
          </p>
        ) : null}
      </div>
      <button type="submit" className="btn btn-primary w-full text-lg" disabled={pending}>
        {pending ? "Sending…" : "Send me a link"}
      </button>
      <p>
        <Link href="/sign-in" className="font-semibold text-[var(--accent)] underline">
          Back to sign-in
        </Link>
      </p>
    </form>
  );
}
