import type { Db } from "../../db/client";
import { env } from "../env";
import { failRevision } from "../services/revisions/generate";
import { bullmqJobQueue } from "./bullmq";
import { sqliteJobQueue } from "./sqlite";
import type { JobKind, JobPayloads, JobQueue } from "./types";

export * from "./types";

const globalForJobs = globalThis as unknown as { sundocketJobQueue?: { db: Db; queue: JobQueue } };

/** The configured queue (JOBS_BACKEND), one per process. */
export function jobQueue(db: Db): JobQueue {
  const held = globalForJobs.sundocketJobQueue;
  if (held && held.db === db) return held.queue;
  const { JOBS_BACKEND, REDIS_URL, JOBS_BACKOFF_S } = env();
  const queue = JOBS_BACKEND === "bullmq" ? bullmqJobQueue(REDIS_URL, { backoffMs: JOBS_BACKOFF_S * 1000 }) : sqliteJobQueue(db);
  globalForJobs.sundocketJobQueue = { db, queue };
  return queue;
}

/**
 * Enqueues after the caller's transaction has committed. A queue that cannot
 * take the job (Redis down) is reported to `onRefused`, so the subject is
 * marked failed rather than left waiting for ever.
 */
export function enqueueJob<K extends JobKind>(db: Db, kind: K, payload: JobPayloads[K], onRefused?: (reason: string) => void): Promise<void> {
  return jobQueue(db)
    .enqueue(kind, payload)
    .then(
      () => undefined,
      (error: Error) => {
        console.error(`could not queue a ${kind} job`, error);
        onRefused?.(`the job queue refused it (${error.message})`);
      },
    );
}

/** Renders a revision in a worker; a queue that refuses the job fails the revision with the reason. */
export function renderLater(db: Db, kind: "packet.generate" | "packet.restamp", revisionId: string): Promise<void> {
  return enqueueJob(db, kind, { revisionId }, (reason) => failRevision(db, revisionId, reason));
}

/** Sends an organisation's queued e-mail from a worker, after the caller's commit. */
export function deliverLater(db: Db, orgId: string): Promise<void> {
  return enqueueJob(db, "mail.deliver", { orgId });
}
