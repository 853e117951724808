import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { packetRevisions, submissionEvents, submissions } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { deliverLater } from "../../jobs";
import { formatIssues } from "../../schemas/fields";
import { EVENT_LABELS, INSPECTION_EVENT_KINDS, PERMIT_VALID_MAX_DAYS, recordEventSchema, SCHEDULE_AHEAD_MAX_DAYS } from "../../schemas/submission";
import { CLOSED_KINDS, nextEventVerdict, type StandingKind } from "../../schemas/submission-rules";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { insertCorrectionItems } from "../corrections/record";
import { assignableUsers, checkedAssignee, standingItems } from "../corrections/shared";
import { liveRecord, revisionMatchesLive } from "../projects/approval";
import { mailHandOff, permitNumberOf } from "./hand-off-mail";
import { effectiveEvents, loadEventRows, moveProjectForEvents, standingOf, type EffectiveEvent } from "./events";
import { activeInstallers, addDays, deliverAfterCommit, findSubmissionInOrg, isoDay, revisionDesigner } from "./shared";

export interface RecordEventOptions {
  now?: Date;
  deliver?: (db: Db, orgId: string) => Promise<unknown>;
}

export interface RecordedEvent {
  eventId: string;
  submissionId: string;
  /** Where the application now stands. */
  status: StandingKind;
  version: number;
  message: string;
}

/**
 * Appends one event to a submission, in the order the event table allows
 * (lib/schemas/submission-rules.ts). Events are never changed or removed: a
 * mistaken entry is voided by a later one (void-event.ts), as on a paper log.
 */
