import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { organisations } from "./organisations";
import { reviewNotes } from "./reviews";
import { users } from "./users";

export const NOTE_ACTIONS = ["reply", "addressed", "closed", "reopened"] as const;
export type NoteAction = (typeof NOTE_ACTIONS)[number];

/**
 * The conversation under a reviewer's note: replies, the designer marking it
 * addressed, the reviewer closing or reopening it. Append-only; the note's
 * state is the latest action that is not a plain reply.
 */
export const reviewNoteReplies = sqliteTable(
  "review_note_replies",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    noteId: text("note_id")
      .notNull()
      .references(() => reviewNotes.id, { onDelete: "cascade" }),
    userId: text("user_id").references(() => users.id),
    action: text("action", { enum: NOTE_ACTIONS }).notNull(),
    body: text("body").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("review_note_replies_note_idx").on(t.noteId)],
);
export type ReviewNoteReply = typeof reviewNoteReplies.$inferSelect;
