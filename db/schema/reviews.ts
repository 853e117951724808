import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { organisations } from "./organisations";
import { packetRevisions } from "./packet-revisions";
import { users } from "./users";

export interface LicenceSnapshot {
  reviewerName: string;
  licenceNumber: string;
  region: string;
  discipline: string;
  expiresOn: string | null;
}

/** The reviewer's disposition of one attest item, as printed in the review record. */
export interface AttestDispositionRecord {
  resultId: string;
  title: string;
  subject: string | null;
  disposition: "accepted" | "returned";
  note: string;
}

export const reviews = sqliteTable(
  "reviews",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    revisionId: text("revision_id")
      .notNull()
      .references(() => packetRevisions.id),
    reviewerId: text("reviewer_id")
      .notNull()
      .references(() => users.id),
    decision: text("decision", { enum: ["returned", "approved"] }).notNull(),
    generalNotes: text("general_notes").notNull().default(""),
    licenceSnapshot: text("licence_snapshot", { mode: "json" }).$type<LicenceSnapshot>(),
    /** The revision's record hash the approval is bound to. */
    approvedSha256: text("approved_sha256"),
    /** One per attest item of the revision: accepted with a note, or returned. */
    dispositions: text("dispositions", { mode: "json" }).$type<AttestDispositionRecord[]>().notNull().default([]),
    createdAt: createdAt(),
  },
  (t) => [index("reviews_revision_idx").on(t.revisionId)],
);
export type Review = typeof reviews.$inferSelect;

export const reviewNotes = sqliteTable("review_notes", {
  id: id(),
  reviewId: text("review_id")
    .notNull()
    .references(() => reviews.id, { onDelete: "cascade" }),
  targetKind: text("target_kind", { enum: ["check", "sheet", "general"] }).notNull(),
  /** Check result id ("max-pv-voltage:PV-1") or sheet number ("E-003"). */
  targetId: text("target_id").notNull().default(""),
  text: text("text").notNull(),
  createdAt: createdAt(),
});
export type ReviewNote = typeof reviewNotes.$inferSelect;
