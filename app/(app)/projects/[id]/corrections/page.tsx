import type { Metadata } from "next";
import { CorrectionList } from "@/components/corrections/correction-list";
import { EmptyState } from "@/components/ui/page-header";
import { orNotFound, pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { listProjectCorrections } from "@/lib/services/corrections";

export const metadata: Metadata = { title: "Corrections" };

/** The AHJ's plan-review comments on this project, worked one by one until the resubmittal answers them all. */
export default async function ProjectCorrectionsPage({ params }: { params: Promise<{ id: string }> }) {
  const { ctx, allowed } = await pageContext("correction:read");
  // The project layout shows the refusal.
  if (!allowed) return null;
  const { id } = await params;
  const view = orNotFound(() => listProjectCorrections(ctx, id));
  if (view.items.length === 0) {
    return <EmptyState>The AHJ has made no comments on this project. When the permit office records a corrections letter, its comments appear here.</EmptyState>;
  }
  const submissionIds = [...new Set(view.items.map((i) => i.submissionId))];
  return (
    <div className="space-y-4">
      <p className="text-sm" role="status">
        {view.open === 0 ? `All ${view.items.length} comments are resolved.` : `${view.open} of ${view.items.length} comments open.`}{" "}
        <span className="text-ink-soft">A resubmittal waits until every comment has a response.</span>
      </p>
      {submissionIds.map((sid, n) => (
        <section key={sid} aria-label={submissionIds.length > 1 ? `Submission ${n + 1} comments` : "Comments"} className="space-y-3">
          <div className="flex flex-wrap items-center gap-3">
            <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">{submissionIds.length > 1 ? `Submission ${n + 1}` : "The AHJ's comments"}</h2>
            <a href={`/api/submissions/${sid}/response-sheet`} className="btn-quiet text-xs" target="_blank" rel="noreferrer">
              Response sheet (PDF)
            </a>
          </div>
          <CorrectionList
            items={view.items.filter((i) => i.submissionId === sid)}
            assignable={view.assignable}
            canResolve={can(ctx.roles, "correction:resolve")}
            canAssign={can(ctx.roles, "correction:assign")}
            canPromote={can(ctx.roles, "jurisdiction:edit")}
          />
        </section>
      ))}
    </div>
  );
}
