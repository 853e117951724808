import { and, desc, eq, sql } from "drizzle-orm";
import { circuits, jurisdictions, projects } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";
import { afterCursor, pageSize, toPage, type Page, type PageRequest } from "../page";

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

/** The organisation's projects, most recently updated first, one page at a time. */
export function listProjects(ctx: ServiceContext, request: PageRequest = {}): Page<ProjectListRow> {
  requirePermission(ctx, "project:read", "list projects");
  const limit = pageSize(request);
  const rows = ctx.db
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
    .where(and(eq(projects.orgId, ctx.orgId), afterCursor(request, projects.updatedAt, projects.id)))
    .orderBy(desc(projects.updatedAt), desc(projects.id))
    .limit(limit + 1)
    .all();
  return toPage(rows, limit, (r) => [r.updatedAt, r.id]);
}
