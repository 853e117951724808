import { and, desc, eq, sql } from "drizzle-orm";
import { circuits, jurisdictions, projects } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";

export interface ProjectListRow {
  id: string;
  name: string;
  client: string;
  status: string;
  systemKind: string;
  address: string;
  jurisdictionName: string | null;
  necEdition: string | null;
  circuitCount: number;
  updatedAt: string;
}

export function listProjects(ctx: ServiceContext): ProjectListRow[] {
  requirePermission(ctx, "project:read", "list projects");
  return ctx.db
    .select({
      id: projects.id,
      name: projects.name,
      client: projects.client,
      status: projects.status,
      systemKind: projects.systemKind,
      address: projects.address,
      jurisdictionName: jurisdictions.name,
      necEdition: jurisdictions.necEdition,
      circuitCount: sql<number>`(select count(*) from ${circuits} where ${circuits.projectId} = ${projects.id})`,
      updatedAt: projects.updatedAt,
    })
    .from(projects)
    .leftJoin(jurisdictions, and(eq(jurisdictions.id, projects.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .where(eq(projects.orgId, ctx.orgId))
    .orderBy(desc(projects.updatedAt))
    .all();
}