export async function recordSubmissionEvent(ctx: ServiceContext, input: unknown, options: RecordEventOptions = {}): Promise<RecordedEvent> {
  requirePermission(ctx, "submission:record-event", "record submission events");
  const parsed = recordEventSchema.safeParse(input);
  if (!parsed.success) throw invalid("The event was not recorded: some fields are not valid.", formatIssues(parsed.error));
  const { submissionId, kind, occurredOn, note, permitNumber, expiresOn, amountUsd, inspectionKind, revisionId, version, corrections, assigneeId } = parsed.data;
  const now = options.now ?? new Date();
  const { submission, project, jurisdiction, revision } = findSubmissionInOrg(ctx, submissionId);
  const events = effectiveEvents(loadEventRows(ctx.db, ctx.orgId, submission.id));
  const standing = standingOf(events);

  if (CLOSED_KINDS.includes(standing)) {
    throw conflict(`This submission is ${EVENT_LABELS[standing].toLowerCase()}; start a new submission to continue.`);
  }
  if (version !== undefined && version !== submission.version) {
    throw conflict("Another event was recorded on this submission since you opened it; reload the page and check the timeline.");
  }

  const today = isoDay(now);
  const latestAllowed = kind === "inspection-scheduled" ? addDays(today, SCHEDULE_AHEAD_MAX_DAYS) : today;
  if (occurredOn > latestAllowed) {
    const message = kind === "inspection-scheduled" ? `is more than a year ahead (latest ${latestAllowed})` : `is after today (${today}); only a scheduled inspection may lie ahead`;
    throw invalid("The event date is not possible.", [{ path: "occurredOn", message }]);
  }
  const first = events[0];
  if (first && occurredOn < first.occurredOn) {
    throw invalid("The event date is before the submission.", [{ path: "occurredOn", message: `is before the first event (${first.occurredOn})` }]);
  }
  if (kind === "permit-issued" && expiresOn && expiresOn > addDays(occurredOn, PERMIT_VALID_MAX_DAYS)) {
    throw invalid("The permit expiry is too far ahead.", [{ path: "expiresOn", message: "is more than ten years after issue; check the year" }]);
  }

  const verdict = nextEventVerdict(standing, kind);
  if (!verdict.allowed) throw invalid(verdict.reason, [{ path: "kind", message: verdict.reason }]);

  const data: Record<string, unknown> = {};
  if (kind === "resubmitted") data.revisionId = resubmittedRevision(ctx, project.id, revisionId!, events, revision.id).id;
  if (kind === "permit-issued") {
    data.permitNumber = permitNumber;
    if (expiresOn) data.expiresOn = expiresOn;
  }
  if (kind === "fee-paid") data.amount = amountUsd;
  if (INSPECTION_EVENT_KINDS.includes(kind)) data.inspectionKind = inspectionKind;

  if (kind === "resubmitted") {
    const open = standingItems(ctx.db, ctx.orgId, submission.id).filter((i) => i.resolvedAt === null);
    if (open.length > 0) {
      const numbers = open.map((i) => i.number).join(", ");
      const message = `The AHJ's comment${open.length === 1 ? "" : "s"} ${numbers} ${open.length === 1 ? "is" : "are"} still open; a resubmittal answers every comment. Resolve ${open.length === 1 ? "it" : "them"} on the project's Corrections tab first.`;
      throw invalid(message, [{ path: "kind", message: `${open.length} comment${open.length === 1 ? "" : "s"} still open` }]);
    }
  }
  const correctionAssignee =
    kind === "corrections-requested" && corrections?.length
      ? assigneeId
        ? checkedAssignee(ctx.db, ctx.orgId, assigneeId).id
        : (assignableUsers(ctx.db, ctx.orgId).find((u) => u.id === revision.createdBy)?.id ?? null)
      : null;

  const designer = revisionDesigner(ctx.db, ctx.orgId, revision.createdBy);
  const createdAt = now.toISOString();

  const result = ctx.db.transaction((tx) => {
    const moved = tx
      .update(submissions)
      .set({ status: kind === "fee-paid" ? standing : kind, version: submission.version + 1 })
      .where(and(eq(submissions.id, submission.id), eq(submissions.orgId, ctx.orgId), eq(submissions.version, submission.version)))
      .run();
    if (moved.changes === 0) throw conflict("Another event was recorded on this submission at the same time; reload the page and check the timeline.");
    const event = tx
      .insert(submissionEvents)
      .values({ orgId: ctx.orgId, submissionId: submission.id, kind, occurredOn, userId: ctx.user.id, note, data, createdAt })
      .returning({ id: submissionEvents.id })
      .get();
    if (kind === "corrections-requested" && corrections?.length) {
      insertCorrectionItems(tx, { orgId: ctx.orgId, projectId: project.id, submissionId: submission.id, eventId: event.id, assigneeId: correctionAssignee, createdAt }, corrections);
    }
    const stored = tx.select().from(submissionEvents).where(eq(submissionEvents.id, event.id)).get()!;
    moveProjectForEvents(tx, ctx, project.id, [...events, stored as EffectiveEvent], { reason: `submission.${kind}`, now });
    const reference = submission.referenceNumber || "not yet given";
    if (kind === "corrections-requested" && designer) {
      queueEmail(tx, ctx.orgId, designer.email, "corrections-requested", {
        jurisdictionName: jurisdiction.name,
        projectName: project.name,
        referenceNumber: reference,
        note: [note, ...(corrections ?? []).map((c, i) => `${i + 1}. ${c.comment}`)].filter(Boolean).join("\n") || "(no details recorded; ask the permit office)",
      });
    }
    const told = mailHandOff(tx, ctx, kind, {
      designer,
      submissionId: submission.id,
      jurisdictionName: jurisdiction.name,
      typicalReviewDays: jurisdiction.typicalReviewDays,
      projectName: project.name,
      referenceNumber: reference,
      occurredOn,
      note: note ?? "",
      inspectionKind,
      permitNumber: permitNumberOf(events),
    });
    if (kind === "permit-issued") {
      const to = new Map<string, string>();
      if (designer) to.set(designer.email, designer.name);
      for (const i of activeInstallers(tx, ctx.orgId)) to.set(i.email, i.name);
      for (const email of to.keys()) {
        queueEmail(tx, ctx.orgId, email, "permit-issued", {
          jurisdictionName: jurisdiction.name,
          projectName: project.name,
          permitNumber: permitNumber!,
          expiresOn: expiresOn ?? "",
        });
      }
    }
    audit(tx, ctx, "submission.event", "submission", submission.id, { eventId: event.id, kind, occurredOn, data, ...(corrections?.length ? { comments: corrections.length } : {}) });
    return { eventId: event.id, version: submission.version + 1, told };
  });

  if (kind === "corrections-requested" || kind === "permit-issued" || result.told > 0) await deliverAfterCommit(options.deliver ?? deliverLater, ctx.db, ctx.orgId);
  return {
    eventId: result.eventId,
    submissionId: submission.id,
    status: kind === "fee-paid" ? standing : kind,
    version: result.version,
    message: `${EVENT_LABELS[kind]} recorded on ${occurredOn}.`,
  };
}

/** The approved revision a resubmission sends: of this project, stamped, finished, and not one already before the AHJ. */
function resubmittedRevision(ctx: ServiceContext, projectId: string, revisionId: string, events: readonly EffectiveEvent[], firstRevisionId: string) {
  const row = ctx.db
    .select()
    .from(packetRevisions)
    .where(and(eq(packetRevisions.id, revisionId), eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, projectId)))
    .get();
  if (!row) throw invalid("That revision is not a revision of this project.", [{ path: "revisionId", message: "is not a revision of this project" }]);
  const sent = new Set([firstRevisionId, ...events.filter((e) => e.kind === "resubmitted").map((e) => e.data.revisionId)]);
  if (sent.has(row.id)) {
    throw invalid(`Revision ${row.number} is already before the AHJ; a resubmission sends the revision that answers the corrections.`, [
      { path: "revisionId", message: `revision ${row.number} was already submitted` },
    ]);
  }
  if (row.reviewState !== "approved" || row.isDraft || row.state !== "ready") {
    throw invalid(`Revision ${row.number} is not an approved, stamped and finished packet; only such a revision goes to the AHJ.`, [
      { path: "revisionId", message: `revision ${row.number} is not approved and ready` },
    ]);
  }
  if (!revisionMatchesLive(row, liveRecord(ctx, projectId))) {
    throw invalid(`The project has changed since revision ${row.number} was approved; generate a new revision and have it approved before resubmitting.`, [
      { path: "revisionId", message: `revision ${row.number} no longer shows the design` },
    ]);
  }
  return row;
}
