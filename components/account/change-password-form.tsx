"use client";

import { useActionState } from "react";
import { changePasswordAction } from "@/app/(app)/account/password/actions";

export function ChangePasswordForm() {
  const [state, action, pending] = useActionState(changePasswordAction, null);
  const issueFor = (path: string) => (state && !state.ok ? state.issues.find((i) => i.path === path)?.message : undefined);
  return (
    <form action={action} aria-label="Change password" className="sheet grid max-w-md gap-4 px-5 py-5">
      <div>
        <label htmlFor="current-password" className="field-label block">
          Current password
        </label>
        <input id="current-password" name="currentPassword" type="password" autoComplete="current-password" required className="input mt-1 w-full" disabled={pending} />
        {issueFor("currentPassword") ? <p className="mt-1 text-sm text-signal">{issueFor("currentPassword")}</p> : null}
      </div>
      <div>
        <label htmlFor="new-password" className="field-label block">
          New password (12 to 72 characters)
        </label>
        <input id="new-password" name="newPassword" type="password" autoComplete="new-password" required minLength={12} className="input mt-1 w-full" disabled={pending} />
        {issueFor("newPassword") ? <p className="mt-1 text-sm text-signal">{issueFor("newPassword")}</p> : null}
      </div>
      <div>
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Changing…" : "Change password"}
        </button>
      </div>
      {state ? (
        <p role={state.ok ? "status" : "alert"} className={`text-sm ${state.ok ? "text-ok" : "text-signal"}`}>
          {state.ok ? state.message : state.error}
        </p>
      ) : null}
    </form>
  );
}
