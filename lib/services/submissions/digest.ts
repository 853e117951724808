import "server-only";
import { and, eq, sql } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { auditLog, userRoles, users } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { deliverLater } from "../../jobs";
import { EVENT_LABELS } from "../../schemas/submission";
import { audit, requirePermission, type ServiceContext } from "../context";
import { listSubmissionQueue } from "./list";
import { deliverAfterCommit, isoDay } from "./shared";

export interface DigestSent {
  day: string;
  recipients: number;
  overdue: number;
  expiring: number;
  /** True when the digest for the day had already gone and was not sent again. */
  skipped: boolean;
  message: string;
}

function officeUsers(db: Db, orgId: string) {
  return db
    .select({ name: users.name, email: users.email })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "office")))
    .where(and(eq(users.orgId, orgId), eq(users.active, true)))
    .orderBy(users.name)
    .all();
}

/**
 * The permit office's daily digest: submissions waiting longer than their
 * jurisdiction's typical review, and permits expiring within 30 days with no
 * final passed, mailed to every active office user. Days are calendar days in
 * UTC, weekends included (the queue's arithmetic, stated in the mail). The
 * scheduled command sends it once a day; the button sends it whenever asked.
 */
export async function sendOverdueDigest(
  ctx: ServiceContext,
  options: { now?: Date; onceADay?: boolean; deliver?: (db: Db, orgId: string) => Promise<unknown> } = {},
): Promise<DigestSent> {
  requirePermission(ctx, "submission:record-event", "send the permit office digest");
  const now = options.now ?? new Date();
  const day = isoDay(now);
  if (options.onceADay) {
    const already = ctx.db
      .select({ id: auditLog.id })
      .from(auditLog)
      // The day the digest covered, as recorded with it (the clock of the run, not of the row).
      .where(and(eq(auditLog.orgId, ctx.orgId), eq(auditLog.action, "digest.sent"), sql`json_extract(${auditLog.detail}, '$.day') = ${day}`))
      .get();
    if (already) return { day, recipients: 0, overdue: 0, expiring: 0, skipped: true, message: `The digest for ${day} was already sent.` };
  }
  const queue = listSubmissionQueue(ctx, { now });
  const overdue = queue.filter((q) => q.overdue);
  const expiring = queue.filter((q) => q.expiringSoon);
  const recipients = officeUsers(ctx.db, ctx.orgId);
  ctx.db.transaction((tx) => {
    for (const r of recipients) {
      queueEmail(tx, ctx.orgId, r.email, "overdue-digest", {
        recipientName: r.name,
        day,
        overdueCount: overdue.length,
        expiringCount: expiring.length,
        overdue: overdue.map((q) => ({
          projectName: q.projectName,
          jurisdictionName: q.jurisdictionName,
          status: EVENT_LABELS[q.status].toLowerCase(),
          daysWaiting: q.daysWaiting,
          typicalReviewDays: q.jurisdictionTypicalReviewDays,
          nextAction: q.nextAction,
        })),
        expiring: expiring.map((q) => ({ projectName: q.projectName, jurisdictionName: q.jurisdictionName, expiresOn: q.permitExpiresOn })),
      });
    }
    audit(tx, ctx, "digest.sent", "organisation", ctx.orgId, { day, recipients: recipients.length, overdue: overdue.length, expiring: expiring.length });
  });
  await deliverAfterCommit(options.deliver ?? deliverLater, ctx.db, ctx.orgId);
  return {
    day,
    recipients: recipients.length,
    overdue: overdue.length,
    expiring: expiring.length,
    skipped: false,
    message: `Digest for ${day} sent to ${recipients.length} ${recipients.length === 1 ? "person" : "people"}: ${overdue.length} overdue, ${expiring.length} expiring.`,
  };
}
