import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { packetRevisions } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { deliverLater } from "../../jobs";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { moveProjectStatus } from "../projects/status";
import { activeReviewers, deliverAfterCommit, findRevisionForReview, snapshotRun, supersedingRevision } from "./shared";

/** Long enough to answer a reviewer's notes point by point. */
export const SEND_MESSAGE_MAX_CHARS = 4000;

export interface SendOptions {
  /** What the designer says with the revision; required when checks fail (why it should be reviewed anyway). */
  message?: string;
  /** Delivers the queued mail after commit; the outbox's SMTP delivery unless given. */
  deliver?: (db: Db, orgId: string) => Promise<unknown>;
}

export interface SentForReview {
  revisionId: string;
  number: number;
  reviewState: "in-review";
  /** Names of the reviewers who were e-mailed. */
  reviewers: string[];
  message: string;
}

/**
 * Puts a generated revision in the reviewers' queue: the revision and its
 * project become "in review" and every active reviewer of the organisation is
 * e-mailed, in one transaction. A revision returned with notes may be sent
 * again unchanged (the designer answers that no change is needed); a revision
 * already waiting or approved may not.
 */
export async function sendForReview(ctx: ServiceContext, revisionId: string, options: SendOptions = {}): Promise<SentForReview> {
  requirePermission(ctx, "review:send", "send packets for review");
  const { row, project } = findRevisionForReview(ctx, revisionId);
  if (row.state === "generating") throw conflict(`Revision ${row.number} is still being generated; send it when it is ready.`);
  if (row.state === "failed") throw conflict(`Revision ${row.number} failed to generate and has no packet to review; generate a new revision.`);
  if (row.reviewState === "in-review") throw conflict(`Revision ${row.number} is already waiting for review.`);
  if (row.reviewState === "approved") throw conflict(`Revision ${row.number} is already approved and stamped.`);
  const later = supersedingRevision(ctx, row);
  if (later) throw conflict(`Revision ${row.number} is superseded by revision ${later.number}; send revision ${later.number} instead.`);
  const reviewers = activeReviewers(ctx.db, ctx.orgId);
  if (reviewers.length === 0) {
    throw conflict("Your organisation has no active reviewer to send this to; ask an administrator to give a licensed professional the reviewer role.");
  }
  const run = snapshotRun(row);
  const counts = run?.counts;
  const message = (options.message ?? "").trim();
  if (message.length > SEND_MESSAGE_MAX_CHARS) throw invalid(`The message is too long.`, [{ path: "message", message: `must be at most ${SEND_MESSAGE_MAX_CHARS} characters` }]);
  if ((counts?.fail ?? 0) > 0 && !message) {
    throw invalid(`Revision ${row.number} has ${counts!.fail} failing check${counts!.fail === 1 ? "" : "s"}; say in a message why it should be reviewed as it is.`, [
      { path: "message", message: "is required when checks fail" },
    ]);
  }

  ctx.db.transaction((tx) => {
    const moved = tx
      .update(packetRevisions)
      .set({ reviewState: "in-review" })
      .where(and(eq(packetRevisions.id, row.id), eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.state, "ready"), inArray(packetRevisions.reviewState, ["draft", "returned"])))
      .run();
    // Another request sent or decided it between our read and this write.
    if (moved.changes === 0) throw conflict(`Revision ${row.number} changed while it was being sent; reload the page.`);
    // A permitted or installed project keeps its status: a revised set goes to the AHJ as a new submission.
    moveProjectStatus(tx, ctx, project.id, "in-review", { reason: "review.sent", ifAllowed: true });
    for (const reviewer of reviewers) {
      queueEmail(tx, ctx.orgId, reviewer.email, "sent-for-review", {
        reviewerName: reviewer.name,
        designerName: ctx.user.name,
        projectName: project.name,
        address: project.address || "no address recorded",
        revisionNumber: row.number,
        failCount: counts?.fail ?? 0,
        warningCount: counts?.warning ?? 0,
        needsInputCount: counts?.["needs-input"] ?? 0,
        attestCount: counts?.attest ?? 0,
        message,
        projectId: project.id,
        revisionId: row.id,
      });
    }
    audit(tx, ctx, "review.sent", "packet_revision", row.id, {
      projectId: project.id,
      number: row.number,
      recordSha256: row.recordSha256,
      resent: row.reviewState === "returned",
      ...(message ? { message, senderName: ctx.user.name } : {}),
      reviewers: reviewers.map((r) => r.id),
    });
  });

  await deliverAfterCommit(options.deliver ?? deliverLater, ctx.db, ctx.orgId);
  const names = reviewers.map((r) => r.name);
  return {
    revisionId: row.id,
    number: row.number,
    reviewState: "in-review",
    reviewers: names,
    message: `Revision ${row.number} sent for review to ${names.join(", ")}.`,
  };
}
