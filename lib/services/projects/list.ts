import "server-only";
import { and, asc, desc, eq, isNotNull, isNull, or, sql, type SQL } from "drizzle-orm";
import { circuits, jurisdictions, projectEquipment, projects } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { projectListQuerySchema } from "../../schemas/project-list";
import { requirePermission, type ServiceContext } from "../context";
import { invalid } from "../errors";
import { afterCursor, afterCursorAscending, pageSize, toPage, type Page, type PageRequest } from "../page";

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
  archivedAt: string | null;
}

/** `%` and `_` in what the user typed are letters, not wildcards. */
const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * The organisation's projects, one page at a time: searched by name, client,
 * address or an equipment tag, narrowed by status, jurisdiction and system
 * kind, ordered by last change (newest first) or by name. Archived projects
 * are a separate view.
 */
export function listProjects(ctx: ServiceContext, request: PageRequest = {}, query: unknown = {}): Page<ProjectListRow> {
  requirePermission(ctx, "project:read", "list projects");
  const limit = pageSize(request);
  const parsed = projectListQuerySchema.safeParse(query);
  if (!parsed.success) throw invalid("The projects list cannot be filtered that way.", formatIssues(parsed.error));
  const q = parsed.data;

  const conditions: (SQL | undefined)[] = [eq(projects.orgId, ctx.orgId), q.archived ? isNotNull(projects.archivedAt) : isNull(projects.archivedAt)];
  if (q.status) conditions.push(eq(projects.status, q.status));
  if (q.jurisdictionId) conditions.push(eq(projects.jurisdictionId, q.jurisdictionId));
  if (q.systemKind) conditions.push(eq(projects.systemKind, q.systemKind));
  if (q.q) {
    const pattern = likePattern(q.q);
    conditions.push(
      or(
        sql`${projects.name} like ${pattern} escape '\\'`,
        sql`${projects.client} like ${pattern} escape '\\'`,
        sql`${projects.address} like ${pattern} escape '\\'`,
        sql`exists (select 1 from ${projectEquipment} where ${projectEquipment.projectId} = ${projects.id} and ${projectEquipment.tag} like ${pattern} escape '\\')`,
      ),
    );
  }
  const byName = q.sort === "name";
  conditions.push(byName ? afterCursorAscending(request, projects.name, projects.id) : afterCursor(request, projects.updatedAt, projects.id));

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
      archivedAt: projects.archivedAt,
    })
    .from(projects)
    .leftJoin(jurisdictions, and(eq(jurisdictions.id, projects.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .where(and(...conditions))
    .orderBy(...(byName ? [asc(projects.name), asc(projects.id)] : [desc(projects.updatedAt), desc(projects.id)]))
    .limit(limit + 1)
    .all();
  return toPage(rows, limit, (r) => (byName ? [r.name, r.id] : [r.updatedAt, r.id]));
}
