"use client";

import { useActionState } from "react";
import { toggleConfirmationAction } from "@/app/(app)/install/[revisionId]/actions";

export function ConfirmToggle({
  revisionId,
  itemKind,
  itemId,
  confirmed,
  label,
  disabled,
}: {
  revisionId: string;
  itemKind: "label" | "equipment" | "clearance";
  itemId: string;
  confirmed: boolean;
  label: string;
  disabled?: boolean;
}) {
  const [state, action, pending] = useActionState(toggleConfirmationAction, null);
  return (
    <form action={action} className="flex items-center gap-2">
      <input type="hidden" name="revisionId" value={revisionId} />
      <input type="hidden" name="itemKind" value={itemKind} />
      <input type="hidden" name="itemId" value={itemId} />
      <input type="hidden" name="confirmed" value={confirmed ? "false" : "true"} />
      <button type="submit" className={confirmed ? "btn" : "btn-quiet"} disabled={pending || disabled} aria-pressed={confirmed} aria-label={`${label}: ${confirmed ? "confirmed, click to undo" : "mark as done"}`}>
        <span aria-hidden="true">{confirmed ? "☑" : "☐"}</span>
        {confirmed ? "Done" : "Mark done"}
      </button>
      {state && !state.ok ? <span role="alert" className="text-xs text-signal">{state.error}</span> : null}
    </form>
  );
}
