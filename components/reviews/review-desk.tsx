"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useId, useMemo, useRef, useState, useTransition } from "react";
import { decideReviewAction } from "@/app/(app)/reviews/actions";
import { statusWord } from "@/components/ui/status-badge";
import type { CheckStatus } from "@/lib/compliance/types";
import { GENERAL_NOTES_MAX_CHARS, type AttestDisposition, type NoteTargetKind } from "@/lib/schemas/review";
import type { ReviewCheck } from "@/lib/services/reviews/view";
import { CheckResultCard } from "./check-result-card";
import { DispositionControl, NoteBox, type DispositionDraft } from "./desk-fields";

/** Statuses a reviewer reads first are open; passes and not-applicable results wait behind a summary. */
const OPEN_GROUPS: readonly CheckStatus[] = ["fail", "needs-input", "warning", "attest"];

export interface ReviewDeskProps {
  revisionId: string;
  revisionNumber: number;
  projectName: string;
  designerName: string | null;
  pageCount: number | null;
  recordSha256: string;
  edition: string | null;
  groups: { status: CheckStatus; results: ReviewCheck[] }[];
  sheets: readonly { code: string; title: string }[];
  /** Points a person must confirm on site, which a stamp does not settle. */
  attestCount: number;
  mayDecide: boolean;
  reviewerName: string;
  /** The reviewer's own licence as the stamp will print it, with what blocks an approval. */
  licence: { licenceNumber: string; region: string; discipline: string; expiresOn: string | null; blockers: string[] } | null;
  /** Other reasons an approval cannot be given (a snapshot that no longer matches its hash). */
  approveRefusals?: string[];
  /** The reviewer's stored signing certificate: approving then asks for its password and signs the stamped packet. */
  certificate?: { subjectName: string } | null;
  today: string;
}

type NoteKey = `${NoteTargetKind}:${string}`;
const keyOf = (kind: NoteTargetKind, id: string): NoteKey => `${kind}:${id}`;

function draftKey(revisionId: string) {
  return `sundocket.review-draft.${revisionId}`;
}

interface Draft {
  notes: Record<string, string>;
  general: string;
  dispositions?: Record<string, DispositionDraft>;
}

function readDraft(revisionId: string): Draft | null {
  try {
    const raw = window.localStorage.getItem(draftKey(revisionId));
    if (!raw) return null;
    const parsed = JSON.parse(raw) as Draft;
    return parsed && typeof parsed === "object" ? { notes: parsed.notes ?? {}, general: parsed.general ?? "", dispositions: parsed.dispositions ?? {} } : null;
  } catch {
    return null;
  }
}

/**
 * The reviewer's desk: the snapshot's check results grouped by status and the
 * packet's sheets, each with a note box, general notes, and the decision.
 * Notes are kept in this browser until the decision is sent, so a reload
 * does not lose a half-written review.
 */
