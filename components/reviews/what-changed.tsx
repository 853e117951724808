import { describeChange } from "@/lib/record-diff";
import type { RevisionDelta } from "@/lib/services/reviews/delta";
import { STATUS_WORDS } from "@/lib/schemas/vocabulary";

/** A stored status in words; a status this version no longer knows is shown as stored. */
function statusText(status: string | null | undefined): string | null | undefined {
  return (STATUS_WORDS as Record<string, string | undefined>)[status ?? ""] ?? status;
}

/**
 * What changed since the earlier revision a reviewer decided on: record fields
 * old → new by item, check results whose status or figures moved, attachments
 * added and removed, with the earlier notes beside the changes they asked for.
 */
export function WhatChanged({ delta, message }: { delta: RevisionDelta; message: { text: string; by: string | null } | null }) {
  const { since, record, attachments, results, earlier } = delta;
  const notes = earlier.flatMap((e) => e.notes.map((n) => ({ ...n, reviewer: e.reviewerName })));
  const notesOnCheck = (id: string) => notes.filter((n) => n.targetKind === "check" && n.targetId === id);
  const otherNotes = notes.filter((n) => n.targetKind !== "check" || !results.some((r) => r.id === n.targetId));
  const general = earlier.filter((e) => e.generalNotes.trim());
  const nothing = record.length === 0 && results.length === 0 && attachments.added.length === 0 && attachments.removed.length === 0;
  return (
    <section aria-labelledby="changed-heading" className="mb-8">
      <h2 id="changed-heading" className="mb-1 text-base font-semibold tracking-tight">
        What changed since revision {since.number}
      </h2>
      <p className="mb-3 text-sm text-ink-soft">
        Revision {since.number} was {since.decision === "approved" ? "approved" : "returned"}. Read the changes first; the full results follow below.
      </p>
      <div className="sheet grid gap-4 px-5 py-4 text-sm">
        {message ? (
          <div>
            <p className="field-label">Message from {message.by ?? "the designer"}</p>
            <p className="mt-0.5 whitespace-pre-line">{message.text}</p>
          </div>
        ) : null}
        {nothing ? <p className="text-ink-soft">The record, the check results and the attachments are the same as in revision {since.number}.</p> : null}
        {record.length ? (
          <div aria-label="Record changes" role="group">
            <p className="field-label mb-1">Record fields</p>
            <ul className="grid gap-2">
              {record.map((g) => (
                <li key={g.group}>
                  <p className="font-semibold">{g.group}</p>
                  <ul className="figure ml-4 list-disc">
                    {g.changes.map((c, i) => (
                      <li key={i}>{describeChange(c).slice(g.group.length).replace(/^[: ]+/, "") || describeChange(c)}</li>
                    ))}
                  </ul>
                </li>
              ))}
            </ul>
          </div>
        ) : null}
        {results.length ? (
          <div aria-label="Check result changes" role="group">
            <p className="field-label mb-1">Check results</p>
            <ul className="grid gap-2">
              {results.map((r) => (
                <li key={r.id}>
                  <p>
                    <span className="font-semibold">{r.subject && !r.title.includes(r.subject) ? `${r.title} (${r.subject})` : r.title}</span>{" "}
                    <span className="figure">
                      {r.kind === "added"
                        ? `new: ${statusText(r.statusAfter)}`
                        : r.kind === "removed"
                          ? `no longer run (was ${statusText(r.statusBefore)})`
                          : r.statusBefore !== r.statusAfter
                            ? `${statusText(r.statusBefore)} → ${statusText(r.statusAfter)}`
                            : "figures changed"}
                    </span>
                  </p>
                  {r.values.length ? (
                    <ul className="figure ml-4 list-disc text-ink-soft">
                      {r.values.map((v) => (
                        <li key={v.label}>
                          {v.label}: {v.before} → {v.after}
                        </li>
                      ))}
                    </ul>
                  ) : null}
                  {notesOnCheck(r.id).map((n) => (
                    <p key={n.id} className="ml-4 mt-1 border-l-4 border-l-caution pl-2 text-ink-soft">
                      Earlier note ({n.reviewer}): {n.text}
                    </p>
                  ))}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
        {attachments.added.length || attachments.removed.length ? (
          <div aria-label="Attachment changes" role="group">
            <p className="field-label mb-1">Attachments</p>
            <ul className="ml-4 list-disc">
              {attachments.added.map((a) => (
                <li key={`+${a}`}>Added: {a}</li>
              ))}
              {attachments.removed.map((a) => (
                <li key={`-${a}`}>Removed: {a}</li>
              ))}
            </ul>
          </div>
        ) : null}
        {otherNotes.length || general.length ? (
          <div aria-label="Earlier notes" role="group">
            <p className="field-label mb-1">Earlier notes on revision {since.number}</p>
            <ul className="grid gap-1">
              {general.map((e) => (
                <li key={e.id} className="whitespace-pre-line">
                  General ({e.reviewerName}): {e.generalNotes}
                </li>
              ))}
              {otherNotes.map((n) => (
                <li key={n.id}>
                  {n.targetLabel}: {n.text}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
      </div>
    </section>
  );
}
