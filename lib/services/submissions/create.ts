import { and, eq } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { jurisdictions, packetRevisions, projects, submissionEvents, submissions } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { deliverLater } from "../../jobs";
import { formatIssues } from "../../schemas/fields";
import { createSubmissionSchema } from "../../schemas/submission";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid, notFound } from "../errors";
import { liveRecord, revisionMatchesLive } from "../projects/approval";
import { moveProjectStatus } from "../projects/status";
import { deliverAfterCommit, isoDay, METHOD_WORDS, revisionDesigner } from "./shared";

export interface CreateOptions {
  now?: Date;
  deliver?: (db: Db, orgId: string) => Promise<unknown>;
}

export interface CreatedSubmission {
  submissionId: string;
  message: string;
}

/** Statuses after which a revision may be submitted again (a withdrawn or lapsed application). */
const CLOSED_STATUSES = ["cancelled", "expired"] as const;

/**
 * Submits an approved revision to its project's jurisdiction. Only a stamped
 * (approved, finished, not draft) revision goes to an AHJ: anything else would
 * put an unreviewed design in front of a plan reviewer.
 */
export async function createSubmission(ctx: ServiceContext, input: unknown, options: CreateOptions = {}): Promise<CreatedSubmission> {
  requirePermission(ctx, "submission:create", "submit packets to a jurisdiction");
  const parsed = createSubmissionSchema.safeParse(input);
  if (!parsed.success) throw invalid("The submission was not recorded: some fields are not valid.", formatIssues(parsed.error));
  const { revisionId, method, referenceNumber, occurredOn, note } = parsed.data;
  const now = options.now ?? new Date();

  const found = ctx.db
    .select({ revision: packetRevisions, project: projects })
    .from(packetRevisions)
    .innerJoin(projects, and(eq(projects.id, packetRevisions.projectId), eq(projects.orgId, ctx.orgId)))
    .where(and(eq(packetRevisions.id, revisionId), eq(packetRevisions.orgId, ctx.orgId)))
    .get();
  if (!found) throw notFound("Packet revision");
  const { revision, project } = found;
  if (revision.isDraft) {
    throw invalid(`Revision ${revision.number} is a draft: its cover lists what fails or is missing, and it cannot go to the jurisdiction.`, [
      { path: "revisionId", message: "is a draft" },
    ]);
  }
  if (revision.reviewState !== "approved") {
    throw invalid(`Revision ${revision.number} has not been approved and stamped by a reviewer (it is ${revision.reviewState}); only an approved revision can be submitted.`, [
      { path: "revisionId", message: `is ${revision.reviewState}, not approved` },
    ]);
  }
  if (revision.state !== "ready") {
    throw conflict(`The stamped packet of revision ${revision.number} is not finished (${revision.state}); submit it once it is ready.`);
  }
  if (!revisionMatchesLive(revision, liveRecord(ctx, project.id))) {
    throw conflict(
      `${project.name} has changed since revision ${revision.number} was approved; the stamped set no longer shows the design. Generate a new revision and have it approved before submitting.`,
    );
  }
  if (!project.jurisdictionId) throw invalid(`${project.name} has no jurisdiction; set one on the project first.`, [{ path: "revisionId", message: "project has no jurisdiction" }]);
  const jurisdiction = ctx.db
    .select()
    .from(jurisdictions)
    .where(and(eq(jurisdictions.id, project.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .get();
  if (!jurisdiction) throw notFound("Jurisdiction");

  const today = isoDay(now);
  if (occurredOn > today) throw invalid("The submission date is in the future.", [{ path: "occurredOn", message: `is after today (${today})` }]);
  const revisionDay = revision.createdAt.slice(0, 10);
  if (occurredOn < revisionDay) {
    throw invalid("The submission date is before the revision was generated.", [{ path: "occurredOn", message: `is before revision ${revision.number} existed (${revisionDay})` }]);
  }

  const designer = revisionDesigner(ctx.db, ctx.orgId, revision.createdBy);

  const submissionId = ctx.db.transaction((tx) => {
    const open = tx
      .select({ id: submissions.id, status: submissions.status })
      .from(submissions)
      .where(and(eq(submissions.orgId, ctx.orgId), eq(submissions.revisionId, revision.id)))
      .all()
      .filter((s) => !(CLOSED_STATUSES as readonly string[]).includes(s.status));
    if (open.length) throw conflict(`Revision ${revision.number} of ${project.name} is already submitted; record events on that submission instead.`);
    const row = tx
      .insert(submissions)
      .values({
        orgId: ctx.orgId,
        projectId: project.id,
        jurisdictionId: jurisdiction.id,
        revisionId: revision.id,
        method,
        referenceNumber,
        status: "submitted",
        createdBy: ctx.user.id,
        createdAt: now.toISOString(),
      })
      .returning({ id: submissions.id })
      .get();
    tx.insert(submissionEvents)
      .values({ orgId: ctx.orgId, submissionId: row.id, kind: "submitted", occurredOn, userId: ctx.user.id, note, data: {}, createdAt: now.toISOString() })
      .run();
    // A later stage (permitted, installed, closed) is not undone by submitting again.
    moveProjectStatus(tx, ctx, project.id, "submitted", { reason: "submission.created", ifAllowed: true, now });
    if (designer) {
      queueEmail(tx, ctx.orgId, designer.email, "submitted", {
        jurisdictionName: jurisdiction.name,
        projectName: project.name,
        revisionNumber: revision.number,
        officeName: ctx.user.name,
        method: METHOD_WORDS[method],
        referenceNumber,
      });
    }
    audit(tx, ctx, "submission.created", "submission", row.id, {
      projectId: project.id,
      revisionId: revision.id,
      number: revision.number,
      jurisdictionId: jurisdiction.id,
      method,
      referenceNumber,
      occurredOn,
    });
    return row.id;
  });

  await deliverAfterCommit(options.deliver ?? deliverLater, ctx.db, ctx.orgId);
  return {
    submissionId,
    message: `Revision ${revision.number} of ${project.name} recorded as submitted to ${jurisdiction.name}${designer ? `; ${designer.name} has been told` : ""}.`,
  };
}
