import { sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { organisations } from "./organisations";
import { packetRevisions } from "./packet-revisions";
import { users } from "./users";

/** On-site confirmations against an approved revision: a label placed, an item matched to its nameplate. */
export const siteConfirmations = sqliteTable(
  "site_confirmations",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    revisionId: text("revision_id")
      .notNull()
      .references(() => packetRevisions.id),
    itemKind: text("item_kind", { enum: ["label", "equipment", "clearance"] }).notNull(),
    /** Label id, equipment tag or clearance name. */
    itemId: text("item_id").notNull(),
    confirmedBy: text("confirmed_by").references(() => users.id),
    photoAttachmentId: text("photo_attachment_id"),
    note: text("note").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("site_confirmations_item_idx").on(t.revisionId, t.itemKind, t.itemId)],
);
export type SiteConfirmation = typeof siteConfirmations.$inferSelect;
