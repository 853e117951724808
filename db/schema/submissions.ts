import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { EVENT_KINDS, SUBMISSION_METHODS } from "../../lib/schemas/submission";
import { createdAt, id, version } from "./columns";
import { jurisdictions } from "./jurisdictions";
import { organisations } from "./organisations";
import { packetRevisions } from "./packet-revisions";
import { projects } from "./projects";
import { users } from "./users";

export const SUBMISSION_EVENT_KINDS = EVENT_KINDS;
/** A stored row is an event of the application, or the void of one recorded in error (data: voidsEventId, reason). */
export const STORED_EVENT_KINDS = [...EVENT_KINDS, "voided"] as const;
export type StoredEventKind = (typeof STORED_EVENT_KINDS)[number];

export const submissions = sqliteTable(
  "submissions",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    projectId: text("project_id")
      .notNull()
      .references(() => projects.id),
    jurisdictionId: text("jurisdiction_id")
      .notNull()
      .references(() => jurisdictions.id),
    revisionId: text("revision_id")
      .notNull()
      .references(() => packetRevisions.id),
    method: text("method", { enum: SUBMISSION_METHODS }).notNull(),
    referenceNumber: text("reference_number").notNull().default(""),
    /** Where the application stands (the latest event that is not voided nor a fee), kept for the queue; the events are the record. */
    status: text("status", { enum: SUBMISSION_EVENT_KINDS }).notNull().default("submitted"),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    version: version(),
  },
  (t) => [
    index("submissions_org_idx").on(t.orgId, t.status),
    // The submissions list pages by (created_at, id) newest first.
    index("submissions_org_created_idx").on(t.orgId, t.createdAt, t.id),
  ],
);
export type Submission = typeof submissions.$inferSelect;

/** Append-only: events are never updated or deleted; a mistaken one is voided by a later row. */
export const submissionEvents = sqliteTable(
  "submission_events",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    submissionId: text("submission_id")
      .notNull()
      .references(() => submissions.id),
    kind: text("kind", { enum: STORED_EVENT_KINDS }).notNull(),
    occurredOn: text("occurred_on").notNull(),
    userId: text("user_id").references(() => users.id),
    note: text("note").notNull().default(""),
    /** Permit number and expiry, fee amount, inspection kind (rough, final, fire final) … */
    data: text("data", { mode: "json" }).$type<Record<string, unknown>>().notNull().default({}),
    createdAt: createdAt(),
  },
  (t) => [
    index("submission_events_submission_idx").on(t.submissionId),
    // The office's queue reads the organisation's events in one query.
    index("submission_events_org_idx").on(t.orgId),
  ],
);
export type SubmissionEvent = typeof submissionEvents.$inferSelect;
