import { ArchiveControl } from "@/components/workspace/archive-control";
import { ProjectTabs } from "@/components/workspace/project-tabs";
import { TitleBlock } from "@/components/workspace/title-block";
import { Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { openCorrectionCount } from "@/lib/services/corrections";
import { openNoteCount } from "@/lib/services/reviews/note-thread";
import { approvalDrift } from "@/lib/services/projects/approval";
import { loadProject } from "./load-project";

export default async function ProjectLayout({ children, params }: { children: React.ReactNode; params: Promise<{ id: string }> }) {
  const { ctx, allowed } = await pageContext("project:read");
  if (!allowed) return <Refusal message="Projects are open to designers, reviewers and the permit office." />;
  const { id } = await params;
  const loaded = loadProject(ctx, id);
  return (
    <>
      {loaded.ok ? (
        <TitleBlock
          name={loaded.stored.record.name}
          client={loaded.stored.record.client}
          address={loaded.stored.record.site.address}
          systemKind={loaded.stored.record.systemKind}
          jurisdiction={loaded.stored.record.jurisdiction.name}
          necEdition={loaded.stored.record.jurisdiction.necEdition}
          status={loaded.stored.status}
          version={loaded.stored.version}
          drift={approvalDrift(ctx, id)}
          notes={openNoteCount(ctx, id)}
        />
      ) : null}
      {loaded.ok ? <ArchiveControl projectId={id} archivedAt={loaded.stored.archivedAt} canEdit={can(ctx.roles, "project:edit")} /> : null}
      <ProjectTabs projectId={id} openCorrections={loaded.ok ? openCorrectionCount(ctx, id) : 0} />
      {children}
    </>
  );
}
