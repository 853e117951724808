import type { Metadata } from "next";
import Link from "next/link";
import { ProjectsTable } from "@/components/projects/projects-table";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { listJurisdictions } from "@/lib/services/jurisdictions/list";

export const metadata: Metadata = { title: "Projects" };

export default async function ProjectsPage() {
  const { ctx, allowed } = await pageContext("project:read");
  const canCreate = can(ctx.roles, "project:create");
  return (
    <>
      <PageHeader title="Projects" sheet="Designs in this organisation">
        {canCreate ? (
          <>
            <Link href="/projects/templates" className="btn-quiet">
              Templates
            </Link>
            <Link href="/projects/new/import" className="btn-quiet">
              Import project file
            </Link>
            <Link href="/projects/new" className="btn">
              New project
            </Link>
          </>
        ) : null}
      </PageHeader>
      {allowed ? (
        <ProjectsTable jurisdictions={listJurisdictions(ctx).map((j) => ({ id: j.id, name: j.name }))} canEdit={can(ctx.roles, "project:edit")} />
      ) : <Refusal message="Projects are open to designers, reviewers and the permit office." />}
    </>
  );
}
