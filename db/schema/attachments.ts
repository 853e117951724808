import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { ATTACHMENT_KINDS } from "../../lib/schemas/project-record";
import { createdAt, id } from "./columns";
import { equipmentLibrary } from "./equipment-library";
import { organisations } from "./organisations";
import { projects } from "./projects";
import { users } from "./users";

export { ATTACHMENT_KINDS };

/** Files are stored under uploads/ by SHA-256; one row per use of a file. */
export const attachments = sqliteTable(
  "attachments",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    projectId: text("project_id").references(() => projects.id),
    libraryItemId: text("library_item_id").references(() => equipmentLibrary.id),
    /** Project equipment tag the file documents (INV-1), for per-equipment datasheets. */
    equipmentTag: text("equipment_tag"),
    kind: text("kind", { enum: ATTACHMENT_KINDS }).notNull(),
    fileName: text("file_name").notNull(),
    mimeType: text("mime_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    pageCount: integer("page_count"),
    sha256: text("sha256").notNull(),
    uploadedBy: text("uploaded_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("attachments_project_idx").on(t.orgId, t.projectId), index("attachments_sha_idx").on(t.orgId, t.sha256)],
);
export type Attachment = typeof attachments.$inferSelect;
export type NewAttachment = typeof attachments.$inferInsert;
