import type { Metadata } from "next";
import { ProjectEditor } from "@/components/workspace/project-editor";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { loadProject } from "./load-project";

export const metadata: Metadata = { title: "Design" };

export default async function ProjectDesignPage({ params }: { params: Promise<{ id: string }> }) {
  const { ctx, allowed } = await pageContext("project:read");
  if (!allowed) return null;
  const { id } = await params;
  const loaded = loadProject(ctx, id);
  if (!loaded.ok) {
    return (
      <div role="alert" className="sheet border-l-4 border-l-signal px-4 py-4 text-sm">
        <p className="font-semibold">{loaded.message}</p>
        <ul className="figure mt-2 text-xs">
          {loaded.issues.map((i, n) => (
            <li key={n}>
              {i.path}: {i.message}
            </li>
          ))}
        </ul>
      </div>
    );
  }
  return (
    <ProjectEditor
      key={`${loaded.stored.projectId}`}
      projectId={loaded.stored.projectId}
      version={loaded.stored.version}
      record={loaded.stored.record}
      canEdit={can(ctx.roles, "project:edit")}
    />
  );
}
