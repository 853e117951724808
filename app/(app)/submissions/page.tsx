import type { Metadata } from "next";
import Link from "next/link";
import { PrintButton } from "@/components/submissions/print-button";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { StateTag } from "@/components/ui/status-badge";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { listSubmissions } from "@/lib/services/revisions/queues";

export const metadata: Metadata = { title: "Submissions" };

export default async function SubmissionsPage() {
  const { ctx, allowed } = await pageContext("submission:read");
  if (!allowed) return <Refusal message="Submissions are kept by the permit office." />;
  const rows = listSubmissions(ctx);
  return (
    <>
      <PageHeader title="Submissions" sheet="Permit applications by jurisdiction">
        {rows.length ? <PrintButton /> : null}
        {can(ctx.roles, "submission:create") ? (
          <Link href="/submissions/new" className="btn no-print">
            New submission
          </Link>
        ) : null}
      </PageHeader>
      {rows.length === 0 ? (
        <EmptyState>No submissions yet.</EmptyState>
      ) : (
        <div className="sheet overflow-x-auto">
          <table className="data-table" aria-label="Submissions">
            <thead>
              <tr>
                <th>Project</th>
                <th>Jurisdiction</th>
                <th>Revision</th>
                <th>Method</th>
                <th>Reference</th>
                <th>Latest event</th>
                <th>Submitted</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((s) => (
                <tr key={s.submissionId}>
                  <td className="font-medium">
                    <Link href={`/submissions/${s.submissionId}`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
                      {s.projectName}
                    </Link>
                  </td>
                  <td>{s.jurisdictionName}</td>
                  <td className="figure">Rev {s.revisionNumber}</td>
                  <td>{s.method}</td>
                  <td className="figure">{s.referenceNumber || "—"}</td>
                  <td>
                    <StateTag>{s.status}</StateTag>
                  </td>
                  <td className="figure text-xs text-ink-soft">{s.createdAt.slice(0, 10)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
