import type { Metadata } from "next";
import Link from "next/link";
import { EventForm } from "@/components/submissions/event-form";
import { PrintButton } from "@/components/submissions/print-button";
import { SubmissionTimeline } from "@/components/submissions/timeline";
import { Field, PageHeader, Refusal } from "@/components/ui/page-header";
import { StateTag } from "@/components/ui/status-badge";
import { orNotFound, pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { isProjectStatus, PROJECT_STATUS_LABELS } from "@/lib/schemas/project-status";
import { EVENT_LABELS } from "@/lib/schemas/submission";
import { listSubmissionCorrections } from "@/lib/services/corrections";
import { getSubmission } from "@/lib/services/submissions";

export const metadata: Metadata = { title: "Submission" };

const METHOD_LABELS = { portal: "Portal", email: "E-mail", counter: "Counter" } as const;

export default async function SubmissionPage({ params }: { params: Promise<{ submissionId: string }> }) {
  const { ctx, allowed } = await pageContext("submission:read");
  if (!allowed) return <Refusal message="Submissions are kept by the permit office." />;
  const { submissionId } = await params;
  const s = orNotFound(() => getSubmission(ctx, submissionId));
  const today = new Date().toISOString().slice(0, 10);
  const mayRecord = can(ctx.roles, "submission:record-event");
  const corrections = listSubmissionCorrections(ctx, s.id);

  return (
    <>
      <PageHeader title={s.projectName} sheet={`Submission · ${s.jurisdictionName}`}>
        <StateTag>{EVENT_LABELS[s.status]}</StateTag>
        <PrintButton label="Print" />
        <Link href="/submissions" className="btn-quiet no-print">
          All submissions
        </Link>
      </PageHeader>

      <section aria-label="Submission" className="sheet mb-5 grid gap-4 px-5 py-4 text-sm sm:grid-cols-2 lg:grid-cols-4">
        <Field label="Project">
          <p className="font-medium">{s.projectName}</p>
          <p className="text-ink-soft">{s.address || "—"}</p>
          <p className="text-ink-soft">Project status: {isProjectStatus(s.projectStatus) ? PROJECT_STATUS_LABELS[s.projectStatus] : s.projectStatus}</p>
        </Field>
        <Field label="Jurisdiction">
          <p>{s.jurisdictionName}</p>
          <p className="text-ink-soft">{METHOD_LABELS[s.method]}</p>
        </Field>
        <Field label="Revision">
          <p className="figure">
            <Link href={`/reviews/${s.revisionId}`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
              Rev {s.revisionNumber}
            </Link>
          </p>
          <p className="text-ink-soft">Designer: {s.designerName ?? "—"}</p>
        </Field>
        <Field label="Reference">
          <p className="figure">{s.referenceNumber || "—"}</p>
        </Field>
      </section>

      <h2 className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-soft">Timeline</h2>
      <SubmissionTimeline events={s.events} submissionId={s.id} version={s.version} mayVoid={mayRecord} revisionNumbers={s.revisionNumbers} />

      {corrections.items.length > 0 ? (
        <section aria-label="The AHJ's comments" className="mt-6">
          <div className="mb-2 flex flex-wrap items-center gap-3">
            <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">The AHJ&apos;s comments</h2>
            <span className="text-sm">{corrections.open === 0 ? "all answered" : `${corrections.open} of ${corrections.items.length} open`}</span>
            <a href={`/api/submissions/${s.id}/response-sheet`} className="btn-quiet no-print text-xs" target="_blank" rel="noreferrer">
              Response sheet (PDF)
            </a>
            <Link href={`/projects/${s.projectId}/corrections`} className="btn-quiet no-print text-xs">
              Work them on the project
            </Link>
          </div>
          <table className="data-table sheet" aria-label="Comments">
            <thead>
              <tr>
                <th>No.</th>
                <th>Comment</th>
                <th>Assigned to</th>
                <th>Response</th>
              </tr>
            </thead>
            <tbody>
              {corrections.items.map((c) => (
                <tr key={c.id}>
                  <td className="figure">{c.number}</td>
                  <td className="text-sm">
                    {c.comment}
                    {c.sheet || c.citation ? <span className="figure block text-xs text-ink-soft">{[c.sheet && `Sheet ${c.sheet}`, c.citation].filter(Boolean).join(" · ")}</span> : null}
                  </td>
                  <td className="text-sm">{c.assigneeName ?? "—"}</td>
                  <td className="text-sm">{c.open ? <span className="font-semibold text-signal">Open</span> : c.response}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}

      {mayRecord ? (
        <section aria-label="Next event" className="no-print mt-6">
          <h2 className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-soft">Record the next event</h2>
          {s.allowedNext.length === 0 ? (
            <p className="sheet px-4 py-4 text-sm text-ink-soft">This submission is {EVENT_LABELS[s.status].toLowerCase()}; a new application starts with a new submission.</p>
          ) : (
            <EventForm submissionId={s.id} version={s.version} status={s.status} today={today} allowedNext={s.allowedNext} resubmittable={s.resubmittable} assignable={corrections.assignable} defaultAssigneeId={corrections.assignable.find((a) => a.name === s.designerName)?.id} />
          )}
        </section>
      ) : null}
    </>
  );
}
