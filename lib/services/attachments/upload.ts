import "server-only";
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { attachments, projectEquipment, users, type Attachment } from "../../../db/schema";
import { env } from "../../env";
import { ATTACHMENT_KINDS } from "../../schemas/project-record";
import { formatIssues, tagSchema } from "../../schemas/fields";
import { fileStore } from "../../storage";
import { inspectUpload } from "../../uploads/inspect";
import { KIND_RULES, kindsForRoles, type AttachmentKind } from "../../uploads/kinds";
import { refuseWrongEquipmentKind } from "./equipment-kind";
import { UploadRefusedError } from "../../uploads/refusal";
import { audit, requirePermission, type ServiceContext } from "../context";
import { forbidden, invalid } from "../errors";
import { findProjectInOrg } from "../projects/load";
import { describeAttachment, revisionsUsing, storageKeyOf, toView, type AttachmentView } from "./view";

const blankToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

export const uploadFieldsSchema = z.object({
  projectId: z.string({ error: "is required" }).min(1, { message: "is required" }).max(64),
  kind: z.enum(ATTACHMENT_KINDS, { error: `must be one of ${ATTACHMENT_KINDS.join(", ")}` }),
  equipmentTag: z.preprocess(blankToUndefined, tagSchema.optional()),
});

export interface UploadInput {
  projectId: unknown;
  kind: unknown;
  equipmentTag?: unknown;
  fileName: string;
  bytes: Uint8Array;
}

export interface UploadResult {
  attachment: AttachmentView;
  /** True when the project already had these exact bytes; nothing new was stored. */
  duplicate: boolean;
  message: string;
}

/**
 * Checks a file by its content, stores it by SHA-256 and records it against
 * the project. The same bytes uploaded to the same project again answer the
 * existing attachment instead of a second row.
 */
export async function uploadAttachment(ctx: ServiceContext, input: UploadInput, options: { maxBytes?: number } = {}): Promise<UploadResult> {
  requirePermission(ctx, "attachment:upload", "attach files");
  const parsed = uploadFieldsSchema.safeParse({ projectId: input.projectId, kind: input.kind, equipmentTag: input.equipmentTag });
  if (!parsed.success) throw invalid("The file was not attached: some fields are not valid.", formatIssues(parsed.error));
  const { projectId, kind, equipmentTag } = parsed.data;
  const rule = KIND_RULES[kind];
  if (!kindsForRoles(ctx.roles).includes(kind)) throw forbidden(`attach a ${rule.label.toLowerCase()}`);

  const project = findProjectInOrg(ctx, projectId);
  const equipment = resolveEquipment(ctx, project.id, kind, equipmentTag);
  const fileName = cleanFileName(input.fileName);

  const inspected = await inspectUpload(input.bytes, { fileName, kind, maxBytes: options.maxBytes ?? env().UPLOAD_MAX_BYTES });
  const sha256 = createHash("sha256").update(input.bytes).digest("hex");

  const existing = findDuplicate(ctx, project.id, sha256);
  if (existing) return await duplicateResult(ctx, existing, fileName, input.bytes);

  const store = fileStore();
  const stored = await store.put(input.bytes, inspected.content.extension);

  const outcome = ctx.db.transaction((tx) => {
    // Looked up again inside the write: two uploads of one file at once leave one row.
    const raced = tx
      .select()
      .from(attachments)
      .where(and(eq(attachments.orgId, ctx.orgId), eq(attachments.projectId, project.id), eq(attachments.sha256, sha256)))
      .get();
    if (raced) return { row: raced, created: false };
    const row = tx
      .insert(attachments)
      .values({
        orgId: ctx.orgId,
        projectId: project.id,
        libraryItemId: equipment?.libraryItemId ?? null,
        equipmentTag: equipment?.tag ?? null,
        kind,
        fileName,
        mimeType: inspected.content.mimeType,
        sizeBytes: inspected.sizeBytes,
        pageCount: inspected.pageCount,
        sha256,
        uploadedBy: ctx.user.id,
      })
      .returning()
      .get();
    audit(tx, ctx, "attachment.uploaded", "attachment", row.id, {
      projectId: project.id,
      kind,
      equipmentTag: row.equipmentTag,
      fileName,
      sha256,
      sizeBytes: row.sizeBytes,
      pageCount: row.pageCount,
    });
    return { row, created: true };
  });
  if (!outcome.created) return await duplicateResult(ctx, outcome.row, fileName, input.bytes);

  // A delete of the last other use of these bytes may have removed them between put and insert.
  if (!(await store.exists(stored.key))) await store.put(input.bytes, inspected.content.extension);

  const row = outcome.row;
  const pages = row.pageCount === null ? "" : `, ${row.pageCount} ${row.pageCount === 1 ? "page" : "pages"}`;
  return {
    attachment: toView(row, ctx.user.name, []),
    duplicate: false,
    message: `Attached ${describeAttachment(row)}${pages}.`,
  };
}

