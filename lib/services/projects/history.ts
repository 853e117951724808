import "server-only";
import { and, desc, eq, inArray, or } from "drizzle-orm";
import { attachments, auditLog, packetRevisions, submissions, users } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";
import { findProjectInOrg } from "./load";

export interface HistoryEntry {
  id: string;
  at: string;
  who: string | null;
  action: string;
  /** What happened, in words: "Revision 2 sent for review", "Status: submitted → permitted". */
  summary: string;
}

const ACTION_WORDS: Record<string, string> = {
  "project.created": "Project created",
  "project.imported": "Project imported",
  "project.saved": "Record edited",
  "project.status": "Status changed",
  "attachment.uploaded": "Attachment uploaded",
  "attachment.deleted": "Attachment deleted",
  "attachment.linked": "Attachment linked",
  "packet.generate": "Revision generated",
  "review.sent": "Sent for review",
  "review.returned": "Returned by the reviewer",
  "review.approved": "Approved and stamped",
  "review.restamp": "Stamped set rendered again",
  "submission.created": "Submitted to the AHJ",
  "submission.event": "Submission event recorded",
  "submission.voided": "Submission entry voided",
  "correction.resolved": "AHJ comment answered",
  "correction.reopened": "AHJ comment reopened",
  "correction.assigned": "AHJ comment assigned",
  "site.confirmed": "Confirmed on site",
  "site.unconfirmed": "Site confirmation withdrawn",
};

function summary(action: string, d: Record<string, unknown>): string {
  const words = ACTION_WORDS[action] ?? action;
  const n = typeof d.number === "number" ? ` (revision ${d.number})` : "";
  if (action === "project.status") return `${words}: ${String(d.from)} → ${String(d.to)}`;
  if (action === "submission.event") return `${words}: ${String(d.kind)} on ${String(d.occurredOn)}${typeof d.comments === "number" ? ` (${d.comments} comments)` : ""}`;
  if (action === "correction.resolved") return `${words}: comment ${String(d.number)}; "${String(d.response)}"`;
  if (action === "correction.assigned") return `${words}: comment ${String(d.number)} to ${String(d.to)}`;
  if (action === "correction.reopened") return `${words}: comment ${String(d.number)}`;
  if (action === "submission.voided") return `${words}: ${String(d.kind)}; ${String(d.reason ?? "")}`;
  if (action === "review.sent" && typeof d.message === "string") return `${words}${n}: "${d.message}"`;
  if ((action === "attachment.uploaded" || action === "attachment.deleted") && typeof d.fileName === "string") {
    return `${words}: ${d.fileName} (${String(d.kind).replace(/-/g, " ")}${typeof d.equipmentTag === "string" && d.equipmentTag ? `, ${d.equipmentTag}` : ""})`;
  }
  if (action === "attachment.linked") return `${words}: ${String(d.from ?? "none")} → ${String(d.to ?? "none")}`;
  if (action.startsWith("site.")) return `${words}: ${String(d.itemKind)} ${String(d.itemId)}`;
  return `${words}${n}`;
}

/**
 * Who did what on a project, from the audit log: record edits, revisions,
 * review decisions, submissions and their events, installation. Read-only:
 * the log is appended by the services and never edited.
 */
export function projectHistory(ctx: ServiceContext, projectId: string): HistoryEntry[] {
  requirePermission(ctx, "project:read", "read projects");
  const project = findProjectInOrg(ctx, projectId);
  const ids = (rows: { id: string }[]) => rows.map((r) => r.id);
  const revisionIds = ids(ctx.db.select({ id: packetRevisions.id }).from(packetRevisions).where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, project.id))).all());
  const submissionIds = ids(ctx.db.select({ id: submissions.id }).from(submissions).where(and(eq(submissions.orgId, ctx.orgId), eq(submissions.projectId, project.id))).all());
  const attachmentIds = ids(ctx.db.select({ id: attachments.id }).from(attachments).where(and(eq(attachments.orgId, ctx.orgId), eq(attachments.projectId, project.id))).all());
  const related = [project.id, ...revisionIds, ...submissionIds, ...attachmentIds];
  return ctx.db
    .select({ id: auditLog.id, at: auditLog.createdAt, who: users.name, action: auditLog.action, detail: auditLog.detail })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.userId))
    .where(and(eq(auditLog.orgId, ctx.orgId), or(inArray(auditLog.entityId, related))))
    .orderBy(desc(auditLog.createdAt))
    .all()
    .map((r) => ({ id: r.id, at: r.at, who: r.who, action: r.action, summary: summary(r.action, r.detail) }));
}
