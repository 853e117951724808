import "server-only";
import { and, asc, eq } from "drizzle-orm";
import {
  attachments,
  circuits,
  jurisdictions,
  loads,
  projectEquipment,
  projects,
  pvArrays,
} from "../../../db/schema";
import type { ServiceContext } from "../context";
import { notFound } from "../errors";
import { rowsToRecord, type ProjectRows } from "./mapping";

/** A project of the actor's organisation, or not-found (also for other organisations' ids). */
export function findProjectInOrg(ctx: ServiceContext, projectId: string) {
  const project = ctx.db
    .select()
    .from(projects)
    .where(and(eq(projects.id, projectId), eq(projects.orgId, ctx.orgId)))
    .get();
  if (!project) throw notFound("Project");
  return project;
}

export function loadProjectRows(ctx: ServiceContext, projectId: string): ProjectRows {
  const project = findProjectInOrg(ctx, projectId);
  const { db } = ctx;
  const jurisdiction = project.jurisdictionId
    ? (db
        .select()
        .from(jurisdictions)
        .where(and(eq(jurisdictions.id, project.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
        .get() ?? null)
    : null;
  return {
    project,
    jurisdiction,
    equipment: db.select().from(projectEquipment).where(eq(projectEquipment.projectId, project.id)).orderBy(asc(projectEquipment.position)).all(),
    arrays: db.select().from(pvArrays).where(eq(pvArrays.projectId, project.id)).orderBy(asc(pvArrays.position)).all(),
    circuits: db.select().from(circuits).where(eq(circuits.projectId, project.id)).orderBy(asc(circuits.position)).all(),
    loads: db.select().from(loads).where(eq(loads.projectId, project.id)).orderBy(asc(loads.position)).all(),
    attachments: db
      .select()
      .from(attachments)
      .where(and(eq(attachments.projectId, project.id), eq(attachments.orgId, ctx.orgId)))
      .orderBy(asc(attachments.createdAt))
      .all(),
  };
}

export { rowsToRecord };
