import type { Metadata } from "next";
import Link from "next/link";
import { DigestButton } from "@/components/submissions/digest-button";
import { PrintButton } from "@/components/submissions/print-button";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { QueueTable } from "@/components/submissions/queue-table";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { listSubmissionQueue } from "@/lib/services/submissions";

export const metadata: Metadata = { title: "Submissions" };

export default async function SubmissionsPage() {
  const { ctx, allowed } = await pageContext("submission:read");
  if (!allowed) return <Refusal message="Submissions are kept by the permit office." />;
  const rows = listSubmissionQueue(ctx);
  const printedOn = new Date().toISOString().slice(0, 10);
  return (
    <>
      <PageHeader title="Submissions" sheet="Permit applications by jurisdiction">
        {can(ctx.roles, "submission:record-event") ? <DigestButton /> : null}
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
        <QueueTable rows={rows} today={printedOn} />
      )}
      <p className="mt-3 hidden text-xs print:block">Local codes and the Authority Having Jurisdiction govern. Dates are calendar days in UTC.</p>
    </>
  );
}
