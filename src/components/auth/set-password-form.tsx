"use client";

import { useActionState } from "react";
import { MIN_PASSWORD_LENGTH } from "@/domain/password-rules";
import type { SetPasswordState } from "@/lib/schemas/people";

/** Choosing a password from a mailed link: the new password twice, with the rules stated up front. */
export function SetPasswordForm({
  action: serverAction,
  email,
  submitLabel,
}: {
  action: (state: SetPasswordState, formData: FormData) => Promise<SetPasswordState>;
  email: string;
  submitLabel: string;
}) {
  const [state, action, pending] = useActionState<SetPasswordState, FormData>(serverAction, {});
  const describe = (field: "password" | "confirm") =>
    [field === "password" ? "password-hint" : null, state.errors?.[field] ? `${field}-error` : null].filter(Boolean).join(" ") || undefined;
  return (
    <form action={action} className="space-y-4" noValidate>
      {state.message ? (
        <p role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 font-semibold text-red-900">
          {state.message}
        </p>
      ) : null}
      {/* Lets password managers file the new password under the right account. */}
      <input type="email" name="username" value={email} autoComplete="username" readOnly hidden />
      <div>
        <label htmlFor="password" className="field-label">
          New password
        </label>
        <p id="password-hint" className="mb-1 text-sm text-[var(--ink-soft)]">
          At least {MIN_PASSWORD_LENGTH} characters, and not a commonly used password. A few unrelated words work well.
        </p>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="new-password"
          required
          minLength={MIN_PASSWORD_LENGTH}
          className="field-input"
          aria-invalid={state.errors?.password ? true : undefined}
          aria-describedby={describe("password")}
        />
        {state.errors?.password ? (
          <p id="password-error" className="field-error">
            {state.errors.password}
          </p>
        ) : null}
      </div>
      <div>
        <label htmlFor="confirm" className="field-label">
          Repeat the new password
        </label>
        <input
          id="confirm"
          name="confirm"
          type="password"
          autoComplete="new-password"
          required
          className="field-input"
          aria-invalid={state.errors?.confirm ? true : undefined}
          aria-describedby={describe("confirm")}
        />
        {state.errors?.confirm ? (
          <p id="confirm-error" className="field-error">
            {state.errors.confirm}
          </p>
        ) : null}
      </div>
      <button type="submit" className="btn btn-primary w-full text-lg" disabled={pending}>
        {pending ? "Saving…" : submitLabel}
      </button>
    </form>
  );
}
