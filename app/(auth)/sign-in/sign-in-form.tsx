"use client";

import { useActionState } from "react";
import { signInAction } from "./actions";

export function SignInForm({ next }: { next: string }) {
  const [result, action, pending] = useActionState(signInAction, null);
  // A refusal the service names (wrong password, locked) comes back as data; a malformed form as a failed result.
  const state = result === null ? {} : result.ok ? (result.data ?? {}) : { error: result.error };
  return (
    <form action={action} className="space-y-4" noValidate>
      <input type="hidden" name="next" value={next} />
      <div>
        <label htmlFor="email" className="field-label">
          E-mail
        </label>
        <input id="email" name="email" type="email" autoComplete="username" required defaultValue={state.email} className="input mt-1" />
      </div>
      <div>
        <label htmlFor="password" className="field-label">
          Password
        </label>
        <input id="password" name="password" type="password" autoComplete="current-password" required className="input mt-1" />
      </div>
      {state.error ? (
        <p role="alert" className="border-l-4 border-signal bg-signal-soft px-3 py-2 text-sm text-ink">
          {state.error}
        </p>
      ) : null}
      <button type="submit" className="btn w-full justify-center" disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