export function ReviewDesk(props: ReviewDeskProps) {
  const { revisionId, revisionNumber, mayDecide } = props;
  const router = useRouter();
  const [notes, setNotes] = useState<Record<string, string>>({});
  const [general, setGeneral] = useState("");
  const [dispositions, setDispositions] = useState<Record<string, DispositionDraft>>({});
  const [loaded, setLoaded] = useState(false);
  const [pending, startTransition] = useTransition();
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string; issues?: { path: string; message: string }[] } | null>(null);
  const [confirming, setConfirming] = useState<"returned" | "approved" | null>(null);
  const [confirmed, setConfirmed] = useState(false);
  const [certificatePassword, setCertificatePassword] = useState("");
  const passwordId = useId();
  const dialogRef = useRef<HTMLDialogElement>(null);
  const generalId = useId();

  useEffect(() => {
    if (!mayDecide) return;
    const draft = readDraft(revisionId);
    if (draft) {
      setNotes(draft.notes);
      setGeneral(draft.general);
      setDispositions(draft.dispositions ?? {});
    }
    setLoaded(true);
  }, [mayDecide, revisionId]);

  useEffect(() => {
    if (!loaded) return;
    try {
      const empty = !general.trim() && Object.values(notes).every((v) => !v.trim()) && Object.values(dispositions).every((d) => !d.disposition);
      if (empty) window.localStorage.removeItem(draftKey(revisionId));
      else window.localStorage.setItem(draftKey(revisionId), JSON.stringify({ notes, general, dispositions }));
    } catch {
      // Private windows may refuse storage; the notes still go with the decision.
    }
  }, [dispositions, general, loaded, notes, revisionId]);

  useEffect(() => {
    const dialog = dialogRef.current;
    if (!dialog) return;
    if (confirming && !dialog.open) dialog.showModal();
    if (!confirming && dialog.open) dialog.close();
  }, [confirming]);

  const written = useMemo(
    () =>
      Object.entries(notes)
        .filter(([, text]) => text.trim())
        .map(([key, text]) => {
          const at = key.indexOf(":");
          return { targetKind: key.slice(0, at) as NoteTargetKind, targetId: key.slice(at + 1), text: text.trim() };
        }),
    [notes],
  );
  const setNote = (key: NoteKey, text: string) => setNotes((prev) => ({ ...prev, [key]: text }));
  const labelOf = (r: ReviewCheck) => (r.subject && !r.title.includes(r.subject) ? `${r.title} (${r.subject})` : r.title);
  const canReturn = written.length > 0 || general.trim().length > 0;
  const licence = props.licence;
  const attestResults = props.groups.find((g) => g.status === "attest")?.results ?? [];
  const needsInput = props.groups.find((g) => g.status === "needs-input")?.results.length ?? 0;
  const given = Object.entries(dispositions)
    .filter(([id, d]) => d.disposition && attestResults.some((r) => r.id === id))
    .map(([resultId, d]) => ({ resultId, disposition: d.disposition as AttestDisposition, note: d.note.trim() }));
  const undecided = attestResults.filter((r) => {
    const d = dispositions[r.id];
    return !d || !d.disposition || (d.disposition === "accepted" && !d.note.trim());
  }).length;
  const returnedItems = given.filter((d) => d.disposition === "returned").length;
  const blockers = [
    ...(licence ? licence.blockers : ["record your licence and stamp image"]),
    ...(props.approveRefusals ?? []),
    ...(needsInput ? [`${needsInput} result${needsInput === 1 ? " needs" : "s need"} input; the record is not complete enough to stamp`] : []),
    ...(undecided ? [`give each attest item a disposition (${undecided} of ${attestResults.length} without one)`] : []),
    ...(returnedItems ? [`${returnedItems} attest item${returnedItems === 1 ? " is" : "s are"} returned; return the revision instead`] : []),
  ];
  const approveBlocked = !licence || blockers.length > 0;

  function decide(decision: "returned" | "approved") {
    setOutcome(null);
    startTransition(async () => {
      const result = await decideReviewAction({
        revisionId,
        decision,
        generalNotes: general,
        notes: written,
        dispositions: given,
        confirmStamp: decision === "approved" ? confirmed : undefined,
        ...(decision === "approved" && props.certificate ? { certificatePassword } : {}),
      });
      setCertificatePassword("");
      setConfirming(null);
      setConfirmed(false);
      if (result.ok) {
        try {
          window.localStorage.removeItem(draftKey(revisionId));
        } catch {
          // nothing kept
        }
        setNotes({});
        setGeneral("");
        setDispositions({});
        setOutcome({ ok: true, text: result.data?.message ?? "Decision recorded." });
        router.refresh();
      } else {
        setOutcome({ ok: false, text: result.error, issues: result.issues });
      }
    });
  }

  return (
    <div>
      <section aria-labelledby="checks-heading" className="mb-8">
        <h2 id="checks-heading" className="mb-1 text-base font-semibold tracking-tight">
          Check results in this revision
        </h2>
        <p className="mb-3 max-w-prose text-sm text-ink-soft">
          Frozen with revision {revisionNumber}
          {props.edition ? `, NEC ${props.edition}` : ""}. The checks assist your review; they do not replace it.
        </p>
        {props.groups.length === 0 ? <p className="sheet px-4 py-6 text-sm text-ink-soft">This revision holds no check results.</p> : null}
        {props.groups.map((group) => {
          const body = (
            <div className="sheet">
              {group.results.map((r) => (
                <CheckResultCard key={r.id} result={r}>
                  {mayDecide && r.status === "attest" ? (
                    <DispositionControl
                      label={labelOf(r)}
                      value={dispositions[r.id] ?? { disposition: "", note: "" }}
                      onChange={(v) => setDispositions((prev) => ({ ...prev, [r.id]: v }))}
                      disabled={pending}
                    />
                  ) : null}
                  {mayDecide ? <NoteBox label={labelOf(r)} value={notes[keyOf("check", r.id)] ?? ""} onChange={(v) => setNote(keyOf("check", r.id), v)} disabled={pending} /> : null}
                </CheckResultCard>
              ))}
            </div>
          );
          const title = `${statusWord(group.status)} (${group.results.length})`;
          const noted = group.results.filter((r) => notes[keyOf("check", r.id)]?.trim()).length;
          return OPEN_GROUPS.includes(group.status) ? (
            <section key={group.status} aria-label={`${statusWord(group.status)} checks`} className="mb-5">
              <h3 className="field-label mb-1.5">{title}</h3>
              {body}
            </section>
          ) : (
            <details key={group.status} className="mb-5" open={noted > 0}>
              <summary className="field-label mb-1.5 cursor-pointer">
                {title}
                {noted ? ` · ${noted} noted` : ""}
              </summary>
              <section aria-label={`${statusWord(group.status)} checks`}>{body}</section>
            </details>
          );
        })}
      </section>

      <section aria-labelledby="sheets-heading" className="mb-8">
        <h2 id="sheets-heading" className="mb-3 text-base font-semibold tracking-tight">
          Sheets
        </h2>
        <ul className="sheet">
          {props.sheets.map((s) => (
            <li key={s.code} className="flex flex-wrap items-center justify-between gap-x-3 border-b border-grid px-4 py-2.5 last:border-b-0">
              <p className="text-sm">
                <span className="figure mr-2 font-semibold">{s.code}</span>
                {s.title}
              </p>
              {mayDecide ? (
                <NoteBox label={`sheet ${s.code} ${s.title}`} value={notes[keyOf("sheet", s.code)] ?? ""} onChange={(v) => setNote(keyOf("sheet", s.code), v)} disabled={pending} compact />
              ) : null}
            </li>
          ))}
        </ul>
      </section>

      {mayDecide ? (
        <section aria-labelledby="decision-heading" className="sheet mb-8 px-5 py-5">
          <h2 id="decision-heading" className="mb-3 text-base font-semibold tracking-tight">
            Your decision on revision {revisionNumber}
          </h2>
          <label htmlFor={generalId} className="field-label mb-1 block">
            General notes
          </label>
          <textarea
            id={generalId}
            className="input min-h-28 w-full text-sm leading-relaxed"
            value={general}
            maxLength={GENERAL_NOTES_MAX_CHARS}
            disabled={pending}
            onChange={(e) => setGeneral(e.target.value)}
            aria-describedby={`${generalId}-hint`}
          />
          <p id={`${generalId}-hint`} className="mt-1 text-xs text-ink-soft">
            {written.length} note{written.length === 1 ? "" : "s"} on checks and sheets. Returning needs at least one note or a general note; notes kept with an approval print on the review record.
          </p>
          {approveBlocked ? (
            <p className="mt-3 border-l-4 border-l-caution bg-caution-soft px-3 py-2 text-sm" data-testid="approve-blocked">
              <span aria-hidden="true">▲ </span>
              Before you can approve: {blockers.join("; ")}.{" "}
              {licence && licence.blockers.length === 0 ? null : (
                <Link href="/reviews/licence" className="underline underline-offset-2">
                  Your licence and stamp
                </Link>
              )}
            </p>
          ) : null}
          <div className="mt-4 flex flex-wrap items-center gap-3">
            <button type="button" className="btn-quiet" disabled={pending || !canReturn} onClick={() => setConfirming("returned")}>
              Return with notes
            </button>
            <button type="button" className="btn" disabled={pending || approveBlocked} onClick={() => setConfirming("approved")}>
              Approve and stamp
            </button>
            {!canReturn ? <span className="text-xs text-ink-soft">Write a note to return the revision.</span> : null}
          </div>
        </section>
      ) : null}

      {outcome ? (
        <div role={outcome.ok ? "status" : "alert"} className={`sheet mb-8 border-l-4 px-4 py-3 text-sm ${outcome.ok ? "border-l-ok" : "border-l-signal"}`}>
          <p className="font-semibold">{outcome.text}</p>
          {outcome.issues?.length ? (
            <ul className="mt-1 list-disc pl-5 text-ink-soft">
              {outcome.issues.map((i) => (
                <li key={`${i.path}:${i.message}`}>
                  {i.path}: {i.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}

      <dialog
        ref={dialogRef}
        aria-labelledby="confirm-heading"
        className="sheet m-auto max-w-xl p-0 backdrop:bg-ink/40"
        onClose={() => {
          setConfirming(null);
          setConfirmed(false);
        }}
      >
        {confirming === "returned" ? (
          <div className="px-6 py-5">
            <h2 id="confirm-heading" className="text-lg font-semibold tracking-tight">
              Return revision {revisionNumber}?
            </h2>
            <p className="mt-3 text-sm leading-relaxed">
              {written.length} note{written.length === 1 ? "" : "s"} on checks and sheets{general.trim() ? " and your general notes" : ""} go to {props.designerName ?? "the designer"} by e-mail and
              appear on the project&apos;s packet tab. Revision {revisionNumber} stays as it is; the designer answers with a new revision or sends this one back unchanged.
            </p>
            <div className="mt-5 flex flex-wrap justify-end gap-3">
              <button type="button" className="btn-quiet" onClick={() => setConfirming(null)} disabled={pending}>
                Keep reviewing
              </button>
              <button type="button" className="btn" onClick={() => decide("returned")} disabled={pending}>
                {pending ? "Returning…" : `Return revision ${revisionNumber}`}
              </button>
            </div>
          </div>
        ) : null}
        {confirming === "approved" && licence ? (
          <form
            className="px-6 py-5"
            onSubmit={(e) => {
              e.preventDefault();
              if (confirmed) decide("approved");
            }}
          >
            <h2 id="confirm-heading" className="text-lg font-semibold tracking-tight">
              Approve and stamp revision {revisionNumber}
            </h2>
            <p className="mt-3 text-sm leading-relaxed" data-testid="stamp-meaning">
              I have reviewed revision {revisionNumber} of {props.projectName}
              {props.pageCount ? ` (${props.pageCount} pages)` : ""}, record SHA-256 <span className="figure">{props.recordSha256.slice(0, 16)}…</span>, and approve it. My name,{" "}
              {props.reviewerName}, my licence {licence.licenceNumber} ({licence.region}, {licence.discipline}), today&apos;s date {props.today} and my stamp image will be printed on
              every page of the packet.
            </p>
            <p className="mt-2 text-sm leading-relaxed text-ink-soft">
              The approval is bound to this revision&apos;s record. Any change to the design makes a new revision that needs review again. Local codes and the AHJ still govern.
            </p>
            {props.attestCount > 0 ? (
              <p className="mt-2 border-l-4 border-l-brass px-3 py-1.5 text-sm">
                <span aria-hidden="true">☐ </span>
                {props.attestCount} point{props.attestCount === 1 ? " is" : "s are"} to be confirmed on site; your stamp does not settle {props.attestCount === 1 ? "it" : "them"}.
              </p>
            ) : null}
            <label className="mt-4 flex items-start gap-2 text-sm">
              <input type="checkbox" className="mt-0.5" checked={confirmed} onChange={(e) => setConfirmed(e.target.checked)} disabled={pending} />
              <span>I have reviewed this revision and my stamp is to be printed on it.</span>
            </label>
            {props.certificate ? (
              <div className="mt-4">
                <label htmlFor={passwordId} className="field-label block">
                  Password of {props.certificate.subjectName}&apos;s signing certificate
                </label>
                <input
                  id={passwordId}
                  type="password"
                  autoComplete="off"
                  required
                  className="input mt-1 w-full max-w-xs"
                  value={certificatePassword}
                  onChange={(e) => setCertificatePassword(e.target.value)}
                  disabled={pending}
                  aria-describedby={`${passwordId}-hint`}
                />
                <p id={`${passwordId}-hint`} className="mt-1 text-xs text-ink-soft">
                  The stamped packet is digitally signed with your certificate. The password is used for this signing and not kept.
                </p>
              </div>
            ) : null}
            <div className="mt-5 flex flex-wrap justify-end gap-3">
              <button type="button" className="btn-quiet" onClick={() => setConfirming(null)} disabled={pending}>
                Keep reviewing
              </button>
              <button type="submit" className="btn" disabled={pending || !confirmed || (Boolean(props.certificate) && !certificatePassword)}>
                {pending ? "Stamping…" : `Approve and stamp revision ${revisionNumber}`}
              </button>
            </div>
          </form>
        ) : null}
      </dialog>
    </div>
  );
}
