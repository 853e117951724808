import type { Metadata } from "next";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { RevisionTable } from "@/components/ui/revision-table";
import { pageContext } from "@/lib/auth/page-context";
import { listReviewQueue } from "@/lib/services/revisions/queues";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewQueuePage() {
  const { ctx, allowed } = await pageContext("review:read");
  if (!allowed) return <Refusal message="The review queue is for licensed reviewers." />;
  const rows = listReviewQueue(ctx);
  const waiting = rows.filter((r) => r.reviewState === "in-review");
  const done = rows.filter((r) => r.reviewState !== "in-review");
  return (
    <>
      <PageHeader title="Review queue" sheet="Packet revisions sent for review" />
      <section aria-labelledby="waiting" className="mb-8">
        <h2 id="waiting" className="field-label mb-2">
          Awaiting your review ({waiting.length})
        </h2>
        {waiting.length ? (
          <RevisionTable rows={waiting} label="Awaiting review" hrefFor={(r) => `/projects/${r.projectId}`} />
        ) : (
          <EmptyState>Nothing is waiting for review.</EmptyState>
        )}
      </section>
      <section aria-labelledby="decided">
        <h2 id="decided" className="field-label mb-2">
          Decided
        </h2>
        {done.length ? <RevisionTable rows={done} label="Decided" hrefFor={(r) => `/projects/${r.projectId}`} /> : <EmptyState>No decisions yet.</EmptyState>}
      </section>
    </>
  );
}
