import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { users } from "../../../db/schema";
import { fileStore, StoredFileMissingError } from "../../storage";
import type { ServiceContext } from "../context";
import { notFound, ServiceError } from "../errors";
import { findReadableAttachment, revisionsUsing, storageKeyOf, toView, type AttachmentView } from "./view";

/** One attachment of the actor's organisation, without its bytes. */
export function getAttachment(ctx: ServiceContext, id: string): AttachmentView {
  const row = findReadableAttachment(ctx, id);
  const uploader = row.uploadedBy ? ctx.db.select({ name: users.name }).from(users).where(eq(users.id, row.uploadedBy)).get() : undefined;
  return toView(row, uploader?.name ?? null, revisionsUsing(ctx).get(row.id) ?? []);
}

/**
 * An attachment with its bytes, checked against the recorded SHA-256 so a
 * packet never merges a file other than the one that was checked on upload.
 */
export async function getAttachmentFile(ctx: ServiceContext, id: string): Promise<{ attachment: AttachmentView; bytes: Uint8Array }> {
  const attachment = getAttachment(ctx, id);
  let bytes: Uint8Array;
  try {
    bytes = await fileStore().get(storageKeyOf(attachment));
  } catch (error) {
    if (error instanceof StoredFileMissingError) throw notFound(`The stored copy of “${attachment.fileName}”`);
    throw error;
  }
  if (createHash("sha256").update(bytes).digest("hex") !== attachment.sha256) {
    throw new ServiceError("conflict", `The stored copy of “${attachment.fileName}” no longer matches its SHA-256; upload the file again.`);
  }
  return { attachment, bytes };
}

/** Several attachments' bytes in the order asked for (a packet's merge order). */
export async function getAttachmentFiles(ctx: ServiceContext, ids: readonly string[]): Promise<Array<{ attachment: AttachmentView; bytes: Uint8Array }>> {
  const files = [];
  for (const id of ids) files.push(await getAttachmentFile(ctx, id));
  return files;
}
