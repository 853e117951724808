import { and, asc, desc, eq, notInArray } from "drizzle-orm";
import { jurisdictions, packetRevisions, projects, submissionEvents, submissions, users } from "../../../db/schema";
import type { StoredEventKind } from "../../../db/schema";
import type { EventKind } from "../../schemas/submission";
import { allowedNextKinds } from "../../schemas/submission-rules";
import { effectiveEvents, loadEventRows } from "./events";
import { requirePermission, type ServiceContext } from "../context";
import { liveRecord, revisionMatchesLive } from "../projects/approval";
import { findSubmissionInOrg, revisionDesigner } from "./shared";

export interface SubmissionEventView {
  id: string;
  /** "voided" for the entry that voids another; the voided entry keeps its kind and carries `voided`. */
  kind: StoredEventKind;
  occurredOn: string;
  userName: string | null;
  note: string;
  data: Record<string, unknown>;
  createdAt: string;
  /** Set when a later entry voided this one. */
  voided: { reason: string; byName: string | null; on: string } | null;
}

export interface SubmissionView {
  id: string;
  projectId: string;
  projectName: string;
  projectStatus: string;
  address: string;
  jurisdictionName: string;
  revisionId: string;
  revisionNumber: number;
  designerName: string | null;
  method: "portal" | "email" | "counter";
  referenceNumber: string;
  status: EventKind;
  version: number;
  createdAt: string;
  /** Oldest first, as a log reads, voided entries and voids included. */
  events: SubmissionEventView[];
  /** What the office may record next (the event rules); empty once the application is closed. */
  allowedNext: EventKind[];
  /** Revisions already before the AHJ; a resubmission sends another. */
  sentRevisionIds: string[];
  /** Approved, finished revisions of the project not yet before the AHJ: what a resubmission may send. */
  resubmittable: { id: string; number: number }[];
  /** Revision id → number, for the revisions the log names. */
  revisionNumbers: Record<string, number>;
}

export function getSubmission(ctx: ServiceContext, submissionId: string): SubmissionView {
  requirePermission(ctx, "submission:read", "read submissions");
  const { submission, project, jurisdiction, revision } = findSubmissionInOrg(ctx, submissionId);
  const rows = ctx.db
    .select({
      id: submissionEvents.id,
      kind: submissionEvents.kind,
      occurredOn: submissionEvents.occurredOn,
      userName: users.name,
      note: submissionEvents.note,
      data: submissionEvents.data,
      createdAt: submissionEvents.createdAt,
    })
    .from(submissionEvents)
    .leftJoin(users, eq(users.id, submissionEvents.userId))
    .where(and(eq(submissionEvents.submissionId, submission.id), eq(submissionEvents.orgId, ctx.orgId)))
    .orderBy(asc(submissionEvents.occurredOn), asc(submissionEvents.createdAt))
    .all();
  const voids = new Map(rows.filter((r) => r.kind === "voided").map((r) => [String(r.data.voidsEventId), r]));
  const events: SubmissionEventView[] = rows.map((r) => {
    const v = voids.get(r.id);
    return { ...r, voided: v ? { reason: v.note, byName: v.userName, on: v.occurredOn } : null };
  });
  const effective = effectiveEvents(loadEventRows(ctx.db, ctx.orgId, submission.id));
  const sentRevisionIds = [revision.id, ...effective.filter((e) => e.kind === "resubmitted").map((e) => String(e.data.revisionId))];
  return {
    id: submission.id,
    projectId: project.id,
    projectName: project.name,
    projectStatus: project.status,
    address: project.address,
    jurisdictionName: jurisdiction.name,
    revisionId: revision.id,
    revisionNumber: revision.number,
    designerName: revisionDesigner(ctx.db, ctx.orgId, revision.createdBy)?.name ?? null,
    method: submission.method,
    referenceNumber: submission.referenceNumber,
    status: submission.status,
    version: submission.version,
    createdAt: submission.createdAt,
    events,
    allowedNext: allowedNextKinds(effective.map((e) => e.kind)),
    sentRevisionIds,
    revisionNumbers: Object.fromEntries(
      ctx.db
        .select({ id: packetRevisions.id, number: packetRevisions.number })
        .from(packetRevisions)
        .where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, project.id)))
        .all()
        .map((r) => [r.id, r.number]),
    ),
    resubmittable: ctx.db
      .select({ id: packetRevisions.id, number: packetRevisions.number })
      .from(packetRevisions)
      .where(
        and(
          eq(packetRevisions.orgId, ctx.orgId),
          eq(packetRevisions.projectId, project.id),
          eq(packetRevisions.reviewState, "approved"),
          eq(packetRevisions.state, "ready"),
          eq(packetRevisions.isDraft, false),
        ),
      )
      .orderBy(desc(packetRevisions.number))
      .all()
      .filter((r) => !sentRevisionIds.includes(r.id)),
  };
}

export interface SubmittableRevision {
  revisionId: string;
  projectId: string;
  projectName: string;
  revisionNumber: number;
  jurisdictionName: string;
  /** The jurisdiction's submission method, offered as the default. */
  defaultMethod: "portal" | "email" | "counter";
  generatedAt: string;
}

/**
 * Approved, finished revisions with a jurisdiction and no open submission,
 * whose design is still the project's live design: what the office can submit
 * next. A project changed since its approval waits for a new approved revision.
 */
export function listSubmittableRevisions(ctx: ServiceContext): SubmittableRevision[] {
  requirePermission(ctx, "submission:create", "submit packets to a jurisdiction");
  const submitted = ctx.db
    .select({ revisionId: submissions.revisionId })
    .from(submissions)
    .where(and(eq(submissions.orgId, ctx.orgId), notInArray(submissions.status, ["cancelled", "expired"])))
    .all()
    .map((r) => r.revisionId);
  const lives = new Map<string, unknown>();
  const live = (projectId: string) => {
    if (!lives.has(projectId)) lives.set(projectId, liveRecord(ctx, projectId));
    return lives.get(projectId);
  };
  return ctx.db
    .select({
      revisionId: packetRevisions.id,
      projectId: projects.id,
      projectName: projects.name,
      revisionNumber: packetRevisions.number,
      jurisdictionName: jurisdictions.name,
      defaultMethod: jurisdictions.submissionMethod,
      generatedAt: packetRevisions.createdAt,
      recordSnapshot: packetRevisions.recordSnapshot,
    })
    .from(packetRevisions)
    .innerJoin(projects, and(eq(projects.id, packetRevisions.projectId), eq(projects.orgId, ctx.orgId)))
    .innerJoin(jurisdictions, and(eq(jurisdictions.id, projects.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .where(
      and(
        eq(packetRevisions.orgId, ctx.orgId),
        eq(packetRevisions.reviewState, "approved"),
        eq(packetRevisions.state, "ready"),
        eq(packetRevisions.isDraft, false),
        submitted.length ? notInArray(packetRevisions.id, submitted) : undefined,
      ),
    )
    .orderBy(desc(packetRevisions.createdAt))
    .all()
    .filter((r) => revisionMatchesLive(r, live(r.projectId)))
    .map(({ recordSnapshot: _snapshot, ...r }) => r);
}
