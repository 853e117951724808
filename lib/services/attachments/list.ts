import { and, asc, eq } from "drizzle-orm";
import { attachments, users } from "../../../db/schema";
import type { ServiceContext } from "../context";
import { findProjectInOrg } from "../projects/load";
import { isInApprovedSet, readsApprovedSetsOnly, requireAttachmentRead, revisionsUsing, toView, type AttachmentView } from "./view";

/** A project's attachments, oldest first (the order the packet merges datasheets in). */
export function listProjectAttachments(ctx: ServiceContext, projectId: string): AttachmentView[] {
  requireAttachmentRead(ctx);
  const project = findProjectInOrg(ctx, projectId);
  const used = revisionsUsing(ctx);
  const installerOnly = readsApprovedSetsOnly(ctx);
  return ctx.db
    .select({ row: attachments, uploadedByName: users.name })
    .from(attachments)
    .leftJoin(users, and(eq(users.id, attachments.uploadedBy), eq(users.orgId, ctx.orgId)))
    .where(and(eq(attachments.orgId, ctx.orgId), eq(attachments.projectId, project.id)))
    .orderBy(asc(attachments.createdAt), asc(attachments.fileName))
    .all()
    .filter(({ row }) => !installerOnly || isInApprovedSet(ctx, row))
    .map(({ row, uploadedByName }) => toView(row, uploadedByName, used.get(row.id) ?? []));
}
