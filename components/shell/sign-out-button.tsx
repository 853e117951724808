"use client";

import { useActionState } from "react";
import { signOutAction } from "@/app/(app)/shell/actions";

export function SignOutButton() {
  const [state, action, pending] = useActionState(signOutAction, null);
  return (
    <form action={action}>
      <button type="submit" className="btn-quiet" disabled={pending}>
        Sign out
      </button>
      {state && !state.ok ? (
        <span role="alert" className="ml-2 text-xs text-signal">
          {state.error}
        </span>
      ) : null}
    </form>
  );
}
