"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { ReviewHistory } from "@/components/reviews/review-history";
import { SendForReviewButton } from "@/components/reviews/send-for-review-button";
import { StateTag } from "@/components/ui/status-badge";
import { fetchJson } from "@/lib/fetch-json";
import type { Preflight } from "@/lib/services/revisions/preflight";
import { PROGRESS_STEPS, PROGRESS_STEP_LABELS, REVIEW_STATE_LABELS, type ProgressStep } from "@/lib/services/revisions/steps";
import type { RevisionView } from "@/lib/services/revisions/view";

/** Polling interval while a revision is generating; a packet takes a few seconds to a minute. */
const POLL_MS = 1000;

function shortSha(sha: string | null): string {
  return sha ? sha.slice(0, 12) : "—";
}

function Section({ title, label, children }: { title: string; label?: string; children: React.ReactNode }) {
  return (
    <section aria-label={label ?? title} className="sheet mb-4">
      <h2 className="border-b border-rule px-4 py-2 text-sm font-semibold tracking-tight">{title}</h2>
      <div className="px-4 py-3">{children}</div>
    </section>
  );
}

function ErrorBox({ title, message, retry }: { title: string; message: string; retry?: () => void }) {
  return (
    <div role="alert" className="sheet mb-4 border-l-4 border-l-signal px-4 py-4 text-sm">
      <p className="font-semibold">{title}</p>
      <p className="mt-1 text-ink-soft">{message}</p>
      {retry ? (
        <button type="button" className="btn-quiet mt-3" onClick={retry}>
          Try again
        </button>
      ) : null}
    </div>
  );
}

