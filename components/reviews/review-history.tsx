"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { fetchJson } from "@/lib/fetch-json";
import type { ReviewEntry } from "@/lib/services/reviews/history";
import { NoteThreadControls } from "./note-thread";

function when(iso: string): string {
  return iso.slice(0, 16).replace("T", " ");
}

/** The decisions on a revision or a project, newest first, each with its notes grouped as the reviewer left them. */
export function ReviewHistoryList({
  entries,
  showRevision = false,
  linkToReview = false,
  asDesigner = false,
  asReviewer = false,
}: {
  entries: ReviewEntry[];
  showRevision?: boolean;
  linkToReview?: boolean;
  /** The reader answers notes as the designer (reply, mark addressed) or the reviewer (reply, close, reopen). */
  asDesigner?: boolean;
  asReviewer?: boolean;
}) {
  if (entries.length === 0) return <p className="text-sm text-ink-soft">No review decisions yet.</p>;
  return (
    <ol className="space-y-4" aria-label="Review decisions">
      {entries.map((e) => {
        const approved = e.decision === "approved";
        return (
          <li key={e.id} className={`border-l-4 pl-4 ${approved ? "border-l-ok" : "border-l-caution"}`} data-review-id={e.id}>
            <p className="text-sm">
              <span className="font-semibold">
                <span aria-hidden="true">{approved ? "● " : "▲ "}</span>
                {approved ? "Approved and stamped" : "Returned with notes"}
              </span>
              {showRevision ? (
                linkToReview ? (
                  <>
                    {" "}
                    ·{" "}
                    <Link href={`/reviews/${e.revisionId}`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
                      Rev {e.revisionNumber}
                    </Link>
                  </>
                ) : (
                  <span className="figure"> · Rev {e.revisionNumber}</span>
                )
              ) : null}
              <span className="text-ink-soft">
                {" "}
                · {e.reviewerName} · <span className="figure">{when(e.createdAt)}</span>
              </span>
            </p>
            {approved && e.licence ? (
              <p className="figure mt-0.5 text-xs text-ink-soft">
                Licence {e.licence.licenceNumber} ({e.licence.region}, {e.licence.discipline}) · bound to record {e.approvedSha256?.slice(0, 12) ?? "—"}
                {e.boundToRevision ? "" : " · not this revision's record"}
              </p>
            ) : null}
            {e.generalNotes ? <p className="mt-2 max-w-prose whitespace-pre-line text-sm leading-relaxed">{e.generalNotes}</p> : null}
            {e.notes.length ? (
              <ul className="mt-2 space-y-1.5" aria-label={`Notes, revision ${e.revisionNumber}`}>
                {e.notes.map((n) => (
                  <li key={n.id} className="text-sm leading-relaxed" aria-label={`Note on ${n.targetLabel}`}>
                    <span className="field-label mr-1.5">{n.targetLabel}</span>
                    <span className="whitespace-pre-line">{n.text}</span>
                    <NoteThreadControls
                      key={`${n.id}-${n.replies.length}`}
                      noteId={n.id}
                      label={n.targetLabel}
                      state={n.state}
                      replies={n.replies}
                      asDesigner={asDesigner}
                      asReviewer={asReviewer}
                    />
                  </li>
                ))}
              </ul>
            ) : null}
          </li>
        );
      })}
    </ol>
  );
}

/**
 * A project's review decisions and notes for the designer's packet tab,
 * fetched from /api/reviews so it refreshes with the rest of the tab.
 */
export function ReviewHistory({ projectId, asDesigner = false, asReviewer = false }: { projectId: string; asDesigner?: boolean; asReviewer?: boolean }) {
  const query = useQuery({
    queryKey: ["reviews", projectId],
    queryFn: () => fetchJson<{ reviews: ReviewEntry[] }>(`/api/reviews?projectId=${encodeURIComponent(projectId)}`),
  });
  return (
    <section aria-label="Review notes" className="sheet mb-4">
      <h2 className="border-b border-rule px-4 py-2 text-sm font-semibold tracking-tight">Review notes</h2>
      <div className="px-4 py-3">
        {query.isPending ? <p className="text-sm text-ink-soft">Loading the review record…</p> : null}
        {query.isError ? (
          <p role="alert" className="text-sm text-signal">
            The review record could not be loaded: {query.error.message}
          </p>
        ) : null}
        {query.data ? <ReviewHistoryList entries={query.data.reviews} showRevision linkToReview asDesigner={asDesigner} asReviewer={asReviewer} /> : null}
      </div>
    </section>
  );
}
