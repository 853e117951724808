import "server-only";
import { and, eq } from "drizzle-orm";
import { submissionEvents, submissions } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { EVENT_LABELS, voidEventSchema } from "../../schemas/submission";
import { sequenceVerdict, standingKind, type StandingKind } from "../../schemas/submission-rules";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid, notFound } from "../errors";
import { effectiveEvents, loadEventRows, moveProjectForEvents } from "./events";
import { findSubmissionInOrg, isoDay } from "./shared";

export interface VoidedEvent {
  voidId: string;
  submissionId: string;
  status: StandingKind;
  version: number;
  message: string;
}

/**
 * Voids an event recorded in error. The void is a new entry carrying the
 * reason; the voided entry stays in the log, struck through, and the derived
 * status (of the submission and of its project) is worked out again without
 * it. The events that remain must still follow the event rules, so voiding a
 * permit under a recorded inspection is refused: void the later entries first.
 */
export function voidSubmissionEvent(ctx: ServiceContext, input: unknown, options: { now?: Date } = {}): VoidedEvent {
  requirePermission(ctx, "submission:record-event", "void submission events");
  const parsed = voidEventSchema.safeParse(input);
  if (!parsed.success) throw invalid("The entry was not voided: some fields are not valid.", formatIssues(parsed.error));
  const { submissionId, eventId, reason, version } = parsed.data;
  const now = options.now ?? new Date();
  const { submission, project } = findSubmissionInOrg(ctx, submissionId);
  if (version !== undefined && version !== submission.version) {
    throw conflict("Another event was recorded on this submission since you opened it; reload the page and check the timeline.");
  }

  const rows = loadEventRows(ctx.db, ctx.orgId, submission.id);
  const target = rows.find((r) => r.id === eventId);
  if (!target) throw notFound("Event");
  if (target.kind === "voided") throw invalid("A void cannot itself be voided; record the event again if it did happen.", [{ path: "eventId", message: "is a void" }]);
  const standing = effectiveEvents(rows);
  if (!standing.some((e) => e.id === target.id)) throw conflict("This entry is already voided.");
  if (standing[0]?.id === target.id) {
    throw invalid("The submission itself cannot be voided; record Cancelled to withdraw the application.", [{ path: "eventId", message: "is the submission" }]);
  }
  const remaining = standing.filter((e) => e.id !== target.id);
  const verdict = sequenceVerdict(remaining.map((e) => e.kind));
  if (!verdict.allowed) {
    const blocker = remaining[verdict.index]!;
    const message = `Voiding ${EVENT_LABELS[target.kind as keyof typeof EVENT_LABELS]} of ${target.occurredOn} would leave ${EVENT_LABELS[blocker.kind]} of ${blocker.occurredOn} out of order (${verdict.reason}) Void the later entry first.`;
    throw invalid(message, [{ path: "eventId", message: "later entries depend on it" }]);
  }
  const status = standingKind(remaining.map((e) => e.kind)) ?? "submitted";
  const createdAt = now.toISOString();

  const result = ctx.db.transaction((tx) => {
    const moved = tx
      .update(submissions)
      .set({ status, version: submission.version + 1 })
      .where(and(eq(submissions.id, submission.id), eq(submissions.orgId, ctx.orgId), eq(submissions.version, submission.version)))
      .run();
    if (moved.changes === 0) throw conflict("Another event was recorded on this submission at the same time; reload the page and check the timeline.");
    const row = tx
      .insert(submissionEvents)
      .values({
        orgId: ctx.orgId,
        submissionId: submission.id,
        kind: "voided",
        occurredOn: isoDay(now),
        userId: ctx.user.id,
        note: reason,
        data: { voidsEventId: target.id, voidsKind: target.kind, voidsOccurredOn: target.occurredOn },
        createdAt,
      })
      .returning({ id: submissionEvents.id })
      .get();
    moveProjectForEvents(tx, ctx, project.id, remaining, { reason: "submission.voided", undo: true, now });
    audit(tx, ctx, "submission.voided", "submission", submission.id, { voidId: row.id, eventId: target.id, kind: target.kind, reason });
    return { voidId: row.id, version: submission.version + 1 };
  });

  return {
    voidId: result.voidId,
    submissionId: submission.id,
    status,
    version: result.version,
    message: `${EVENT_LABELS[target.kind as keyof typeof EVENT_LABELS]} of ${target.occurredOn} voided; the submission now stands at ${EVENT_LABELS[status].toLowerCase()}.`,
  };
}
