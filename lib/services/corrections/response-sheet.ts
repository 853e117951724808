import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { packetRevisions } from "../../../db/schema";
import { renderResponseSheet } from "../../packet/response-sheet";
import { requirePermission, type ServiceContext } from "../context";
import { findSubmissionInOrg } from "../submissions/shared";
import { effectiveEvents, loadEventRows } from "../submissions/events";
import { listSubmissionCorrections } from "./list";

/**
 * The response sheet of a submission, for the resubmittal: the comments of
 * every standing letter with their responses. The revision named is the newest
 * approved one not yet before the AHJ, which is what a resubmittal sends.
 */
export async function correctionResponseSheet(ctx: ServiceContext, submissionId: string, now = new Date()): Promise<{ bytes: Uint8Array; fileName: string }> {
  requirePermission(ctx, "correction:read", "read corrections");
  const { submission, project, jurisdiction, revision } = findSubmissionInOrg(ctx, submissionId);
  const { items } = listSubmissionCorrections(ctx, submission.id);
  const sent = new Set([revision.id, ...effectiveEvents(loadEventRows(ctx.db, ctx.orgId, submission.id)).filter((e) => e.kind === "resubmitted").map((e) => String(e.data.revisionId))]);
  const waiting = ctx.db
    .select({ id: packetRevisions.id, number: packetRevisions.number })
    .from(packetRevisions)
    .where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, project.id), eq(packetRevisions.reviewState, "approved"), eq(packetRevisions.isDraft, false)))
    .orderBy(desc(packetRevisions.number))
    .all()
    .find((r) => !sent.has(r.id));
  const bytes = await renderResponseSheet({
    projectName: project.name,
    address: project.address,
    jurisdictionName: jurisdiction.name,
    referenceNumber: submission.referenceNumber,
    revisionNumber: waiting?.number ?? null,
    preparedAt: now.toISOString(),
    items,
  });
  const slug = project.name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "project";
  return { bytes, fileName: `${slug}-response-to-comments.pdf` };
}