function PreflightList({ pre, projectId }: { pre: Preflight; projectId: string }) {
  const fail = pre.counts.fail;
  const needs = pre.counts["needs-input"];
  return (
    <div className="grid gap-4 md:grid-cols-3">
      <div>
        <h3 className="field-label mb-1">Documents {pre.jurisdictionName} requires</h3>
        {pre.missingDocuments.length === 0 ? (
          <p className="text-sm">
            <span aria-hidden="true">● </span>All attached.
          </p>
        ) : (
          <ul aria-label="Missing documents" className="space-y-0.5 text-sm">
            {pre.missingDocuments.map((m) => (
              <li key={m} className="text-signal">
                <span aria-hidden="true">■ </span>
                <span>{m}</span>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-xs text-ink-soft">
          {pre.defaultDocuments ? "No jurisdiction chosen: the default set applies — " : "Required: "}
          {pre.requiredDocuments.map((d) => d.label.toLowerCase()).join("; ") || "none"}.{" "}
          <Link href={`/projects/${projectId}/attachments`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
            Attach documents
          </Link>
        </p>
      </div>
      <div>
        <h3 className="field-label mb-1">Checks (NEC {pre.edition})</h3>
        <p className="text-sm" data-testid="failing-checks">
          {fail === 0 && needs === 0 ? (
            <>
              <span aria-hidden="true">● </span>No check fails or needs input.
            </>
          ) : (
            <>
              <span className={fail ? "font-semibold text-signal" : ""}>
                {fail ? <span aria-hidden="true">■ </span> : null}
                {fail} {fail === 1 ? "check fails" : "checks fail"}
              </span>
              , {needs} {needs === 1 ? "needs" : "need"} input.{" "}
              <Link href={`/projects/${projectId}`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
                Open the design tab
              </Link>
            </>
          )}
        </p>
        {pre.failingChecks.length ? (
          <ul className="mt-1 space-y-0.5 text-xs text-ink-soft">
            {pre.failingChecks.slice(0, 6).map((c) => (
              <li key={c.id}>
                <span aria-hidden="true">{c.status === "fail" ? "■ " : "◇ "}</span>
                {c.title}
                {c.subject ? ` (${c.subject})` : ""}
              </li>
            ))}
            {pre.failingChecks.length > 6 ? <li>and {pre.failingChecks.length - 6} more</li> : null}
          </ul>
        ) : null}
      </div>
      <div>
        <h3 className="field-label mb-1">Required labels</h3>
        {pre.missingLabels.length === 0 ? (
          <p className="text-sm">
            <span aria-hidden="true">● </span>Every required label can be printed.
          </p>
        ) : (
          <ul aria-label="Incomplete labels" className="space-y-0.5 text-sm">
            {pre.missingLabels.map((m) => (
              <li key={m} className="text-signal">
                <span aria-hidden="true">■ </span>
                <span>{m}</span>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-xs text-ink-soft">
          {pre.documents.length} attached document{pre.documents.length === 1 ? "" : "s"} will be merged.
        </p>
      </div>
    </div>
  );
}

function Progress({ revision }: { revision: RevisionView }) {
  const steps = PROGRESS_STEPS.filter((s) => s !== "queued");
  const current = revision.progressStep as ProgressStep;
  const at = steps.indexOf(current as (typeof steps)[number]);
  return (
    <div className="mb-4 sheet px-4 py-3">
      <p role="status" className="text-sm font-medium">
        Generating revision {revision.number}: {PROGRESS_STEP_LABELS[current] ?? current}
        {at >= 0 ? ` (step ${at + 1} of ${steps.length})` : ""}…
      </p>
      <ol aria-label={`Progress of revision ${revision.number}`} className="mt-2 flex flex-wrap gap-1 text-xs">
        {steps.map((s, i) => {
          const done = at > i;
          const now = at === i;
          return (
            <li
              key={s}
              aria-current={now ? "step" : undefined}
              className={`rounded-[2px] border px-2 py-0.5 ${now ? "border-slate bg-slate text-white" : done ? "border-rule bg-slate-soft text-ink" : "border-rule text-ink-faint"}`}
            >
              <span aria-hidden="true">{done ? "● " : now ? "◐ " : "○ "}</span>
              {PROGRESS_STEP_LABELS[s]}
            </li>
          );
        })}
      </ol>
    </div>
  );
}

function StateWord({ r }: { r: RevisionView }) {
  if (r.state === "ready") return <StateTag>● Ready</StateTag>;
  if (r.state === "generating") return <StateTag>◐ Generating</StateTag>;
  return (
    <span className="inline-flex items-center whitespace-nowrap rounded-[2px] border border-signal bg-signal px-1.5 py-0.5 text-xs font-semibold text-white">
      ■ Failed
    </span>
  );
}

function RevisionsTable({ rows, canSend }: { rows: RevisionView[]; canSend: boolean }) {
  return (
    <div className="sheet overflow-x-auto">
      <table className="data-table" aria-label="Revisions">
        <thead>
          <tr>
            <th>Revision</th>
            <th>Generated</th>
            <th>By</th>
            <th>State</th>
            <th>Packet</th>
            <th>Review</th>
            <th className="text-right">Pages</th>
            <th>SHA-256</th>
            <th>Download</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id}>
              <td className="figure font-medium">Rev {r.number}</td>
              <td className="figure text-xs">{r.createdAt.slice(0, 16).replace("T", " ")}</td>
              <td>{r.createdByName ?? "—"}</td>
              <td>
                <StateWord r={r} />
                {r.state === "failed" && r.error ? <p className="mt-1 max-w-xs text-xs text-signal">{r.error}</p> : null}
                {r.state === "generating" ? <p className="mt-1 text-xs text-ink-soft">{PROGRESS_STEP_LABELS[r.progressStep as ProgressStep] ?? r.progressStep}</p> : null}
              </td>
              <td>{r.state === "failed" ? "—" : r.isDraft ? <span className="text-signal">Draft</span> : "Complete"}</td>
              <td>
                {r.state === "failed" ? "—" : <StateTag>{REVIEW_STATE_LABELS[r.reviewState] ?? r.reviewState}</StateTag>}
                {canSend && r.state === "ready" ? (
                  <div className="mt-1">
                    <SendForReviewButton
                      revisionId={r.id}
                      reviewState={r.reviewState}
                      number={r.number}
                      supersededBy={rows.filter((o) => o.number > r.number && o.state !== "failed").reduce<number | null>((n, o) => (n === null || o.number > n ? o.number : n), null)}
                    />
                  </div>
                ) : null}
              </td>
              <td className="figure text-right">{r.pageCount ?? "—"}</td>
              <td className="figure text-xs">
                <span title={r.pdfSha256 ?? undefined}>PDF {shortSha(r.pdfSha256)}</span>
                <br />
                <span title={r.docxSha256 ?? undefined}>DOCX {shortSha(r.docxSha256)}</span>
                <br />
                <span title={r.recordSha256} className="text-ink-faint">
                  record {shortSha(r.recordSha256)}
                </span>
              </td>
              <td className="whitespace-nowrap">
                {r.pdfUrl ? (
                  <a href={r.pdfUrl} download aria-label={`PDF of revision ${r.number}`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
                    PDF
                  </a>
                ) : null}
                {r.pdfUrl && r.docxUrl ? " · " : null}
                {r.docxUrl ? (
                  <a href={r.docxUrl} download aria-label={`DOCX of revision ${r.number}`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
                    DOCX
                  </a>
                ) : null}
                {!r.pdfUrl && !r.docxUrl ? <span className="text-ink-faint">—</span> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function PacketPanel({ projectId, canGenerate, canDecide = false }: { projectId: string; canGenerate: boolean; canDecide?: boolean }) {
  const client = useQueryClient();
  const preflight = useQuery({
    queryKey: ["packet-preflight", projectId],
    queryFn: () => fetchJson<Preflight>(`/api/projects/${projectId}/revisions/preflight`),
    staleTime: 0,
  });
  const revisions = useQuery({
    queryKey: ["revisions", projectId],
    queryFn: () => fetchJson<{ revisions: RevisionView[] }>(`/api/projects/${projectId}/revisions`),
    staleTime: 0,
    refetchInterval: (query) => (query.state.data?.revisions.some((r) => r.state === "generating") ? POLL_MS : false),
  });
  const generate = useMutation({
    mutationFn: () => fetchJson<{ revisionId: string; number: number }>(`/api/projects/${projectId}/revisions`, { method: "POST" }),
    onSettled: () => client.invalidateQueries({ queryKey: ["revisions", projectId] }),
  });

  const rows = revisions.data?.revisions ?? [];
  const running = rows.find((r) => r.state === "generating");
  // A stamped set rendered again after approval does not hold up a new revision.
  const blocking = rows.some((r) => r.state === "generating" && r.reviewState === "draft");
  const pre = preflight.data;
  const asDraft = pre?.isDraft ?? false;

  return (
    <div>
      <Section title="Before generating" label="Preflight">
        {preflight.isPending ? (
          <p role="status" className="text-sm text-ink-soft">
            Reading the documents, checks and labels…
          </p>
        ) : preflight.isError ? (
          <ErrorBox title="The preflight could not be read." message={preflight.error.message} retry={() => preflight.refetch()} />
        ) : (
          <PreflightList pre={preflight.data} projectId={projectId} />
        )}
        {canGenerate ? (
          <div className="mt-4 flex flex-wrap items-center gap-3 border-t border-grid pt-3">
            <button type="button" className="btn" disabled={generate.isPending || blocking || !pre} onClick={() => generate.mutate()}>
              {asDraft ? "Generate packet as draft" : "Generate packet"}
            </button>
            <p className="text-xs text-ink-soft">
              {asDraft
                ? `A draft says so on its cover and lists what is missing: ${pre?.draftReasons.join("; ")}.`
                : "Every page is marked for review by a licensed professional until a reviewer approves this exact revision."}
            </p>
          </div>
        ) : null}
        {generate.isError ? (
          <p role="alert" className="mt-2 text-sm text-signal">
            {generate.error.message}
          </p>
        ) : null}
      </Section>

      {running ? <Progress revision={running} /> : null}
      {!running && rows[0]?.state === "failed" ? (
        <div role="alert" className="sheet mb-4 border-l-4 border-l-signal px-4 py-3 text-sm">
          <p className="font-semibold">Revision {rows[0].number} failed; nothing was stored for it.</p>
          <p className="mt-1 text-ink-soft">{rows[0].error}</p>
        </div>
      ) : null}

      <h2 className="mb-2 text-sm font-semibold tracking-tight">Revisions</h2>
      {revisions.isPending ? (
        <p role="status" className="sheet px-4 py-6 text-sm text-ink-soft">
          Loading revisions…
        </p>
      ) : revisions.isError ? (
        <ErrorBox title="The revisions could not be loaded." message={revisions.error.message} retry={() => revisions.refetch()} />
      ) : rows.length === 0 ? (
        <p className="sheet px-4 py-8 text-center text-sm text-ink-soft">No packet generated yet.</p>
      ) : (
        <RevisionsTable rows={rows} canSend={canGenerate} />
      )}

      <h2 className="mb-2 mt-6 text-sm font-semibold tracking-tight">Review record</h2>
      <ReviewHistory projectId={projectId} asDesigner={canGenerate} asReviewer={canDecide} />
    </div>
  );
}
