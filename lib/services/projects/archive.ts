import "server-only";
import { and, eq } from "drizzle-orm";
import { projects } from "../../../db/schema";
import { PROJECT_STATUS_LABELS } from "../../schemas/project-status";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict } from "../errors";
import { findProjectInOrg } from "./load";

/** Statuses in which someone else is working on the project: a reviewer or the permit office. */
const IN_OTHER_HANDS = new Set(["in-review", "submitted", "corrections"]);

/**
 * Puts a project away: it leaves the default projects list and stays whole,
 * with its revisions and documents, in the archived view. A project a
 * reviewer or the permit office is working on is not archived.
 */
export function archiveProject(ctx: ServiceContext, projectId: string): { archivedAt: string } {
  requirePermission(ctx, "project:edit", "archive projects");
  const project = findProjectInOrg(ctx, projectId);
  if (project.archivedAt) return { archivedAt: project.archivedAt };
  if (IN_OTHER_HANDS.has(project.status)) {
    const status = PROJECT_STATUS_LABELS[project.status].toLowerCase();
    throw conflict(`The project is ${status}; it can be archived once the review or the permit office is done with it.`);
  }
  const archivedAt = new Date().toISOString();
  ctx.db.transaction((tx) => {
    tx.update(projects).set({ archivedAt }).where(and(eq(projects.id, project.id), eq(projects.orgId, ctx.orgId))).run();
    audit(tx, ctx, "project.archived", "project", project.id, { status: project.status });
  });
  return { archivedAt };
}

/** Brings a project back from the archive to the projects list, as it was. */
export function restoreProject(ctx: ServiceContext, projectId: string): void {
  requirePermission(ctx, "project:edit", "restore projects");
  const project = findProjectInOrg(ctx, projectId);
  if (!project.archivedAt) return;
  ctx.db.transaction((tx) => {
    tx.update(projects).set({ archivedAt: null }).where(and(eq(projects.id, project.id), eq(projects.orgId, ctx.orgId))).run();
    audit(tx, ctx, "project.restored", "project", project.id, {});
  });
}
