import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";

export const JOB_STATES = ["queued", "running", "done", "failed"] as const;

/**
 * Work done outside a request (packet rendering, re-stamping, mail delivery),
 * claimed by a worker process with a lease. Times are epoch milliseconds so the
 * claim compares numbers. A running job whose lease has passed lost its worker
 * and is claimed again.
 */
export const jobs = sqliteTable(
  "jobs",
  {
    id: id(),
    kind: text("kind").notNull(),
    payload: text("payload", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
    state: text("state", { enum: JOB_STATES }).notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    maxAttempts: integer("max_attempts").notNull().default(3),
    runAt: integer("run_at").notNull(),
    leaseOwner: text("lease_owner"),
    leaseUntil: integer("lease_until"),
    lastError: text("last_error"),
    createdAt: createdAt(),
    finishedAt: text("finished_at"),
  },
  (t) => [
    // The claim reads queued jobs due by run_at, and running jobs by lease expiry.
    index("jobs_claim_idx").on(t.state, t.runAt),
    index("jobs_lease_idx").on(t.state, t.leaseUntil),
  ],
);
export type Job = typeof jobs.$inferSelect;
