import { and, eq, sql } from "drizzle-orm";
import { circuits, loads, projectEquipment, projects, pvArrays } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { projectRecordSchema, type ProjectRecordInput } from "../../schemas/project-record";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { findProjectInOrg } from "./load";
import { keepOwnLibraryLinks } from "./library-links";
import { recordToRows } from "./mapping";

/**
 * Replaces a project's design with a validated record, refusing a save made
 * from a stale version so nobody's work is overwritten silently. The
 * jurisdiction and attachments are not part of the save: they have their own
 * owners (the office, the uploader).
 */
export function saveProjectRecord(
  ctx: ServiceContext,
  projectId: string,
  input: ProjectRecordInput | unknown,
  expectedVersion: number,
): { version: number } {
  requirePermission(ctx, "project:edit", "edit projects");
  const parsed = projectRecordSchema.safeParse(input);
  if (!parsed.success) throw invalid("The project was not saved: some fields are not valid.", formatIssues(parsed.error));
  const project = findProjectInOrg(ctx, projectId);
  if (project.status === "approved" || project.status === "submitted" || project.status === "permitted") {
    // Editing is still allowed: the approved revision keeps its snapshot and the next revision needs review again.
  }
  const rows = recordToRows({ ...parsed.data, equipment: keepOwnLibraryLinks(ctx, parsed.data.equipment) } as never);
  return ctx.db.transaction((tx) => {
    const updated = tx
      .update(projects)
      .set({ ...rows.project, version: sql`${projects.version} + 1`, updatedAt: new Date().toISOString() })
      .where(and(eq(projects.id, project.id), eq(projects.orgId, ctx.orgId), eq(projects.version, expectedVersion)))
      .run();
    if (updated.changes === 0) {
      throw conflict("Someone saved this project after you opened it. Reload to see their changes; yours were not saved.");
    }
    tx.delete(projectEquipment).where(eq(projectEquipment.projectId, project.id)).run();
    tx.delete(pvArrays).where(eq(pvArrays.projectId, project.id)).run();
    tx.delete(circuits).where(eq(circuits.projectId, project.id)).run();
    tx.delete(loads).where(eq(loads.projectId, project.id)).run();
    if (rows.equipment.length) tx.insert(projectEquipment).values(rows.equipment.map((r) => ({ ...r, projectId: project.id }))).run();
    if (rows.arrays.length) tx.insert(pvArrays).values(rows.arrays.map((r) => ({ ...r, projectId: project.id }))).run();
    if (rows.circuits.length) tx.insert(circuits).values(rows.circuits.map((r) => ({ ...r, projectId: project.id }))).run();
    if (rows.loads.length) tx.insert(loads).values(rows.loads.map((r) => ({ ...r, projectId: project.id }))).run();
    audit(tx, ctx, "project.saved", "project", project.id, {
      fromVersion: expectedVersion,
      equipment: rows.equipment.length,
      circuits: rows.circuits.length,
    });
    return { version: expectedVersion + 1 };
  });
}
