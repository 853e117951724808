import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { packetRevisions, type PacketRevision } from "../../../db/schema";
import { canonicalJson } from "../../canonical-json";
import { designOf, diffValues, groupChanges, type ChangeGroup } from "../../record-diff";
import { projectRecordSchema, type ProjectRecord } from "../../schemas/project-record";
import { requirePermission, type ServiceContext } from "../context";
import { loadProjectRows, rowsToRecord } from "./load";

export interface ApprovalDrift {
  revisionId: string;
  revisionNumber: number;
  /** Field by field, grouped by item: what the live record holds that the approved snapshot does not. */
  groups: ChangeGroup[];
  changeCount: number;
}

/** The record as the approval covers it: parsed with defaults, without installer photos, as canonical JSON. */
function designJson(record: unknown): string {
  const parsed = projectRecordSchema.safeParse(record);
  const value = (parsed.success ? parsed.data : record) as ProjectRecord;
  return canonicalJson(designOf(value));
}

/** The live record of a project, for comparisons inside services; the caller has checked its own permission. */
export function liveRecord(ctx: ServiceContext, projectId: string): unknown {
  return rowsToRecord(loadProjectRows(ctx, projectId));
}

/** True when the revision's frozen design is the project's live design: what may go to the AHJ or to installers. */
export function revisionMatchesLive(revision: Pick<PacketRevision, "recordSnapshot">, live: unknown): boolean {
  return designJson(revision.recordSnapshot) === designJson(live);
}

/**
 * Whether the project's record changed after its latest approval, and how.
 * Null when no revision is approved or the design is unchanged. Until a new
 * revision is approved, a changed project is not offered for submission or to
 * installers as an approved set.
 */
export function approvalDrift(ctx: ServiceContext, projectId: string): ApprovalDrift | null {
  requirePermission(ctx, "project:read", "read projects");
  const approved = ctx.db
    .select()
    .from(packetRevisions)
    .where(and(eq(packetRevisions.projectId, projectId), eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.reviewState, "approved")))
    .orderBy(desc(packetRevisions.number))
    .get();
  if (!approved) return null;
  const live = liveRecord(ctx, projectId);
  if (revisionMatchesLive(approved, live)) return null;
  const parse = (r: unknown) => {
    const p = projectRecordSchema.safeParse(r);
    return designOf((p.success ? p.data : r) as ProjectRecord);
  };
  const changes = diffValues(parse(approved.recordSnapshot), parse(live));
  return { revisionId: approved.id, revisionNumber: approved.number, groups: groupChanges(changes), changeCount: changes.length };
}
