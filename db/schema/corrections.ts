import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id, version } from "./columns";
import { organisations } from "./organisations";
import { projects } from "./projects";
import { submissionEvents, submissions } from "./submissions";
import { users } from "./users";

/**
 * One comment of an AHJ's plan-review letter, worked as an item: assigned to a
 * designer or reviewer, resolved with a response that the response sheet
 * prints for the resubmittal. The comment itself is never edited; a wrong
 * letter is voided with its event.
 */
export const correctionItems = sqliteTable(
  "correction_items",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    projectId: text("project_id")
      .notNull()
      .references(() => projects.id),
    submissionId: text("submission_id")
      .notNull()
      .references(() => submissions.id),
    /** The "corrections requested" event that brought the comment. */
    eventId: text("event_id")
      .notNull()
      .references(() => submissionEvents.id),
    /** The comment's number in the AHJ's letter, from 1. */
    number: integer("number").notNull(),
    comment: text("comment").notNull(),
    citation: text("citation").notNull().default(""),
    sheet: text("sheet").notNull().default(""),
    assigneeId: text("assignee_id").references(() => users.id),
    response: text("response").notNull().default(""),
    resolvedBy: text("resolved_by").references(() => users.id),
    resolvedAt: text("resolved_at"),
    createdAt: createdAt(),
    version: version(),
  },
  (t) => [index("correction_items_submission_idx").on(t.submissionId), index("correction_items_project_idx").on(t.orgId, t.projectId)],
);
export type CorrectionItemRow = typeof correctionItems.$inferSelect;
