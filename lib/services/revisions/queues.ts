import { and, desc, eq, inArray } from "drizzle-orm";
import { jurisdictions, packetRevisions, projects, submissions } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";
import { liveRecord, revisionMatchesLive } from "../projects/approval";
import { afterCursor, pageSize, toPage, type Page, type PageRequest } from "../page";

export interface RevisionQueueRow {
  revisionId: string;
  projectId: string;
  projectName: string;
  address: string;
  number: number;
  reviewState: string;
  isDraft: boolean;
  createdAt: string;
  jurisdictionName: string | null;
}

function revisionRows(ctx: ServiceContext, states: ("draft" | "in-review" | "returned" | "approved")[]): RevisionQueueRow[] {
  return ctx.db
    .select({
      revisionId: packetRevisions.id,
      projectId: projects.id,
      projectName: projects.name,
      address: projects.address,
      number: packetRevisions.number,
      reviewState: packetRevisions.reviewState,
      isDraft: packetRevisions.isDraft,
      createdAt: packetRevisions.createdAt,
      jurisdictionName: jurisdictions.name,
    })
    .from(packetRevisions)
    .innerJoin(projects, and(eq(projects.id, packetRevisions.projectId), eq(projects.orgId, ctx.orgId)))
    .leftJoin(jurisdictions, eq(jurisdictions.id, projects.jurisdictionId))
    // Only finished packets are reviewed or installed from; a failed or unfinished generation is never listed.
    .where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.state, "ready"), inArray(packetRevisions.reviewState, states)))
    .orderBy(desc(packetRevisions.createdAt))
    .all();
}

/** Revisions waiting for a reviewer, newest first. */
export function listReviewQueue(ctx: ServiceContext): RevisionQueueRow[] {
  requirePermission(ctx, "review:read", "read the review queue");
  return revisionRows(ctx, ["in-review", "returned", "approved"]);
}

/**
 * Approved revisions an installer works from: only those whose design is
 * still the project's live design. When the record changes after approval the
 * set is withdrawn from installers until a new revision is approved.
 */
export function listApprovedForInstall(ctx: ServiceContext): RevisionQueueRow[] {
  requirePermission(ctx, "install:read", "open approved sets");
  const rows = revisionRows(ctx, ["approved"]);
  if (rows.length === 0) return rows;
  const snapshots = new Map(
    ctx.db
      .select({ id: packetRevisions.id, recordSnapshot: packetRevisions.recordSnapshot })
      .from(packetRevisions)
      .where(and(eq(packetRevisions.orgId, ctx.orgId), inArray(packetRevisions.id, rows.map((r) => r.revisionId))))
      .all()
      .map((r) => [r.id, r]),
  );
  const lives = new Map<string, unknown>();
  return rows.filter((r) => {
    if (!lives.has(r.projectId)) lives.set(r.projectId, liveRecord(ctx, r.projectId));
    const snapshot = snapshots.get(r.revisionId);
    return snapshot ? revisionMatchesLive(snapshot, lives.get(r.projectId)) : false;
  });
}

export interface SubmissionQueueRow {
  submissionId: string;
  projectId: string;
  projectName: string;
  jurisdictionName: string;
  method: string;
  referenceNumber: string;
  status: string;
  revisionNumber: number;
  createdAt: string;
}

/** The organisation's submissions, newest first, one page at a time. */
export function listSubmissions(ctx: ServiceContext, request: PageRequest = {}): Page<SubmissionQueueRow> {
  requirePermission(ctx, "submission:read", "read submissions");
  const limit = pageSize(request);
  const rows = ctx.db
    .select({
      submissionId: submissions.id,
      projectId: projects.id,
      projectName: projects.name,
      jurisdictionName: jurisdictions.name,
      method: submissions.method,
      referenceNumber: submissions.referenceNumber,
      status: submissions.status,
      revisionNumber: packetRevisions.number,
      createdAt: submissions.createdAt,
    })
    .from(submissions)
    .innerJoin(projects, eq(projects.id, submissions.projectId))
    .innerJoin(jurisdictions, eq(jurisdictions.id, submissions.jurisdictionId))
    .innerJoin(packetRevisions, eq(packetRevisions.id, submissions.revisionId))
    .where(and(eq(submissions.orgId, ctx.orgId), afterCursor(request, submissions.createdAt, submissions.id)))
    .orderBy(desc(submissions.createdAt), desc(submissions.id))
    .limit(limit + 1)
    .all();
  return toPage(rows, limit, (r) => [r.createdAt, r.submissionId]);
}
