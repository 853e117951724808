import { and, eq } from "drizzle-orm";
import { attachments, packetRevisions, type Attachment } from "../../../db/schema";
import { can } from "../../auth/permissions";
import { extensionForMime, storageKey } from "../../storage";
import { KIND_RULES } from "../../uploads/kinds";
import type { ServiceContext } from "../context";
import { forbidden, notFound } from "../errors";

/** An attachment as the app shows it and the packet generator reads it. */
export interface AttachmentView {
  id: string;
  projectId: string | null;
  libraryItemId: string | null;
  kind: Attachment["kind"];
  equipmentTag: string | null;
  fileName: string;
  mimeType: string;
  sizeBytes: number;
  pageCount: number | null;
  sha256: string;
  uploadedBy: string | null;
  uploadedByName: string | null;
  createdAt: string;
  /** Packet revision numbers that merged this file; while any remain it cannot be deleted. */
  usedByRevisions: number[];
  downloadUrl: string;
}

export function toView(row: Attachment, uploadedByName: string | null, usedByRevisions: number[]): AttachmentView {
  return {
    id: row.id,
    projectId: row.projectId,
    libraryItemId: row.libraryItemId,
    kind: row.kind,
    equipmentTag: row.equipmentTag,
    fileName: row.fileName,
    mimeType: row.mimeType,
    sizeBytes: row.sizeBytes,
    pageCount: row.pageCount,
    sha256: row.sha256,
    uploadedBy: row.uploadedBy,
    uploadedByName,
    createdAt: row.createdAt,
    usedByRevisions,
    downloadUrl: `/api/attachments/${row.id}`,
  };
}

export function storageKeyOf(row: Pick<Attachment, "sha256" | "mimeType">): string {
  return storageKey(row.sha256, extensionForMime(row.mimeType));
}

/** Attachments are read by whoever reads the project or its approved set (installers work from the latter). */
export function requireAttachmentRead(ctx: ServiceContext): void {
  if (!can(ctx.roles, "project:read") && !can(ctx.roles, "packet:read")) throw forbidden("see attachments");
}

/**
 * Whether the actor reads only approved sets (an installer): they see the
 * files an approved revision merged, and the site photos of a project that has
 * an approved revision, never a design still in progress or a reviewer's stamp.
 */
export function readsApprovedSetsOnly(ctx: ServiceContext): boolean {
  return !can(ctx.roles, "project:read");
}

export function isInApprovedSet(ctx: ServiceContext, row: Pick<Attachment, "id" | "projectId" | "kind">): boolean {
  if (!row.projectId) return false;
  const approved = ctx.db
    .select({ attachmentIds: packetRevisions.attachmentIds })
    .from(packetRevisions)
    .where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, row.projectId), eq(packetRevisions.reviewState, "approved")))
    .all();
  if (approved.length === 0) return false;
  return row.kind === "photo" || approved.some((r) => r.attachmentIds.includes(row.id));
}

/** An attachment the actor may read: of their organisation, and for an installer part of an approved set. */
export function findReadableAttachment(ctx: ServiceContext, id: string): Attachment {
  requireAttachmentRead(ctx);
  const row = findAttachmentInOrg(ctx, id);
  if (readsApprovedSetsOnly(ctx) && !isInApprovedSet(ctx, row)) throw notFound("Attachment");
  return row;
}

export function findAttachmentInOrg(ctx: ServiceContext, id: string): Attachment {
  const row = ctx.db
    .select()
    .from(attachments)
    .where(and(eq(attachments.id, id), eq(attachments.orgId, ctx.orgId)))
    .get();
  if (!row) throw notFound("Attachment");
  return row;
}

/** Revision numbers per attachment id, over the organisation's revisions (or one project's). */
export function revisionsUsing(ctx: ServiceContext, projectId?: string | null): Map<string, number[]> {
  const where = projectId
    ? and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, projectId))
    : eq(packetRevisions.orgId, ctx.orgId);
  const rows = ctx.db
    .select({
      number: packetRevisions.number,
      attachmentIds: packetRevisions.attachmentIds,
      state: packetRevisions.state,
      reviewState: packetRevisions.reviewState,
    })
    .from(packetRevisions)
    .where(where)
    .all()
    // A draft whose generation failed has no packet to keep whole; a failed re-render of a reviewed revision still does.
    .filter((r) => !(r.state === "failed" && r.reviewState === "draft"));
  const used = new Map<string, number[]>();
  for (const r of rows) {
    for (const id of Array.isArray(r.attachmentIds) ? r.attachmentIds : []) {
      const list = used.get(id) ?? [];
      if (!list.includes(r.number)) list.push(r.number);
      used.set(id, list);
    }
  }
  for (const list of used.values()) list.sort((a, b) => a - b);
  return used;
}

/** “datasheet for INV-1”, “site plan” — how an attachment is named in messages. */
export function describeAttachment(row: Pick<Attachment, "kind" | "equipmentTag" | "fileName">): string {
  const kind = KIND_RULES[row.kind].label.toLowerCase();
  return `“${row.fileName}” (${kind}${row.equipmentTag ? ` for ${row.equipmentTag}` : ""})`;
}

export function revisionList(numbers: number[]): string {
  const names = numbers.map((n) => `Rev ${n}`);
  if (names.length <= 1) return names[0] ?? "";
  return `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}
