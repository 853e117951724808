import { and, desc, eq } from "drizzle-orm";
import { jurisdictions, packetRevisions, projects, submissionEvents, submissions } from "../../../db/schema";
import { queueFigures, type QueueFigures } from "../../schemas/queue";
import type { EventKind } from "../../schemas/submission";
import { requirePermission, type ServiceContext } from "../context";

export type SubmissionQueueEntry = {
  submissionId: string;
  projectName: string;
  jurisdictionName: string;
  revisionNumber: number;
  method: "portal" | "email" | "counter";
  referenceNumber: string;
  status: EventKind;
  /** Date of the first "submitted" event, as the AHJ counts review days from it. */
  submittedOn: string | null;
  /** Date of the latest recorded event (a scheduled inspection may lie ahead). */
  latestOn: string | null;
  permitNumber: string | null;
  jurisdictionTypicalReviewDays: number | null;
} & QueueFigures;

/** The office's queue: every submission of the organisation with the dates the office works from, latest activity first. */
export function listSubmissionQueue(ctx: ServiceContext, options: { now?: Date } = {}): SubmissionQueueEntry[] {
  const today = (options.now ?? new Date()).toISOString().slice(0, 10);
  requirePermission(ctx, "submission:read", "read submissions");
  const rows = ctx.db
    .select({
      submissionId: submissions.id,
      projectName: projects.name,
      jurisdictionName: jurisdictions.name,
      revisionNumber: packetRevisions.number,
      method: submissions.method,
      referenceNumber: submissions.referenceNumber,
      status: submissions.status,
      createdAt: submissions.createdAt,
      jurisdictionTypicalReviewDays: jurisdictions.typicalReviewDays,
    })
    .from(submissions)
    .innerJoin(projects, and(eq(projects.id, submissions.projectId), eq(projects.orgId, ctx.orgId)))
    .innerJoin(jurisdictions, and(eq(jurisdictions.id, submissions.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .innerJoin(packetRevisions, and(eq(packetRevisions.id, submissions.revisionId), eq(packetRevisions.orgId, ctx.orgId)))
    .where(eq(submissions.orgId, ctx.orgId))
    .orderBy(desc(submissions.createdAt))
    .all();
  const events = ctx.db
    .select({ id: submissionEvents.id, submissionId: submissionEvents.submissionId, kind: submissionEvents.kind, occurredOn: submissionEvents.occurredOn, data: submissionEvents.data, createdAt: submissionEvents.createdAt })
    .from(submissionEvents)
    .where(eq(submissionEvents.orgId, ctx.orgId))
    .all();
  const bySubmission = new Map<string, typeof events>();
  for (const e of events) bySubmission.set(e.submissionId, [...(bySubmission.get(e.submissionId) ?? []), e]);
  const entries = rows.map(({ createdAt: _createdAt, ...r }) => {
    // Recording order, as the status is the kind of the latest recorded event; the day breaks ties of rows written together.
    const rowsOfSubmission = (bySubmission.get(r.submissionId) ?? []).slice().sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.occurredOn.localeCompare(b.occurredOn));
    // Voided entries and the voids themselves leave the queue's arithmetic.
    const voided = new Set(rowsOfSubmission.filter((e) => e.kind === "voided").map((e) => String(e.data.voidsEventId)));
    const own = rowsOfSubmission.filter((e): e is typeof e & { kind: EventKind } => e.kind !== "voided" && !voided.has(e.id));
    const permit = own.filter((e) => e.kind === "permit-issued").at(-1);
    return {
      ...r,
      submittedOn: own.find((e) => e.kind === "submitted")?.occurredOn ?? null,
      latestOn: own.at(-1)?.occurredOn ?? null,
      permitNumber: typeof permit?.data.permitNumber === "string" ? permit.data.permitNumber : null,
      ...queueFigures(own, r.status, r.jurisdictionTypicalReviewDays, today),
    };
  });
  return entries.sort((a, b) => (b.latestOn ?? "").localeCompare(a.latestOn ?? ""));
}
