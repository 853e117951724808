import type { Metadata } from "next";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { RevisionTable } from "@/components/ui/revision-table";
import { pageContext } from "@/lib/auth/page-context";
import { listApprovedForInstall } from "@/lib/services/revisions/queues";

export const metadata: Metadata = { title: "Approved sets" };

export default async function InstallPage() {
  const { ctx, allowed } = await pageContext("install:read");
  if (!allowed) return <Refusal message="Approved sets are for installers and the permit office." />;
  const rows = listApprovedForInstall(ctx);
  return (
    <>
      <PageHeader title="Approved sets" sheet="Stamped revisions to build from" />
      <p className="mb-4 max-w-prose text-sm text-ink-soft">
        Build only from a stamped revision. If what is on site differs from the approved set, stop and ask the designer for a new
        revision before the inspection.
      </p>
      {rows.length ? (
        <RevisionTable rows={rows} label="Approved sets" hrefFor={(r) => `/install/${r.revisionId}`} />
      ) : (
        <EmptyState>No approved sets yet.</EmptyState>
      )}
    </>
  );
}
