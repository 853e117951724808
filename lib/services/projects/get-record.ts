import "server-only";
import { projectRecordSchema, type ProjectRecord } from "../../schemas/project-record";
import { formatIssues } from "../../schemas/fields";
import { requirePermission, type ServiceContext } from "../context";
import { invalid } from "../errors";
import { loadProjectRows, rowsToRecord } from "./load";

export interface StoredProjectRecord {
  projectId: string;
  version: number;
  status: string;
  jurisdictionId: string | null;
  /** When the project was archived; null while it is on the projects list. */
  archivedAt: string | null;
  record: ProjectRecord;
}

/** The stored project as the engine's validated project record. */
export function getProjectRecord(ctx: ServiceContext, projectId: string): StoredProjectRecord {
  requirePermission(ctx, "project:read", "read projects");
  const rows = loadProjectRows(ctx, projectId);
  const parsed = projectRecordSchema.safeParse(rowsToRecord(rows));
  if (!parsed.success) {
    throw invalid("The stored project no longer passes validation; open it in the editor to correct it.", formatIssues(parsed.error));
  }
  return {
    projectId: rows.project.id,
    version: rows.project.version,
    status: rows.project.status,
    jurisdictionId: rows.project.jurisdictionId,
    archivedAt: rows.project.archivedAt,
    record: parsed.data,
  };
}
