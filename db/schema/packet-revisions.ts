import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { organisations } from "./organisations";
import { projects } from "./projects";
import { users } from "./users";

export const REVISION_STATES = ["generating", "ready", "failed"] as const;
export const REVIEW_STATES = ["draft", "in-review", "returned", "approved"] as const;

/**
 * A generated packet. The snapshots freeze what was checked; the approval is
 * bound to `recordSha256`, so any later change needs a new revision.
 */
export const packetRevisions = sqliteTable(
  "packet_revisions",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    projectId: text("project_id")
      .notNull()
      .references(() => projects.id),
    number: integer("number").notNull(),
    state: text("state", { enum: REVISION_STATES }).notNull().default("generating"),
    progressStep: text("progress_step").notNull().default("queued"),
    error: text("error"),
    reviewState: text("review_state", { enum: REVIEW_STATES }).notNull().default("draft"),
    recordSnapshot: text("record_snapshot", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
    resultsSnapshot: text("results_snapshot", { mode: "json" }).$type<unknown>().notNull(),
    recordSha256: text("record_sha256").notNull(),
    /** Attachment ids merged into the packet, in order; such attachments cannot be deleted. */
    attachmentIds: text("attachment_ids", { mode: "json" }).$type<string[]>().notNull().default([]),
    isDraft: integer("is_draft", { mode: "boolean" }).notNull().default(true),
    pdfPath: text("pdf_path"),
    pdfSha256: text("pdf_sha256"),
    pageCount: integer("page_count"),
    docxPath: text("docx_path"),
    docxSha256: text("docx_sha256"),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("packet_revisions_number_idx").on(t.projectId, t.number), index("packet_revisions_org_idx").on(t.orgId, t.reviewState)],
);
export type PacketRevision = typeof packetRevisions.$inferSelect;
