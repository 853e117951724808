"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { fetchJson, RequestError } from "@/lib/fetch-json";
import { NOTE_STATE_LABELS, type NoteState } from "@/lib/schemas/review-thread";
import type { NoteReplyView } from "@/lib/services/reviews/note-thread";

const ACTION_WORDS: Record<NoteReplyView["action"], string> = { reply: "", addressed: "marked it addressed", closed: "closed it", reopened: "reopened it" };

/**
 * The conversation under one reviewer note: the replies so far, and the next
 * step the reader's role may take. The designer replies and marks the note
 * addressed; the reviewer replies, closes or reopens it.
 */
export function NoteThreadControls({
  noteId,
  label,
  state,
  replies,
  asDesigner,
  asReviewer,
}: {
  noteId: string;
  label: string;
  state: NoteState;
  replies: NoteReplyView[];
  asDesigner: boolean;
  asReviewer: boolean;
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const id = useId();
  const [body, setBody] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function send(action: NoteReplyView["action"]) {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/review-notes/${noteId}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ action, body, seen: replies.length }) });
      setBody("");
      await queryClient.invalidateQueries();
      router.refresh();
    } catch (e) {
      setError(e instanceof RequestError ? [e.message, ...e.issues.filter((i) => i.path === "body").map((i) => `Reply ${i.message}.`)].join(" ") : "The reply was not saved.");
    } finally {
      setBusy(false);
    }
  }

  const mayWrite = (asDesigner || asReviewer) && state !== "closed";
  return (
    <div className="mt-1.5 space-y-1.5 pl-3" data-note-state={state}>
      <span className={`text-xs font-semibold ${state === "open" ? "text-signal" : state === "addressed" ? "text-caution" : "text-ok"}`}>{NOTE_STATE_LABELS[state]}</span>
      {replies.length ? (
        <ol className="space-y-1 border-l-2 border-rule pl-3" aria-label={`Conversation on ${label}`}>
          {replies.map((r) => (
            <li key={r.id} className="text-sm">
              <span className="text-xs text-ink-soft">
                {r.who ?? "—"} · <span className="figure">{r.at.slice(0, 16).replace("T", " ")} UTC</span>
                {ACTION_WORDS[r.action] ? ` · ${ACTION_WORDS[r.action]}` : ""}
              </span>
              {r.body ? <p className="whitespace-pre-line">{r.body}</p> : null}
            </li>
          ))}
        </ol>
      ) : null}
      {mayWrite || (asReviewer && state === "closed") ? (
        <div className="no-print space-y-1.5">
          {mayWrite ? (
            <>
              <label htmlFor={`${id}-reply`} className="sr-only">
                Reply on {label}
              </label>
              <textarea id={`${id}-reply`} rows={2} className="input w-full text-sm" value={body} onChange={(e) => setBody(e.target.value)} disabled={busy} placeholder="Reply…" />
            </>
          ) : null}
          <div className="flex flex-wrap gap-2">
            {mayWrite ? (
              <button type="button" className="btn-quiet text-xs" disabled={busy || !body.trim()} onClick={() => void send("reply")}>
                Reply
              </button>
            ) : null}
            {asDesigner && state === "open" ? (
              <button type="button" className="btn text-xs" disabled={busy || !body.trim()} onClick={() => void send("addressed")}>
                Reply and mark addressed
              </button>
            ) : null}
            {asReviewer && state !== "closed" ? (
              <button type="button" className="btn text-xs" disabled={busy} onClick={() => void send("closed")}>
                Close note
              </button>
            ) : null}
            {asReviewer && state !== "open" ? (
              <button type="button" className="btn-quiet text-xs" disabled={busy} onClick={() => void send("reopened")}>
                Reopen
              </button>
            ) : null}
          </div>
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="text-sm text-signal">
          {error}
        </p>
      ) : null}
    </div>
  );
}
