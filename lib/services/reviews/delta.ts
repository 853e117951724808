import "server-only";
import { and, desc, eq, inArray, lt } from "drizzle-orm";
import { auditLog, packetRevisions, reviews, type PacketRevision } from "../../../db/schema";
import { designOf, diffResults, diffValues, groupChanges, type ChangeGroup, type ResultChange } from "../../record-diff";
import { projectRecordSchema, type ProjectRecord } from "../../schemas/project-record";
import type { ServiceContext } from "../context";
import { listRevisionReviews, type ReviewEntry } from "./history";
import { snapshotRun } from "./shared";

export interface RevisionDelta {
  /** The earlier revision a reviewer decided on, which this one follows. */
  since: { revisionId: string; number: number; decision: "returned" | "approved" };
  /** Record fields old → new, grouped by item (attachments apart). */
  record: ChangeGroup[];
  attachments: { added: string[]; removed: string[] };
  /** Check results whose status or values changed. */
  results: ResultChange[];
  /** The earlier decisions with their notes, shown beside the changes that answer them. */
  earlier: ReviewEntry[];
}

function design(snapshot: unknown): ProjectRecord {
  const parsed = projectRecordSchema.safeParse(snapshot);
  return designOf((parsed.success ? parsed.data : snapshot) as ProjectRecord);
}

/**
 * What changed since the latest earlier revision of the same project that a
 * reviewer decided on: the reviewer of a revision that answers notes reads
 * the changes first, not the whole packet again. Null for a first review.
 * Computed from the two frozen snapshots, never from the live design.
 */
export function revisionDelta(ctx: ServiceContext, row: Pick<PacketRevision, "id" | "projectId" | "number" | "recordSnapshot" | "resultsSnapshot">): RevisionDelta | null {
  const decided = ctx.db
    .selectDistinct({ revisionId: reviews.revisionId })
    .from(reviews)
    .innerJoin(packetRevisions, eq(packetRevisions.id, reviews.revisionId))
    .where(and(eq(reviews.orgId, ctx.orgId), eq(packetRevisions.projectId, row.projectId), lt(packetRevisions.number, row.number)))
    .all()
    .map((r) => r.revisionId);
  if (decided.length === 0) return null;
  const prev = ctx.db
    .select()
    .from(packetRevisions)
    .where(and(eq(packetRevisions.orgId, ctx.orgId), inArray(packetRevisions.id, decided)))
    .orderBy(desc(packetRevisions.number))
    .get();
  if (!prev) return null;
  const earlier = listRevisionReviews(ctx, prev.id);
  const changes = diffValues(design(prev.recordSnapshot), design(row.recordSnapshot));
  const attachments = { added: [] as string[], removed: [] as string[] };
  for (const c of changes) {
    if (!c.group.startsWith("Attachment ") || c.field) continue;
    (c.kind === "added" ? attachments.added : attachments.removed).push(c.group.slice("Attachment ".length));
  }
  const record = groupChanges(changes.filter((c) => !(c.group.startsWith("Attachment ") && !c.field)));
  const results = diffResults(snapshotRun(prev)?.results ?? [], snapshotRun(row)?.results ?? []);
  return {
    since: { revisionId: prev.id, number: prev.number, decision: earlier[0]?.decision ?? "returned" },
    record,
    attachments,
    results,
    earlier,
  };
}

/** The designer's message sent with the revision, if any (kept in the audit row of the send). */
export function sendMessage(ctx: ServiceContext, revisionId: string): { text: string; by: string | null; at: string } | null {
  const row = ctx.db
    .select({ detail: auditLog.detail, at: auditLog.createdAt })
    .from(auditLog)
    .where(and(eq(auditLog.orgId, ctx.orgId), eq(auditLog.action, "review.sent"), eq(auditLog.entityId, revisionId)))
    .orderBy(desc(auditLog.createdAt))
    .get();
  const text = row && typeof row.detail.message === "string" ? row.detail.message : "";
  return text ? { text, by: typeof row!.detail.senderName === "string" ? row!.detail.senderName : null, at: row!.at } : null;
}
