import type { Metadata } from "next";
import Link from "next/link";
import { NewSubmissionForm } from "@/components/submissions/new-submission-form";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { listSubmittableRevisions } from "@/lib/services/submissions";

export const metadata: Metadata = { title: "New submission" };

export default async function NewSubmissionPage() {
  const { ctx, allowed } = await pageContext("submission:create");
  if (!allowed) return <Refusal message="Packets are submitted by the permit office." />;
  const rows = listSubmittableRevisions(ctx);
  const today = new Date().toISOString().slice(0, 10);
  return (
    <>
      <PageHeader title="New submission" sheet="Approved revisions not yet submitted">
        <Link href="/submissions" className="btn-quiet">
          All submissions
        </Link>
      </PageHeader>
      <p className="mb-4 max-w-prose text-sm text-ink-soft">
        Only a revision a licensed reviewer has approved and stamped is listed. Submitting records what was sent; the jurisdiction decides on the permit.
      </p>
      {rows.length === 0 ? (
        <EmptyState>No approved revision is waiting to be submitted.</EmptyState>
      ) : (
        <ul className="grid gap-4">
          {rows.map((r) => {
            const label = `${r.projectName}, revision ${r.revisionNumber}`;
            return (
              <li key={r.revisionId} className="sheet px-5 py-4">
                <div className="mb-3 flex flex-wrap items-baseline gap-x-4 gap-y-1">
                  <h2 className="font-semibold">{r.projectName}</h2>
                  <p className="text-sm">{r.jurisdictionName}</p>
                  <p className="figure text-sm">Rev {r.revisionNumber}</p>
                  <p className="figure text-xs text-ink-soft">generated {r.generatedAt.slice(0, 10)}</p>
                </div>
                <NewSubmissionForm revisionId={r.revisionId} label={label} defaultMethod={r.defaultMethod} today={today} />
              </li>
            );
          })}
        </ul>
      )}
    </>
  );
}
