import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { projectTemplates, type ProjectTemplate } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";
import { notFound } from "../errors";

export interface TemplateSummary {
  id: string;
  name: string;
  description: string;
  systemKind: string;
  equipmentCount: number;
  circuitCount: number;
  version: number;
  updatedAt: string;
}

function summarise(t: ProjectTemplate): TemplateSummary {
  return {
    id: t.id,
    name: t.name,
    description: t.description,
    systemKind: t.systemKind,
    equipmentCount: t.design.equipment.length,
    circuitCount: t.design.circuits.length,
    version: t.version,
    updatedAt: t.updatedAt,
  };
}

/** The organisation's project templates by name; a firm keeps a handful, so no paging. */
export function listTemplates(ctx: ServiceContext): TemplateSummary[] {
  requirePermission(ctx, "project:read", "see project templates");
  return ctx.db
    .select()
    .from(projectTemplates)
    .where(eq(projectTemplates.orgId, ctx.orgId))
    .orderBy(asc(projectTemplates.name))
    .all()
    .map(summarise);
}

/** One template of the actor's organisation, or not-found (also for another organisation's id). */
export function findTemplateInOrg(ctx: ServiceContext, templateId: string): ProjectTemplate {
  const row = ctx.db
    .select()
    .from(projectTemplates)
    .where(and(eq(projectTemplates.id, templateId), eq(projectTemplates.orgId, ctx.orgId)))
    .get();
  if (!row) throw notFound("Template");
  return row;
}
