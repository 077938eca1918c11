"use client";

import { useActionState } from "react";
import { signInAction, type SignInState } from "./sign-in-action";

export function SignInForm({ next }: { next: string }) {
  const [state, action, pending] = useActionState<SignInState, FormData>(signInAction, {});
  return (
    <form action={action} className="space-y-4" noValidate>
      <input type="hidden" name="next" value={next} />
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
      <div>
        <label htmlFor="password" className="field-label">
          Password
        </label>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          className="field-input"
          aria-invalid={state.errors?.password ? true : undefined}
          aria-describedby={state.errors?.password ? "password-error" : undefined}
        />
        {state.errors?.password ? (
          <p id="password-error" className="field-error">
            {state.errors.password}
          </p>
        ) : null}
      </div>
      <button type="submit" className="btn btn-primary w-full text-lg" disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
