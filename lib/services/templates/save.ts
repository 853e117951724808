import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { projectTemplates } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { designOf, parseTemplateDesign, templateNameSchema, type TemplateDesign } from "../../schemas/project-template";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { getProjectRecord } from "../projects/get-record";
import { findTemplateInOrg } from "./list";

function parseNames(input: unknown) {
  const parsed = templateNameSchema.safeParse(input);
  if (!parsed.success) throw invalid("The template was not saved: some fields are not valid.", formatIssues(parsed.error));
  return parsed.data;
}

function checkDesign(design: unknown): TemplateDesign {
  const parsed = parseTemplateDesign(design);
  if (!parsed.success) throw invalid("The template was not saved: its design has fields that are not valid.", formatIssues(parsed.error));
  return parsed.data as TemplateDesign;
}

/** A new template from a design (the seed's standard kits, an imported file). */
export function createTemplate(ctx: ServiceContext, input: { name: unknown; description?: unknown; design: unknown }): { id: string } {
  requirePermission(ctx, "project:create", "save project templates");
  const names = parseNames({ name: input.name, description: input.description });
  const design = checkDesign(input.design);
  return ctx.db.transaction((tx) => {
    const row = tx
      .insert(projectTemplates)
      .values({ ...names, systemKind: design.systemKind, design, orgId: ctx.orgId, createdBy: ctx.user.id })
      .returning({ id: projectTemplates.id })
      .get();
    audit(tx, ctx, "template.created", "project-template", row.id, { name: names.name });
    return row;
  });
}

/**
 * Saves a project's design as a template: a new one, or in place of an
 * existing one (`replaceTemplateId`) so a firm keeps its standard kit current.
 * The site, the names and the documents stay with the project.
 */
export function saveTemplateFromProject(
  ctx: ServiceContext,
  projectId: string,
  input: { name?: unknown; description?: unknown; replaceTemplateId?: unknown; expectedVersion?: unknown },
): { id: string; replaced: boolean } {
  requirePermission(ctx, "project:create", "save project templates");
  const design = checkDesign(designOf(getProjectRecord(ctx, projectId).record));
  if (typeof input.replaceTemplateId === "string" && input.replaceTemplateId) {
    const existing = findTemplateInOrg(ctx, input.replaceTemplateId);
    const version = typeof input.expectedVersion === "number" ? input.expectedVersion : existing.version;
    return ctx.db.transaction((tx) => {
      const updated = tx
        .update(projectTemplates)
        .set({ design, systemKind: design.systemKind, version: sql`${projectTemplates.version} + 1`, updatedAt: new Date().toISOString() })
        .where(and(eq(projectTemplates.id, existing.id), eq(projectTemplates.orgId, ctx.orgId), eq(projectTemplates.version, version)))
        .run();
      if (updated.changes === 0) throw conflict("Someone changed this template after you opened it; it was not replaced.");
      audit(tx, ctx, "template.replaced", "project-template", existing.id, { fromProject: projectId });
      return { id: existing.id, replaced: true };
    });
  }
  const created = createTemplate(ctx, { name: input.name, description: input.description, design });
  return { id: created.id, replaced: false };
}

/** Renames a template or changes its description; the design is left as it is. */
export function renameTemplate(ctx: ServiceContext, templateId: string, input: unknown, expectedVersion: number): { version: number } {
  requirePermission(ctx, "project:create", "edit project templates");
  const names = parseNames(input);
  const existing = findTemplateInOrg(ctx, templateId);
  return ctx.db.transaction((tx) => {
    const updated = tx
      .update(projectTemplates)
      .set({ ...names, version: sql`${projectTemplates.version} + 1`, updatedAt: new Date().toISOString() })
      .where(and(eq(projectTemplates.id, existing.id), eq(projectTemplates.orgId, ctx.orgId), eq(projectTemplates.version, expectedVersion)))
      .run();
    if (updated.changes === 0) throw conflict("Someone changed this template after you opened it. Reload to see their change; yours was not saved.");
    audit(tx, ctx, "template.renamed", "project-template", existing.id, { name: names.name });
    return { version: expectedVersion + 1 };
  });
}

/** Deletes a template; projects made from it keep their design (they copied it). */
export function deleteTemplate(ctx: ServiceContext, templateId: string): void {
  requirePermission(ctx, "project:create", "delete project templates");
  const existing = findTemplateInOrg(ctx, templateId);
  ctx.db.transaction((tx) => {
    tx.delete(projectTemplates).where(and(eq(projectTemplates.id, existing.id), eq(projectTemplates.orgId, ctx.orgId))).run();
    audit(tx, ctx, "template.deleted", "project-template", existing.id, { name: existing.name });
  });
}
