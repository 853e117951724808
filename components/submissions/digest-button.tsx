"use client";

import { useState, useTransition } from "react";
import { sendDigestAction } from "@/app/(app)/submissions/actions";

/** Sends the office's daily digest now; the scheduled command (`npm run digest`) sends it each morning. */
export function DigestButton() {
  const [pending, startTransition] = useTransition();
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string } | null>(null);
  return (
    <span className="no-print inline-flex items-center gap-2">
      <button
        type="button"
        className="btn-quiet"
        disabled={pending}
        onClick={() =>
          startTransition(async () => {
            const result = await sendDigestAction();
            setOutcome(result.ok ? { ok: true, text: result.message ?? "Digest sent." } : { ok: false, text: result.error });
          })
        }
      >
        {pending ? "Sending…" : "Mail the overdue digest"}
      </button>
      {outcome ? (
        <span role={outcome.ok ? "status" : "alert"} className={`text-xs ${outcome.ok ? "text-ok" : "text-signal"}`}>
          {outcome.text}
        </span>
      ) : null}
    </span>
  );
}
