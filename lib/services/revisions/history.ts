import { and, asc, eq, lte } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { packetRevisions, reviews, users, type PacketRevision } from "../../../db/schema";
import { describeRecordChanges } from "../../packet/revision-changes";
import type { RevisionHistoryEntry } from "../../packet/types";
import { projectRecordSchema, type ProjectRecord } from "../../schemas/project-record";

/**
 * The cover's revision history for a revision being rendered: every revision
 * of the project up to this one, each with its date, author and what changed
 * in the record since the one before (and the review that sent it back, so a
 * resubmittal says what it answers). Scoped to the revision's organisation.
 */
export function revisionHistoryFor(db: Db, row: PacketRevision): RevisionHistoryEntry[] {
  const rows = db
    .select({ id: packetRevisions.id, number: packetRevisions.number, createdAt: packetRevisions.createdAt, record: packetRevisions.recordSnapshot, by: users.name })
    .from(packetRevisions)
    .leftJoin(users, eq(users.id, packetRevisions.createdBy))
    .where(and(eq(packetRevisions.projectId, row.projectId), eq(packetRevisions.orgId, row.orgId), lte(packetRevisions.number, row.number)))
    .orderBy(asc(packetRevisions.number))
    .all();
  let previous: ProjectRecord | null = null;
  let previousId: string | null = null;
  const out: RevisionHistoryEntry[] = [];
  for (const r of rows) {
    const parsed = projectRecordSchema.safeParse(r.record);
    const record = parsed.success ? parsed.data : null;
    let change = record ? describeRecordChanges(previous, record) : "Record snapshot unreadable";
    if (previousId) {
      const returned = db
        .select({ id: reviews.id })
        .from(reviews)
        .where(and(eq(reviews.revisionId, previousId), eq(reviews.orgId, row.orgId), eq(reviews.decision, "returned")))
        .get();
      if (returned) change = `Answers the review of revision ${r.number - 1}. ${change}`;
    }
    out.push({ number: r.number, date: r.createdAt, change, by: r.by ?? "" });
    previous = record;
    previousId = r.id;
  }
  return out;
}
