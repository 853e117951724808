"use client";

import Link from "next/link";
import { useActionState } from "react";
import { redeemLinkAction } from "@/app/(auth)/set-password/actions";

export function SetPasswordForm({ token }: { token: string }) {
  const [state, action, pending] = useActionState(redeemLinkAction, null);
  const issueFor = (path: string) => (state && !state.ok ? state.issues.find((i) => i.path === path)?.message : undefined);
  if (state?.ok) {
    return (
      <div className="space-y-4">
        <p role="status" className="text-sm text-ok">
          {state.message}
        </p>
        <Link href="/sign-in" className="btn w-full justify-center">
          Go to sign in
        </Link>
      </div>
    );
  }
  return (
    <form action={action} aria-label="Choose a password" className="space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <div>
        <label htmlFor="link-new-password" className="field-label">
          New password (12 to 72 characters)
        </label>
        <input id="link-new-password" name="newPassword" type="password" autoComplete="new-password" required minLength={12} className="input mt-1" />
        {issueFor("newPassword") ? <p className="mt-1 text-sm text-signal">{issueFor("newPassword")}</p> : null}
      </div>
      <div>
        <label htmlFor="link-confirm-password" className="field-label">
          The same password again
        </label>
        <input id="link-confirm-password" name="confirmPassword" type="password" autoComplete="new-password" required className="input mt-1" />
        {issueFor("confirmPassword") ? <p className="mt-1 text-sm text-signal">{issueFor("confirmPassword")}</p> : null}
      </div>
      <button type="submit" className="btn w-full justify-center" disabled={pending}>
        {pending ? "Saving…" : "Set password"}
      </button>
      {state && !state.ok ? (
        <p role="alert" className="border-l-4 border-signal bg-signal-soft px-3 py-2 text-sm text-ink">
          {state.error}
        </p>
      ) : null}
    </form>
  );
}
