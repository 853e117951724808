import "server-only";
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { PDFDocument } from "pdf-lib";
import { attachments, reviewerLicences } from "../../../db/schema";
import { env } from "../../env";
import { fileStore } from "../../storage";
import { inspectUpload } from "../../uploads/inspect";
import { UploadRefusedError } from "../../uploads/refusal";
import { cleanFileName } from "../attachments/upload";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid } from "../errors";
import { toLicenceView, type LicenceView } from "./licence";
import { findOwnLicence } from "./shared";

/**
 * The stamp is printed about 1.5 in wide on each sheet; below 200 px it prints
 * visibly soft (about 130 dpi), which a permit office may reject (common practice).
 */
export const STAMP_MIN_PX = 200;

/**
 * Stores the reviewer's stamp image (PNG or JPEG, checked by content and by
 * pdf-lib, which draws it) as an attachment of kind "stamp" that belongs to no
 * project, and makes it the stamp of their licence record. The previous image
 * is kept: earlier approvals' audit rows name it.
 */
export async function uploadStampImage(ctx: ServiceContext, input: { fileName: string; bytes: Uint8Array }, options: { maxBytes?: number } = {}): Promise<LicenceView> {
  requirePermission(ctx, "licence:edit-own", "keep a licence record");
  requirePermission(ctx, "attachment:upload", "attach files");
  const licence = findOwnLicence(ctx);
  if (!licence) throw invalid("Save your licence record first; the stamp belongs to it.", [{ path: "licence", message: "is not on file" }]);
  const fileName = cleanFileName(input.fileName);
  const inspected = await inspectUpload(input.bytes, { fileName, kind: "stamp", maxBytes: options.maxBytes ?? env().UPLOAD_MAX_BYTES });

  const probe = await PDFDocument.create({ updateMetadata: false });
  const image = inspected.content.mimeType === "image/png" ? await probe.embedPng(input.bytes) : await probe.embedJpg(input.bytes);
  if (image.width < STAMP_MIN_PX || image.height < STAMP_MIN_PX) {
    throw new UploadRefusedError(
      "corrupt",
      `“${fileName}” is ${image.width} × ${image.height} px; a stamp must be at least ${STAMP_MIN_PX} × ${STAMP_MIN_PX} px to print sharply. Scan or export it at a higher resolution.`,
    );
  }

  const sha256 = createHash("sha256").update(input.bytes).digest("hex");
  await fileStore().put(input.bytes, inspected.content.extension);

  ctx.db.transaction((tx) => {
    const row = tx
      .insert(attachments)
      .values({
        orgId: ctx.orgId,
        projectId: null,
        kind: "stamp",
        fileName,
        mimeType: inspected.content.mimeType,
        sizeBytes: inspected.sizeBytes,
        pageCount: null,
        sha256,
        uploadedBy: ctx.user.id,
      })
      .returning({ id: attachments.id })
      .get();
    tx.update(reviewerLicences)
      // The version guards the typed fields; a new stamp does not make an open licence form stale.
      .set({ stampAttachmentId: row.id, updatedAt: new Date().toISOString() })
      .where(and(eq(reviewerLicences.id, licence.id), eq(reviewerLicences.orgId, ctx.orgId)))
      .run();
    audit(tx, ctx, "licence.stamp-uploaded", "reviewer_licence", licence.id, {
      attachmentId: row.id,
      previousAttachmentId: licence.stampAttachmentId,
      fileName,
      sha256,
      widthPx: image.width,
      heightPx: image.height,
    });
  });
  return toLicenceView(ctx)!;
}

export { UploadRefusedError };
