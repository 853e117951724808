import type { Metadata } from "next";
import Link from "next/link";
import { PrintButton } from "@/components/submissions/print-button";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { StateTag } from "@/components/ui/status-badge";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { listSubmissionQueue } from "@/lib/services/submissions";

export const metadata: Metadata = { title: "Submissions" };

const METHOD_LABELS = { portal: "portal", email: "e-mail", counter: "counter" } as const;

export default async function SubmissionsPage() {
  const { ctx, allowed } = await pageContext("submission:read");
  if (!allowed) return <Refusal message="Submissions are kept by the permit office." />;
  const rows = listSubmissionQueue(ctx);
  const printedOn = new Date().toISOString().slice(0, 10);
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
            <caption className="hidden text-left text-xs print:table-caption">Submission queue as of {printedOn}</caption>
            <thead>
              <tr>
                <th>Project</th>
                <th>Jurisdiction</th>
                <th>Revision</th>
                <th>Method</th>
                <th>Reference</th>
                <th>Latest event</th>
                <th>On</th>
                <th>Permit</th>
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
                  <td className="figure whitespace-nowrap">Rev {s.revisionNumber}</td>
                  <td>{METHOD_LABELS[s.method]}</td>
                  <td className="figure whitespace-nowrap">{s.referenceNumber || "—"}</td>
                  <td>
                    <StateTag>{s.status}</StateTag>
                  </td>
                  <td className="figure whitespace-nowrap text-xs">{s.latestOn ?? "—"}</td>
                  <td className="figure whitespace-nowrap">{s.permitNumber ?? "—"}</td>
                  <td className="figure whitespace-nowrap text-xs text-ink-soft">{s.submittedOn ?? "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
