"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { fetchJson } from "@/lib/fetch-json";
import type { SentForReview } from "@/lib/services/reviews/send";

/**
 * Sends a ready revision to the organisation's reviewers, with a message to
 * them: optional, and required when checks fail (the reviewer should know
 * why a failing set is sent). A returned revision may go back unchanged,
 * after saying what that means; other states show nothing to press.
 */
export function SendForReviewButton({
  revisionId,
  reviewState,
  number,
  failCount = 0,
  supersededBy = null,
}: {
  revisionId: string;
  reviewState: string;
  number?: number;
  failCount?: number;
  /** A later revision replaces this one: it is not offered for sending again. */
  supersededBy?: number | null;
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const id = useId();
  const [asking, setAsking] = useState(false);
  const [message, setMessage] = useState("");
  const send = useMutation({
    mutationFn: () =>
      fetchJson<SentForReview>(`/api/revisions/${revisionId}/send`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ message }),
      }),
    onSuccess: async () => {
      setAsking(false);
      await queryClient.invalidateQueries();
      router.refresh();
    },
  });
  if (send.isSuccess) {
    return (
      <span role="status" className="text-xs text-ok">
        {send.data.message}
      </span>
    );
  }
  if (reviewState !== "draft" && reviewState !== "returned") return null;
  if (supersededBy !== null) return <span className="text-xs text-ink-soft">Superseded by revision {supersededBy}</span>;
  const rev = number ? `revision ${number}` : "this revision";
  const returned = reviewState === "returned";
  const label = returned ? "Send again unchanged" : "Send for review";
  const required = failCount > 0;

  return (
    <div className="inline-flex flex-col items-start gap-1">
      {asking ? (
        <div role="group" aria-label={returned ? `Send ${rev} again` : `Send ${rev} for review`} className="flex flex-col gap-2 text-xs">
          {returned ? (
            <p className="max-w-xs text-ink-soft">
              {rev[0]!.toUpperCase() + rev.slice(1)} was returned with notes. Send it again only if the notes need no change to the design; otherwise generate a new revision.
            </p>
          ) : null}
          <label htmlFor={`${id}-message`} className="field-label">
            Message to the reviewer{required ? "" : " (optional)"}
          </label>
          <textarea
            id={`${id}-message`}
            className="input min-h-16 w-72 text-sm"
            value={message}
            maxLength={4000}
            required={required}
            aria-describedby={`${id}-hint`}
            onChange={(e) => setMessage(e.target.value)}
          />
          <p id={`${id}-hint`} className="max-w-xs text-ink-soft">
            {required ? `${failCount} check${failCount === 1 ? " fails" : "s fail"}: say why the revision should be reviewed as it is.` : "What changed, or what the reviewer should look at first."}
          </p>
          <div className="flex gap-2">
            <button type="button" className="btn text-xs" disabled={send.isPending || (required && !message.trim())} onClick={() => send.mutate()}>
              {send.isPending ? "Sending…" : returned ? "Send it again" : "Send"}
            </button>
            <button type="button" className="btn-quiet text-xs" disabled={send.isPending} onClick={() => setAsking(false)}>
              Cancel
            </button>
          </div>
        </div>
      ) : (
        <button type="button" className={returned ? "btn-quiet text-xs" : "btn text-xs"} disabled={send.isPending} onClick={() => setAsking(true)} aria-label={`${label}: ${rev}`}>
          {label}
        </button>
      )}
      {send.isError ? (
        <span role="alert" className="max-w-xs text-xs text-signal">
          {send.error.message}
        </span>
      ) : null}
    </div>
  );
}
