"use client";

import { useRouter } from "next/navigation";
import { startTransition, useActionState, useEffect, useState } from "react";
import { voidEventAction } from "@/app/(app)/submissions/actions";

/** Voids one entry recorded in error; asks for the reason, which the log keeps beside the struck entry. */
export function VoidEventForm({ submissionId, eventId, version, label }: { submissionId: string; eventId: string; version: number; label: string }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState("");
  const [state, action, pending] = useActionState(voidEventAction, null);
  useEffect(() => {
    if (state?.ok) {
      setOpen(false);
      setReason("");
      router.refresh();
    }
  }, [state]);

  if (!open) {
    return (
      <button type="button" className="btn-quiet no-print text-xs" onClick={() => setOpen(true)} aria-label={`Void ${label}`}>
        Void…
      </button>
    );
  }
  const id = `void-${eventId}`;
  return (
    <form
      aria-label={`Void ${label}`}
      className="no-print mt-2 grid gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        const data = new FormData(e.currentTarget);
        startTransition(() => action(data));
      }}
    >
      <input type="hidden" name="submissionId" value={submissionId} />
      <input type="hidden" name="eventId" value={eventId} />
      <input type="hidden" name="version" value={version} />
      <label htmlFor={id} className="field-label block">
        Why is this entry wrong?
      </label>
      <textarea id={id} name="reason" rows={2} className="input w-full max-w-prose" required minLength={5} value={reason} onChange={(e) => setReason(e.target.value)} />
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Voiding…" : "Void entry"}
        </button>
        <button type="button" className="btn-quiet" onClick={() => setOpen(false)}>
          Keep it
        </button>
        {state && !state.ok ? (
          <p role="alert" className="text-sm text-signal">
            {state.error}
          </p>
        ) : null}
      </div>
    </form>
  );
}
