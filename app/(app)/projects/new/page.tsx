import type { Metadata } from "next";
import Link from "next/link";
import { NewProjectForm } from "@/components/workspace/new-project-form";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { listJurisdictions } from "@/lib/services/jurisdictions/list";
import { listTemplates } from "@/lib/services/templates/list";

export const metadata: Metadata = { title: "New project" };

export default async function NewProjectPage() {
  const { ctx, allowed } = await pageContext("project:create");
  if (!allowed) return <Refusal message="Designers create projects." />;
  const jurisdictions = listJurisdictions(ctx).map((j) => ({ id: j.id, name: j.name, necEdition: j.necEdition }));
  const templates = listTemplates(ctx).map((t) => ({ id: t.id, name: t.name, description: t.description, systemKind: t.systemKind }));
  return (
    <>
      <PageHeader title="New project" sheet="Start a design">
        <Link href="/projects/templates" className="btn-quiet">
          Templates
        </Link>
        <Link href="/projects/new/import" className="btn-quiet">
          Import project file
        </Link>
      </PageHeader>
      <NewProjectForm jurisdictions={jurisdictions} templates={templates} />
    </>
  );
}
