import "server-only";
import { and, eq } from "drizzle-orm";
import { attachments, projects } from "../../../db/schema";
import { fileStore } from "../../storage";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict } from "../errors";
import { describeAttachment, findAttachmentInOrg, revisionList, revisionsUsing, storageKeyOf } from "./view";

/**
 * Deletes an attachment no packet revision has merged. A revision keeps the
 * files it was generated from, so a stamped set can always be reproduced.
 */
export async function deleteAttachment(ctx: ServiceContext, id: string): Promise<{ id: string; message: string }> {
  requirePermission(ctx, "attachment:delete", "delete attachments");
  const row = findAttachmentInOrg(ctx, id);

  const removed = ctx.db.transaction((tx) => {
    // Read inside the write so a revision generated meanwhile still protects the file.
    const used = revisionsUsing({ ...ctx, db: tx as unknown as ServiceContext["db"] }).get(row.id) ?? [];
    if (used.length > 0) {
      throw conflict(
        `${describeAttachment(row)} cannot be deleted: it is merged into ${revisionList(used)} of the packet, and a revision keeps the files it was generated from. Generate a new revision without it instead.`,
      );
    }
    tx.delete(attachments).where(and(eq(attachments.id, row.id), eq(attachments.orgId, ctx.orgId))).run();
    audit(tx, ctx, "attachment.deleted", "attachment", row.id, {
      projectId: row.projectId,
      kind: row.kind,
      equipmentTag: row.equipmentTag,
      fileName: row.fileName,
      sha256: row.sha256,
    });
    // The store is shared by content; the bytes go only when no row anywhere still uses them.
    const stillUsed = tx
      .select({ id: attachments.id })
      .from(attachments)
      .where(and(eq(attachments.sha256, row.sha256), eq(attachments.mimeType, row.mimeType)))
      .get();
    return { lastUse: !stillUsed };
  });
  if (removed.lastUse) await fileStore().remove(storageKeyOf(row));

  const project = row.projectId
    ? ctx.db.select({ name: projects.name }).from(projects).where(and(eq(projects.id, row.projectId), eq(projects.orgId, ctx.orgId))).get()
    : undefined;
  return { id: row.id, message: `Deleted ${describeAttachment(row)}${project ? ` from ${project.name}` : ""}.` };
}
