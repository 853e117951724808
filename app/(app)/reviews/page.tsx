import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { RevisionTable } from "@/components/ui/revision-table";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { getOwnLicence } from "@/lib/services/reviews";
import { listReviewQueue } from "@/lib/services/revisions/queues";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewQueuePage() {
  const { ctx, allowed } = await pageContext("review:read");
  if (!allowed) return <Refusal message="The review queue is for licensed reviewers." />;
  const rows = listReviewQueue(ctx);
  const waiting = rows.filter((r) => r.reviewState === "in-review");
  const done = rows.filter((r) => r.reviewState !== "in-review");
  const keepsLicence = can(ctx.roles, "licence:edit-own");
  const licence = keepsLicence ? getOwnLicence(ctx) : null;
  const blockers = keepsLicence ? (licence ? licence.blockers : ["no licence record is on file"]) : [];
  return (
    <>
      <PageHeader title="Review queue" sheet="Packet revisions sent for review">
        {keepsLicence ? (
          <Link href="/reviews/licence" className="btn-quiet">
            Your licence and stamp
          </Link>
        ) : null}
      </PageHeader>
      {blockers.length ? (
        <div role="note" className="sheet mb-6 border-l-4 border-l-caution px-4 py-3 text-sm">
          <p className="font-semibold">
            <span aria-hidden="true">▲ </span>
            You cannot approve yet: {blockers.join("; ")}.
          </p>
          <p className="mt-1 text-ink-soft">
            You can read and return revisions meanwhile.{" "}
            <Link href="/reviews/licence" className="underline underline-offset-2">
              Keep your licence and stamp
            </Link>
          </p>
        </div>
      ) : null}
      <section aria-labelledby="waiting" className="mb-8">
        <h2 id="waiting" className="field-label mb-2">
          Awaiting your review ({waiting.length})
        </h2>
        {waiting.length ? (
          <RevisionTable rows={waiting} label="Awaiting review" hrefFor={(r) => `/reviews/${r.revisionId}`} />
        ) : (
          <EmptyState>Nothing is waiting for review.</EmptyState>
        )}
      </section>
      <section aria-labelledby="decided">
        <h2 id="decided" className="field-label mb-2">
          Decided
        </h2>
        {done.length ? <RevisionTable rows={done} label="Decided" hrefFor={(r) => `/reviews/${r.revisionId}`} /> : <EmptyState>No decisions yet.</EmptyState>}
      </section>
    </>
  );
}
