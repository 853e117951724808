import type { Metadata } from "next";
import Link from "next/link";
import { RefreshWhile } from "@/components/reviews/refresh-while";
import { RestampButton } from "@/components/reviews/restamp-button";
import { ReviewDesk } from "@/components/reviews/review-desk";
import { ReviewHistoryList } from "@/components/reviews/review-history";
import { SignPacketForm } from "@/components/reviews/sign-packet-form";
import { SendForReviewButton } from "@/components/reviews/send-for-review-button";
import { WhatChanged } from "@/components/reviews/what-changed";
import { Field, PageHeader, Refusal } from "@/components/ui/page-header";
import { StateTag } from "@/components/ui/status-badge";
import { orNotFound, pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { getReviewWorkspace } from "@/lib/services/reviews";
import { REVIEW_STATE_LABELS } from "@/lib/services/revisions/steps";

export const metadata: Metadata = { title: "Review" };

function Notice({ tone, title, children }: { tone: "signal" | "caution" | "query" | "ok"; title: string; children?: React.ReactNode }) {
  const border = { signal: "border-l-signal", caution: "border-l-caution", query: "border-l-query", ok: "border-l-ok" }[tone];
  const shape = { signal: "■", caution: "▲", query: "◇", ok: "●" }[tone];
  return (
    <div role={tone === "signal" ? "alert" : "note"} className={`sheet mb-4 border-l-4 ${border} px-4 py-3 text-sm`}>
      <p className="font-semibold">
        <span aria-hidden="true">{shape} </span>
        {title}
      </p>
      {children ? <div className="mt-1 max-w-prose leading-relaxed text-ink-soft">{children}</div> : null}
    </div>
  );
}

export default async function ReviewPage({ params }: { params: Promise<{ revisionId: string }> }) {
  const { ctx, allowed } = await pageContext("review:read");
  if (!allowed) return <Refusal message="Reviews are open to designers, reviewers, the permit office and administrators." />;
  const { revisionId } = await params;
  const ws = orNotFound(() => getReviewWorkspace(ctx, revisionId));
  const { revision: rev, project } = ws;
  const today = new Date().toISOString().slice(0, 10);
  const approval = ws.history.find((h) => h.decision === "approved" && h.boundToRevision);
  const stampedRendering = rev.reviewState === "approved" && rev.state === "generating";

  return (
    <>
      <RefreshWhile active={stampedRendering} />
      <PageHeader title={project.name} sheet={`Review · Revision ${rev.number}`}>
        <StateTag>{REVIEW_STATE_LABELS[rev.reviewState] ?? rev.reviewState}</StateTag>
        {/* Kept mounted after sending, so its confirmation stays on screen once the state has moved on. */}
        {can(ctx.roles, "review:send") && rev.state === "ready" ? <SendForReviewButton revisionId={rev.id} reviewState={rev.reviewState} number={rev.number} failCount={ws.counts?.fail ?? 0} supersededBy={ws.supersededBy} /> : null}
        {ws.licence !== null || ws.mayDecide ? (
          <Link href="/reviews/licence" className="btn-quiet">
            Your licence and stamp
          </Link>
        ) : null}
        <Link href="/reviews" className="btn-quiet">
          Review queue
        </Link>
      </PageHeader>

      <section aria-label="Revision and project" className="sheet mb-5 grid gap-4 px-5 py-4 text-sm sm:grid-cols-2 lg:grid-cols-4">
        <Field label="Project">
          <p className="font-medium">
            <Link href={`/projects/${project.id}/packet`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
              {project.name}
            </Link>
          </p>
          <p className="text-ink-soft">{project.client || "—"}</p>
          <p className="text-ink-soft">{project.address || "—"}</p>
        </Field>
        <Field label="Jurisdiction">
          <p>{project.jurisdictionName ?? "None chosen"}</p>
          <p className="figure text-ink-soft">{ws.edition ? `NEC ${ws.edition}` : "—"}</p>
        </Field>
        <Field label="Revision">
          <p className="figure">
            Rev {rev.number}
            {rev.isDraft ? <span className="ml-1 text-signal">(draft)</span> : null}
            {rev.pageCount ? <span className="text-ink-soft"> · {rev.pageCount} pages</span> : null}
          </p>
          <p className="text-ink-soft">
            Generated <span className="figure">{rev.createdAt.slice(0, 16).replace("T", " ")}</span>
            {rev.createdByName ? ` by ${rev.createdByName}` : ""}
          </p>
        </Field>
        <Field label="Record SHA-256">
          <p className="figure break-all text-xs" title={rev.recordSha256}>
            {rev.recordSha256}
          </p>
        </Field>
        {ws.counts ? (
          <div className="sm:col-span-2 lg:col-span-4">
            <p className="field-label">Checks in this revision</p>
            <p className="figure mt-0.5" data-testid="check-counts">
              <span className={ws.counts.fail ? "font-semibold text-signal" : ""}>{ws.counts.fail} failing</span> · {ws.counts["needs-input"]} needing input · {ws.counts.warning} warnings ·{" "}
              {ws.counts.attest} to confirm on site · {ws.counts.pass} passing · {ws.counts["not-applicable"]} not applicable
            </p>
          </div>
        ) : null}
      </section>

      {!ws.snapshotIntact ? (
        <Notice tone="signal" title="This revision's frozen record no longer matches its SHA-256">
          It cannot be approved. Ask the designer to generate a new revision from the project as it stands.
        </Notice>
      ) : null}
      {ws.recordChangedSince === true && rev.reviewState !== "approved" ? (
        <Notice tone="query" title="The project has changed since this revision was generated">
          You are reviewing the record frozen in revision {rev.number}: it is what the packet shows and what an approval stamps. The designer&apos;s later changes are not in it;
          they need a new revision and a new review.
        </Notice>
      ) : null}
      {ws.recordChangedSince === true && rev.reviewState === "approved" ? (
        <Notice tone="query" title="The project has changed since this revision was approved">
          The stamp covers revision {rev.number} only. Build from this revision, or review a new one that carries the changes.
        </Notice>
      ) : null}
      {ws.recordChangedSince === null ? (
        <Notice tone="caution" title="The project as it stands could not be compared with this revision">
          Its stored record no longer validates; the revision&apos;s own snapshot is unaffected.
        </Notice>
      ) : null}
      {ws.decisionRefusal ? (
        <Notice tone="signal" title="You cannot decide this revision">
          {ws.decisionRefusal}
        </Notice>
      ) : null}
      {rev.reviewState === "draft" ? (
        <Notice tone="caution" title="Not sent for review">
          The designer has not sent this revision for review yet.
        </Notice>
      ) : null}
      {approval ? (
        <Notice tone="ok" title={`Approved and stamped by ${approval.reviewerName} on ${approval.createdAt.slice(0, 10)}`}>
          Licence {approval.licence?.licenceNumber} ({approval.licence?.region}, {approval.licence?.discipline}). Bound to record SHA-256{" "}
          <span className="figure break-all">{approval.approvedSha256}</span>.
          {ws.signature ? (
            <span className="mt-1 block" data-testid="signature">
              Digitally signed with {ws.signature.subjectName}&apos;s certificate on <span className="figure">{ws.signature.signedAt.slice(0, 16).replace("T", " ")}</span> UTC.
            </span>
          ) : rev.state === "ready" ? (
            <span className="mt-1 block">Not digitally signed.</span>
          ) : null}
          {ws.maySign && ws.certificate ? <SignPacketForm revisionId={rev.id} subjectName={ws.certificate.subjectName} /> : null}
        </Notice>
      ) : null}
      {stampedRendering ? (
        <Notice tone="query" title="Rendering the stamped packet…">
          The approval is recorded. The packet is being rendered again with the stamp on every page; this page updates when it is ready.
        </Notice>
      ) : null}
      {rev.state === "failed" ? (
        <Notice tone="signal" title={rev.reviewState === "approved" ? "The stamped packet could not be rendered" : "This revision failed to generate"}>
          <p>{rev.error}</p>
          {rev.reviewState === "approved" ? (
            <div className="mt-2">
              <RestampButton revisionId={rev.id} />
            </div>
          ) : null}
        </Notice>
      ) : null}

      <div className="grid gap-8 xl:grid-cols-[minmax(0,7fr)_minmax(0,5fr)]">
        <section aria-labelledby="packet-heading" className="xl:sticky xl:top-4 xl:self-start">
          <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="packet-heading" className="text-base font-semibold tracking-tight">
              Packet
            </h2>
            {rev.pdfDownloadUrl ? (
              <a href={rev.pdfDownloadUrl} className="text-sm underline decoration-rule underline-offset-2 hover:decoration-ink">
                Download PDF
              </a>
            ) : null}
          </div>
          {rev.pdfViewUrl ? (
            <iframe
              // Page-width view without the thumbnail pane, so a sheet reads at a useful size beside the notes.
              src={`${rev.pdfViewUrl}#navpanes=0&view=FitH`}
              title={`Packet PDF, revision ${rev.number}`}
              className="sheet block h-[80vh] min-h-[32rem] w-full bg-white"
            />
          ) : (
            <p className="sheet px-4 py-10 text-center text-sm text-ink-soft">
              {rev.state === "generating" ? "The packet is being rendered." : "This revision has no PDF to show."}
            </p>
          )}
        </section>

        <div>
          {ws.delta ? <WhatChanged delta={ws.delta} message={ws.sendMessage} /> : null}
          {!ws.delta && ws.sendMessage ? (
            <Notice tone="query" title={`Message from ${ws.sendMessage.by ?? "the designer"}`}>
              <p className="whitespace-pre-line">{ws.sendMessage.text}</p>
            </Notice>
          ) : null}
          {ws.history.length ? (
            // Earlier decisions come first: the notes a returned revision was sent back with are what a second reading checks.
            <section aria-labelledby="history-heading" className="mb-8">
              <h2 id="history-heading" className="mb-3 text-base font-semibold tracking-tight">
                Decisions on this revision
              </h2>
              <div className="sheet px-5 py-4">
                <ReviewHistoryList entries={ws.history} asDesigner={can(ctx.roles, "review:send")} asReviewer={can(ctx.roles, "review:decide")} />
              </div>
            </section>
          ) : null}
          <ReviewDesk
            revisionId={rev.id}
            revisionNumber={rev.number}
            projectName={project.name}
            designerName={rev.createdByName}
            pageCount={rev.pageCount}
            recordSha256={rev.recordSha256}
            edition={ws.edition}
            groups={ws.groups}
            sheets={ws.sheets}
            attestCount={ws.counts?.attest ?? 0}
            mayDecide={ws.mayDecide}
            approveRefusals={[
              ...(ws.snapshotIntact ? [] : ["the revision's frozen record no longer matches its SHA-256"]),
              ...(ws.licenceCoverage ? [ws.licenceCoverage] : []),
              ...(rev.isDraft ? ["this revision is a draft (its cover lists what fails or is missing), so it can only be returned"] : []),
            ]}
            certificate={ws.certificate}
            reviewerName={ctx.user.name}
            licence={
              ws.licence
                ? {
                    licenceNumber: ws.licence.licenceNumber,
                    region: ws.licence.region,
                    discipline: ws.licence.discipline,
                    expiresOn: ws.licence.expiresOn,
                    blockers: ws.licence.blockers,
                  }
                : null
            }
            today={today}
          />
        </div>
      </div>
    </>
  );
}
