import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { correctionItems } from "./corrections";
import { createdAt, id } from "./columns";
import { jurisdictions } from "./jurisdictions";
import { organisations } from "./organisations";
import { projects } from "./projects";
import { users } from "./users";

/**
 * A jurisdiction's unwritten rules as the office learns them: who wrote each
 * note, when, and from which project's correction. Append-only, so the log
 * reads as it was written.
 */
export const jurisdictionNotes = sqliteTable(
  "jurisdiction_notes",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    jurisdictionId: text("jurisdiction_id")
      .notNull()
      .references(() => jurisdictions.id),
    text: text("text").notNull(),
    userId: text("user_id").references(() => users.id),
    projectId: text("project_id").references(() => projects.id),
    correctionId: text("correction_id").references(() => correctionItems.id),
    createdAt: createdAt(),
  },
  (t) => [index("jurisdiction_notes_jurisdiction_idx").on(t.orgId, t.jurisdictionId)],
);
export type JurisdictionNote = typeof jurisdictionNotes.$inferSelect;
