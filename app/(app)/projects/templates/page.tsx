import type { Metadata } from "next";
import Link from "next/link";
import { TemplatesTable } from "@/components/projects/templates-table";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { listTemplates } from "@/lib/services/templates/list";

export const metadata: Metadata = { title: "Project templates" };

export default async function TemplatesPage() {
  const { ctx, allowed } = await pageContext("project:read");
  if (!allowed) return <Refusal message="Templates are open to designers." />;
  const canEdit = can(ctx.roles, "project:create");
  return (
    <>
      <PageHeader title="Project templates" sheet="Standard kits to start a design from">
        {canEdit ? (
          <Link href="/projects/new" className="btn">
            New project
          </Link>
        ) : null}
      </PageHeader>
      <p className="mb-4 max-w-3xl text-sm text-ink-soft">
        A template holds a design without its site: equipment, arrays, circuits and loads. Save one from any project with{" "}
        <span className="font-medium text-ink">Save as template</span> in the editor, in place of an old one or as a new one.
      </p>
      <TemplatesTable initial={listTemplates(ctx)} canEdit={canEdit} />
    </>
  );
}
