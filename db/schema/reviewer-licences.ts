import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id, updatedAt, version } from "./columns";
import { organisations } from "./organisations";
import { users } from "./users";

/** A reviewer's professional licence; a snapshot is copied into each approval. */
export const reviewerLicences = sqliteTable(
  "reviewer_licences",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    userId: text("user_id")
      .notNull()
      .references(() => users.id),
    licenceNumber: text("licence_number").notNull(),
    /** State or province that issued the licence. */
    region: text("region").notNull(),
    discipline: text("discipline").notNull().default("Electrical"),
    expiresOn: text("expires_on"),
    stampAttachmentId: text("stamp_attachment_id"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
  },
  (t) => [index("reviewer_licences_user_idx").on(t.userId)],
);
export type ReviewerLicence = typeof reviewerLicences.$inferSelect;
