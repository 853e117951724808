import "server-only";
import { and, eq } from "drizzle-orm";
import { packetRevisions, users, type PacketRevision } from "../../../db/schema";
import { can } from "../../auth/permissions";
import type { ServiceContext } from "../context";
import { notFound } from "../errors";
import { PROGRESS_STEPS, type ProgressStep } from "./steps";

export { PROGRESS_STEPS, PROGRESS_STEP_LABELS, type ProgressStep } from "./steps";

export interface RevisionView {
  id: string;
  projectId: string;
  projectName: string;
  number: number;
  state: PacketRevision["state"];
  progressStep: string;
  /** 0-based position of progressStep in PROGRESS_STEPS. */
  progressIndex: number;
  error: string | null;
  reviewState: PacketRevision["reviewState"];
  isDraft: boolean;
  pageCount: number | null;
  recordSha256: string;
  pdfSha256: string | null;
  docxSha256: string | null;
  attachmentCount: number;
  createdAt: string;
  createdByName: string | null;
  /** Download links, only for a ready revision. */
  pdfUrl: string | null;
  docxUrl: string | null;
}

export function toRevisionView(row: PacketRevision, createdByName: string | null): RevisionView {
  const ready = row.state === "ready";
  const name = typeof row.recordSnapshot?.name === "string" ? row.recordSnapshot.name : "";
  return {
    id: row.id,
    projectId: row.projectId,
    projectName: name,
    number: row.number,
    state: row.state,
    progressStep: row.progressStep,
    progressIndex: Math.max(0, PROGRESS_STEPS.indexOf(row.progressStep as ProgressStep)),
    error: row.error,
    reviewState: row.reviewState,
    isDraft: row.isDraft,
    pageCount: row.pageCount,
    recordSha256: row.recordSha256,
    pdfSha256: row.pdfSha256,
    docxSha256: row.docxSha256,
    attachmentCount: Array.isArray(row.attachmentIds) ? row.attachmentIds.length : 0,
    createdAt: row.createdAt,
    createdByName,
    pdfUrl: ready && row.pdfPath ? `/api/revisions/${row.id}/pdf` : null,
    docxUrl: ready && row.docxPath ? `/api/revisions/${row.id}/docx` : null,
  };
}

/** Installers work from approved sets only; everyone else who reads packets sees every revision. */
export function seesUnapproved(ctx: ServiceContext): boolean {
  return can(ctx.roles, "project:read");
}

/** A revision of the actor's organisation, or not-found (also for other organisations' ids). */
export function findRevisionInOrg(ctx: ServiceContext, revisionId: string): { row: PacketRevision; createdByName: string | null } {
  const found = ctx.db
    .select({ row: packetRevisions, createdByName: users.name })
    .from(packetRevisions)
    .leftJoin(users, eq(users.id, packetRevisions.createdBy))
    .where(and(eq(packetRevisions.id, revisionId), eq(packetRevisions.orgId, ctx.orgId)))
    .get();
  if (!found) throw notFound("Packet revision");
  if (!seesUnapproved(ctx) && found.row.reviewState !== "approved") throw notFound("Packet revision");
  return found;
}
