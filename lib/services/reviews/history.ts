import "server-only";
import { and, desc, eq, inArray } from "drizzle-orm";
import { packetRevisions, reviewNotes, reviews, users, type LicenceSnapshot, type PacketRevision } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";
import { findProjectInOrg } from "../projects/load";
import type { NoteState } from "../../schemas/review-thread";
import { threadsFor, type NoteReplyView } from "./note-thread";
import { findRevisionForReview, noteTargetLabel, snapshotRun } from "./shared";

export interface ReviewNoteView {
  id: string;
  targetKind: "check" | "sheet" | "general";
  targetId: string;
  /** "Check: Conductor ampacity (PV-1)", "Sheet E-003 Calculations", "General". */
  targetLabel: string;
  text: string;
  /** Open until the designer marks it addressed; closed or reopened by the reviewer. */
  state: NoteState;
  replies: NoteReplyView[];
}

export interface ReviewEntry {
  id: string;
  revisionId: string;
  revisionNumber: number;
  decision: "returned" | "approved";
  reviewerName: string;
  createdAt: string;
  generalNotes: string;
  notes: ReviewNoteView[];
  licence: LicenceSnapshot | null;
  approvedSha256: string | null;
  /** An approval counts only for the record hash it was given for. */
  boundToRevision: boolean;
}

function entriesFor(ctx: ServiceContext, revisions: Pick<PacketRevision, "id" | "number" | "recordSha256" | "resultsSnapshot">[]): ReviewEntry[] {
  if (revisions.length === 0) return [];
  const byId = new Map(revisions.map((r) => [r.id, r]));
  const rows = ctx.db
    .select({ review: reviews, reviewerName: users.name })
    .from(reviews)
    .leftJoin(users, eq(users.id, reviews.reviewerId))
    .where(and(eq(reviews.orgId, ctx.orgId), inArray(reviews.revisionId, [...byId.keys()])))
    .orderBy(desc(reviews.createdAt))
    .all();
  const notes = rows.length
    ? ctx.db
        .select()
        .from(reviewNotes)
        .where(inArray(reviewNotes.reviewId, rows.map((r) => r.review.id)))
        .orderBy(reviewNotes.createdAt)
        .all()
    : [];
  const runs = new Map(revisions.map((r) => [r.id, snapshotRun(r)]));
  const threads = threadsFor(ctx, notes.map((n) => n.id));
  return rows.map(({ review, reviewerName }) => {
    const revision = byId.get(review.revisionId)!;
    const run = runs.get(review.revisionId) ?? null;
    return {
      id: review.id,
      revisionId: review.revisionId,
      revisionNumber: revision.number,
      decision: review.decision,
      reviewerName: review.licenceSnapshot?.reviewerName ?? reviewerName ?? "Reviewer",
      createdAt: review.createdAt,
      generalNotes: review.generalNotes,
      notes: notes
        .filter((n) => n.reviewId === review.id)
        .map((n) => ({ id: n.id, targetKind: n.targetKind, targetId: n.targetId, targetLabel: noteTargetLabel(n.targetKind, n.targetId, run), text: n.text, ...threads.get(n.id)! })),
      licence: review.licenceSnapshot ?? null,
      approvedSha256: review.approvedSha256,
      boundToRevision: review.decision === "approved" && review.approvedSha256 === revision.recordSha256,
    };
  });
}

/** Every decision on one revision, newest first, with its notes. */
export function listRevisionReviews(ctx: ServiceContext, revisionId: string): ReviewEntry[] {
  requirePermission(ctx, "review:read", "read reviews");
  const { row } = findRevisionForReview(ctx, revisionId);
  return entriesFor(ctx, [row]);
}

/** Every decision on any revision of a project, newest first: what the designer answers. */
export function listProjectReviews(ctx: ServiceContext, projectId: string): ReviewEntry[] {
  requirePermission(ctx, "review:read", "read reviews");
  const project = findProjectInOrg(ctx, projectId);
  const revisions = ctx.db
    .select({ id: packetRevisions.id, number: packetRevisions.number, recordSha256: packetRevisions.recordSha256, resultsSnapshot: packetRevisions.resultsSnapshot })
    .from(packetRevisions)
    .where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, project.id)))
    .all();
  return entriesFor(ctx, revisions);
}