function resolveEquipment(ctx: ServiceContext, projectId: string, kind: AttachmentKind, equipmentTag: string | undefined) {
  const rule = KIND_RULES[kind];
  if (!equipmentTag) {
    if (rule.equipment === "required") {
      throw invalid(`A ${rule.label.toLowerCase()} documents one piece of equipment: choose its tag.`, [
        { path: "equipmentTag", message: `is required for a ${rule.label.toLowerCase()}` },
      ]);
    }
    return null;
  }
  const rows = ctx.db
    .select({ tag: projectEquipment.tag, kind: projectEquipment.kind, libraryItemId: projectEquipment.libraryItemId })
    .from(projectEquipment)
    .where(eq(projectEquipment.projectId, projectId))
    .all();
  const match = rows.find((r) => r.tag === equipmentTag);
  if (!match) {
    const known = rows.map((r) => r.tag).join(", ");
    throw invalid(`This project has no equipment tagged “${equipmentTag}”.`, [
      { path: "equipmentTag", message: known ? `names no equipment of this project (it has ${known})` : "names no equipment: the project has none yet" },
    ]);
  }
  refuseWrongEquipmentKind(kind, match);
  return { tag: match.tag, libraryItemId: match.libraryItemId };
}

function findDuplicate(ctx: ServiceContext, projectId: string, sha256: string): Attachment | undefined {
  return ctx.db
    .select()
    .from(attachments)
    .where(and(eq(attachments.orgId, ctx.orgId), eq(attachments.projectId, projectId), eq(attachments.sha256, sha256)))
    .get();
}

async function duplicateResult(ctx: ServiceContext, existing: Attachment, fileName: string, bytes: Uint8Array): Promise<UploadResult> {
  // The row is the record of truth; if its bytes went missing from the store, this upload restores them.
  const store = fileStore();
  const key = storageKeyOf(existing);
  if (!(await store.exists(key))) await store.put(bytes, key.slice(key.lastIndexOf(".") + 1));
  const uploader = existing.uploadedBy
    ? ctx.db
        .select({ name: users.name })
        .from(users)
        .where(and(eq(users.id, existing.uploadedBy), eq(users.orgId, ctx.orgId)))
        .get()
    : undefined;
  return {
    attachment: toView(existing, uploader?.name ?? null, revisionsUsing(ctx).get(existing.id) ?? []),
    duplicate: true,
    message: `“${fileName}” is already attached as ${describeAttachment(existing)}, added ${existing.createdAt.slice(0, 10)}. Nothing new was stored.`,
  };
}

/** Keeps the name a person gave the file, without folders or control characters, for lists and downloads. */
export function cleanFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const cleaned = base.replace(/[\u0000-\u001f\u007f]/g, "").trim().slice(0, 255);
  return cleaned || "unnamed";
}

export { UploadRefusedError };
