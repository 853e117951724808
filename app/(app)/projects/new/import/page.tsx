import type { Metadata } from "next";
import { ImportProjectForm } from "@/components/workspace/import-project-form";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { listJurisdictions } from "@/lib/services/jurisdictions/list";

export const metadata: Metadata = { title: "Import project file" };

export default async function ImportProjectPage() {
  const { ctx, allowed } = await pageContext("project:create");
  if (!allowed) return <Refusal message="Designers create projects." />;
  const jurisdictions = listJurisdictions(ctx).map((j) => ({ id: j.id, name: j.name, necEdition: j.necEdition }));
  return (
    <>
      <PageHeader title="Import project file" sheet="New project from a Sundocket project file" />
      <ImportProjectForm jurisdictions={jurisdictions} />
    </>
  );
}
