import { Queue, Worker, type ConnectionOptions } from "bullmq";
import {
  DEFAULT_MAX_ATTEMPTS,
  isJobKind,
  withTimeLimit,
  type EnqueueOptions,
  type JobKind,
  type JobPayloads,
  type JobQueue,
  type RunningWorker,
  type WorkerOptions,
} from "./types";

export const BULLMQ_QUEUE_NAME = "sundocket-jobs";

/** redis://host:port/db as BullMQ's connection options. */
export function redisConnection(url: string): ConnectionOptions {
  const parsed = new URL(url);
  return {
    host: parsed.hostname || "127.0.0.1",
    port: Number(parsed.port || 6379),
    ...(parsed.password ? { password: decodeURIComponent(parsed.password) } : {}),
    ...(parsed.pathname.length > 1 ? { db: Number(parsed.pathname.slice(1)) } : {}),
    // Workers block on Redis; BullMQ requires commands to wait for a reconnect rather than fail.
    maxRetriesPerRequest: null,
  };
}

/** The scale-out backend: the same jobs on Redis, claimed by workers on any number of machines. */
export function bullmqJobQueue(redisUrl: string, options: { backoffMs?: number; queueName?: string } = {}): JobQueue {
  const queue = new Queue(options.queueName ?? BULLMQ_QUEUE_NAME, { connection: redisConnection(redisUrl) });
  return {
    backend: "bullmq",
    async enqueue<K extends JobKind>(kind: K, payload: JobPayloads[K], enqueueOptions: EnqueueOptions = {}) {
      const job = await queue.add(kind, payload, {
        attempts: enqueueOptions.maxAttempts ?? DEFAULT_MAX_ATTEMPTS,
        backoff: { type: "exponential", delay: options.backoffMs ?? 2_000 },
        delay: enqueueOptions.delayMs ?? 0,
        // Kept for a while so the outcome can be read, then dropped: the product's own tables hold the results.
        removeOnComplete: { count: 1_000 },
        removeOnFail: { count: 5_000 },
      });
      return job.id!;
    },
    async close() {
      await queue.close();
    },
  };
}

/**
 * A BullMQ worker running the same handlers. BullMQ's lock is the lease: a
 * worker renews it while a job runs, and a job whose lock lapses (its worker
 * died) is found "stalled" and run again; a second stall fails it.
 */
export function runBullmqWorker(redisUrl: string, options: WorkerOptions & { queueName?: string }): RunningWorker {
  const log = options.log ?? (() => undefined);
  const worker = new Worker(
    options.queueName ?? BULLMQ_QUEUE_NAME,
    async (job) => {
      if (!isJobKind(job.name)) throw new Error(`no handler for jobs of kind "${job.name}"`);
      const handler = options.handlers[job.name] as (payload: unknown, info: { id: string; attempt: number; signal: AbortSignal }) => Promise<void>;
      await withTimeLimit(options.timeLimitMs, (signal) => handler(job.data, { id: job.id!, attempt: job.attemptsMade + 1, signal }));
    },
    {
      connection: redisConnection(redisUrl),
      concurrency: options.concurrency,
      lockDuration: options.leaseMs,
      stalledInterval: Math.max(1_000, Math.floor(options.leaseMs / 2)),
      maxStalledCount: 1,
    },
  );
  worker.on("completed", (job) => log(`job ${job.id} (${job.name}) done`));
  worker.on("failed", (job, error) => {
    if (!job) return;
    const final = job.attemptsMade >= (job.opts.attempts ?? 1) || /stalled/i.test(error.message);
    log(`job ${job.id} (${job.name}) attempt ${job.attemptsMade} failed${final ? " (last)" : ", will retry"}: ${error.message}`);
    if (final && options.onFinalFailure && isJobKind(job.name)) {
      void Promise.resolve(options.onFinalFailure(job.name, job.data as Record<string, unknown>, error.message)).catch(() => undefined);
    }
  });
  worker.on("error", (error) => log(`worker: ${error.message}`));
  return {
    async stop() {
      await worker.close();
    },
  };
}
