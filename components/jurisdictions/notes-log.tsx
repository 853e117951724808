"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { addJurisdictionNoteAction } from "@/app/(app)/jurisdictions/[id]/actions";
import type { JurisdictionNoteView } from "@/lib/services/jurisdictions/notes";

/** The AHJ's unwritten rules, newest first: who wrote each, when, and from which project. */
export function NotesLog({ jurisdictionId, notes, canWrite }: { jurisdictionId: string; notes: JurisdictionNoteView[]; canWrite: boolean }) {
  const router = useRouter();
  const [text, setText] = useState("");
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <section aria-labelledby="notes-log-title" className="sheet px-4 py-3">
      <h2 id="notes-log-title" className="mb-2 text-sm font-semibold">
        Notes log <span className="figure font-normal text-ink-soft">({notes.length})</span>
      </h2>
      {canWrite ? (
        <form
          aria-label="Add a note"
          className="mb-3 space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            setError(null);
            startTransition(async () => {
              const result = await addJurisdictionNoteAction({ jurisdictionId, text });
              if (result.ok) {
                setText("");
                router.refresh();
              } else setError([result.error, ...result.issues.map((i) => `${i.path === "text" ? "The note" : i.path} ${i.message}.`)].join(" "));
            });
          }}
        >
          <label htmlFor="jurisdiction-note" className="field-label block">
            What this AHJ expects that no code says
          </label>
          <textarea id="jurisdiction-note" rows={2} className="input w-full" value={text} onChange={(e) => setText(e.target.value)} aria-invalid={error ? true : undefined} />
          <button type="submit" className="btn text-xs" disabled={pending || !text.trim()}>
            {pending ? "Adding…" : "Add to the log"}
          </button>
          {error ? (
            <p role="alert" className="text-sm text-signal">
              {error}
            </p>
          ) : null}
        </form>
      ) : null}
      {notes.length === 0 ? (
        <p className="text-sm text-ink-soft">No notes yet. The office writes down here what each resubmittal taught.</p>
      ) : (
        <ol className="space-y-2" aria-label="Notes">
          {notes.map((n) => (
            <li key={n.id} className="border-l-2 border-rule pl-3 text-sm">
              <p className="whitespace-pre-line">{n.text}</p>
              <p className="text-xs text-ink-soft">
                {n.who ?? "—"} · <span className="figure">{n.at.slice(0, 10)}</span>
                {n.projectId ? (
                  <>
                    {" "}
                    · from a correction on{" "}
                    <a href={`/projects/${n.projectId}/corrections`} className="underline decoration-rule underline-offset-2">
                      {n.projectName}
                    </a>
                  </>
                ) : null}
              </p>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
