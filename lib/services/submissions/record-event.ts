import { and, asc, eq, inArray } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { projects, submissionEvents, submissions } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { deliverLater } from "../../jobs";
import { formatIssues } from "../../schemas/fields";
import { EVENT_LABELS, INSPECTION_EVENT_KINDS, PERMIT_VALID_MAX_DAYS, recordEventSchema, SCHEDULE_AHEAD_MAX_DAYS, type EventKind } from "../../schemas/submission";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { activeInstallers, addDays, deliverAfterCommit, findSubmissionInOrg, isoDay, revisionDesigner } from "./shared";

export interface RecordEventOptions {
  now?: Date;
  deliver?: (db: Db, orgId: string) => Promise<unknown>;
}

export interface RecordedEvent {
  eventId: string;
  submissionId: string;
  status: EventKind;
  version: number;
  message: string;
}

/** After these the application is closed; a new one starts with a new submission. */
const TERMINAL: readonly EventKind[] = ["finaled", "cancelled"];

/**
 * Appends one event to a submission. Events are never changed or removed: a
 * mistaken entry is corrected by a later one with a note, as on a paper log.
 */
export async function recordSubmissionEvent(ctx: ServiceContext, input: unknown, options: RecordEventOptions = {}): Promise<RecordedEvent> {
  requirePermission(ctx, "submission:record-event", "record submission events");
  const parsed = recordEventSchema.safeParse(input);
  if (!parsed.success) throw invalid("The event was not recorded: some fields are not valid.", formatIssues(parsed.error));
  const { submissionId, kind, occurredOn, note, permitNumber, expiresOn, amountUsd, inspectionKind, version } = parsed.data;
  const now = options.now ?? new Date();
  const { submission, project, jurisdiction, revision } = findSubmissionInOrg(ctx, submissionId);

  if (TERMINAL.includes(submission.status)) {
    throw conflict(`This submission is ${EVENT_LABELS[submission.status].toLowerCase()}; start a new submission to continue.`);
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
  const first = ctx.db
    .select({ occurredOn: submissionEvents.occurredOn })
    .from(submissionEvents)
    .where(and(eq(submissionEvents.submissionId, submission.id), eq(submissionEvents.orgId, ctx.orgId)))
    .orderBy(asc(submissionEvents.occurredOn))
    .limit(1)
    .get();
  if (first && occurredOn < first.occurredOn) {
    throw invalid("The event date is before the submission.", [{ path: "occurredOn", message: `is before the first event (${first.occurredOn})` }]);
  }
  if (kind === "permit-issued" && expiresOn && expiresOn > addDays(occurredOn, PERMIT_VALID_MAX_DAYS)) {
    throw invalid("The permit expiry is too far ahead.", [{ path: "expiresOn", message: "is more than ten years after issue; check the year" }]);
  }

  const data: Record<string, unknown> = {};
  if (kind === "permit-issued") {
    data.permitNumber = permitNumber;
    if (expiresOn) data.expiresOn = expiresOn;
  }
  if (kind === "fee-paid") data.amount = amountUsd;
  if (INSPECTION_EVENT_KINDS.includes(kind)) data.inspectionKind = inspectionKind;

  const designer = revisionDesigner(ctx.db, ctx.orgId, revision.createdBy);
  const createdAt = now.toISOString();

  const result = ctx.db.transaction((tx) => {
    const moved = tx
      .update(submissions)
      .set({ status: kind, version: submission.version + 1 })
      .where(and(eq(submissions.id, submission.id), eq(submissions.orgId, ctx.orgId), eq(submissions.version, submission.version)))
      .run();
    if (moved.changes === 0) throw conflict("Another event was recorded on this submission at the same time; reload the page and check the timeline.");
    const event = tx
      .insert(submissionEvents)
      .values({ orgId: ctx.orgId, submissionId: submission.id, kind, occurredOn, userId: ctx.user.id, note, data, createdAt })
      .returning({ id: submissionEvents.id })
      .get();
    if (kind === "permit-issued") {
      tx.update(projects)
        .set({ status: "permitted", updatedAt: createdAt })
        .where(and(eq(projects.id, project.id), eq(projects.orgId, ctx.orgId), inArray(projects.status, ["approved", "submitted", "permitted"])))
        .run();
    }
    const reference = submission.referenceNumber || "not yet given";
    if (kind === "corrections-requested" && designer) {
      queueEmail(tx, ctx.orgId, designer.email, "corrections-requested", {
        jurisdictionName: jurisdiction.name,
        projectName: project.name,
        referenceNumber: reference,
        note: note || "(no details recorded; ask the permit office)",
      });
    }
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
    audit(tx, ctx, "submission.event", "submission", submission.id, { eventId: event.id, kind, occurredOn, data });
    return { eventId: event.id, version: submission.version + 1 };
  });

  if (kind === "corrections-requested" || kind === "permit-issued") await deliverAfterCommit(options.deliver ?? deliverLater, ctx.db, ctx.orgId);
  return {
    eventId: result.eventId,
    submissionId: submission.id,
    status: kind,
    version: result.version,
    message: `${EVENT_LABELS[kind]} recorded on ${occurredOn}.`,
  };
}
