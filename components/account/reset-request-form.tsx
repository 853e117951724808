"use client";

import { useActionState } from "react";
import { requestResetAction } from "@/app/(auth)/forgot-password/actions";

export function ResetRequestForm() {
  const [state, action, pending] = useActionState(requestResetAction, null);
  const emailIssue = state && !state.ok ? state.issues.find((i) => i.path === "email")?.message : undefined;
  return (
    <form action={action} aria-label="Ask for a reset link" className="space-y-4" noValidate>
      <div>
        <label htmlFor="reset-email" className="field-label">
          E-mail
        </label>
        <input id="reset-email" name="email" type="email" autoComplete="username" required className="input mt-1" />
        {emailIssue ? <p className="mt-1 text-sm text-signal">{emailIssue}</p> : null}
      </div>
      <button type="submit" className="btn w-full justify-center" disabled={pending}>
        {pending ? "Sending…" : "Send me a link"}
      </button>
      {state ? (
        <p role={state.ok ? "status" : "alert"} className={`text-sm ${state.ok ? "text-ok" : "text-signal"}`}>
          {state.ok ? state.message : state.error}
        </p>
      ) : null}
    </form>
  );
}
