import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { packetRevisions, users } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";
import { findProjectInOrg } from "../projects/load";
import { findRevisionInOrg, seesUnapproved, toRevisionView, type RevisionView } from "./view";

/** A project's revisions, newest first, failed ones included so the designer sees what went wrong. */
export function listProjectRevisions(ctx: ServiceContext, projectId: string): RevisionView[] {
  requirePermission(ctx, "packet:read", "read packets");
  const project = findProjectInOrg(ctx, projectId);
  const where = seesUnapproved(ctx)
    ? and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, project.id))
    : and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, project.id), eq(packetRevisions.reviewState, "approved"));
  return ctx.db
    .select({ row: packetRevisions, createdByName: users.name })
    .from(packetRevisions)
    .leftJoin(users, eq(users.id, packetRevisions.createdBy))
    .where(where)
    .orderBy(desc(packetRevisions.number))
    .all()
    .map(({ row, createdByName }) => toRevisionView(row, createdByName));
}

export function getRevision(ctx: ServiceContext, revisionId: string): RevisionView {
  requirePermission(ctx, "packet:read", "read packets");
  const { row, createdByName } = findRevisionInOrg(ctx, revisionId);
  return toRevisionView(row, createdByName);
}
