"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { fetchJson } from "@/lib/fetch-json";
import type { SentForReview } from "@/lib/services/reviews/send";

/**
 * Sends a ready revision to the organisation's reviewers. A returned revision
 * may go back unchanged, after saying what that means; other states show
 * nothing to press.
 */
export function SendForReviewButton({ revisionId, reviewState, number }: { revisionId: string; reviewState: string; number?: number }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [asking, setAsking] = useState(false);
  const send = useMutation({
    mutationFn: () => fetchJson<SentForReview>(`/api/revisions/${revisionId}/send`, { method: "POST" }),
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
  const rev = number ? `revision ${number}` : "this revision";
  const label = reviewState === "returned" ? "Send again unchanged" : "Send for review";

  return (
    <div className="inline-flex flex-col items-start gap-1">
      {asking ? (
        <div role="group" aria-label={`Send ${rev} again`} className="flex flex-col gap-2 text-xs">
          <p className="max-w-xs text-ink-soft">
            {rev[0]!.toUpperCase() + rev.slice(1)} was returned with notes. Send it again only if the notes need no change to the design; otherwise generate a new revision.
          </p>
          <div className="flex gap-2">
            <button type="button" className="btn text-xs" disabled={send.isPending} onClick={() => send.mutate()}>
              {send.isPending ? "Sending…" : "Send it again"}
            </button>
            <button type="button" className="btn-quiet text-xs" disabled={send.isPending} onClick={() => setAsking(false)}>
              Cancel
            </button>
          </div>
        </div>
      ) : (
        <button
          type="button"
          className={reviewState === "returned" ? "btn-quiet text-xs" : "btn text-xs"}
          disabled={send.isPending}
          onClick={() => (reviewState === "returned" ? setAsking(true) : send.mutate())}
          aria-label={`${label}: ${rev}`}
        >
          {send.isPending ? "Sending…" : label}
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
