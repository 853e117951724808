/**
 * One interface for work done outside a request, whatever runs it: a jobs table
 * in the product's own SQLite file (the embedded default) or BullMQ over Redis
 * (many workers on many machines). Services enqueue; workers run handlers.
 */
export const JOB_KINDS = ["packet.generate", "packet.restamp", "mail.deliver"] as const;
export type JobKind = (typeof JOB_KINDS)[number];

export interface JobPayloads {
  /** Render a new revision's PDF and DOCX. */
  "packet.generate": { revisionId: string };
  /** Render an approved revision again with its stamp. */
  "packet.restamp": { revisionId: string };
  /** Send an organisation's queued e-mail. */
  "mail.deliver": { orgId: string };
}

export interface EnqueueOptions {
  /** Attempts in all, the first included. */
  maxAttempts?: number;
  delayMs?: number;
}

export interface JobQueue {
  readonly backend: "sqlite" | "bullmq";
  enqueue<K extends JobKind>(kind: K, payload: JobPayloads[K], options?: EnqueueOptions): Promise<string>;
  close(): Promise<void>;
}

export interface JobInfo {
  id: string;
  /** 1 on the first run. */
  attempt: number;
  /** Aborted when the time limit passes; a handler that can stop early should. */
  signal: AbortSignal;
}

export type JobHandlers = { [K in JobKind]: (payload: JobPayloads[K], info: JobInfo) => Promise<void> };

export interface WorkerOptions {
  handlers: JobHandlers;
  /** Jobs run at once by this worker. */
  concurrency: number;
  /** A run taking longer fails its attempt. */
  timeLimitMs: number;
  /** How long a claim holds without a heartbeat; a worker that dies loses its jobs to another after this. */
  leaseMs: number;
  /** The first retry waits this long; each further one twice as long. */
  backoffMs: number;
  /** How often an idle worker looks for work (the SQLite backend; BullMQ blocks on Redis instead). */
  pollMs?: number;
  /** Called once when a job has failed its last attempt, so its subject can be marked failed. */
  onFinalFailure?: (kind: JobKind, payload: Record<string, unknown>, reason: string) => void | Promise<void>;
  log?: (message: string) => void;
}

export interface RunningWorker {
  /** Stops claiming and waits for the jobs in hand. */
  stop(): Promise<void>;
}

export const DEFAULT_MAX_ATTEMPTS = 3;

export function isJobKind(kind: string): kind is JobKind {
  return (JOB_KINDS as readonly string[]).includes(kind);
}

/** Runs a handler under the time limit: the attempt fails when the limit passes, and the handler's signal is aborted. */
export async function withTimeLimit(timeLimitMs: number, run: (signal: AbortSignal) => Promise<void>): Promise<void> {
  const controller = new AbortController();
  let timer: NodeJS.Timeout | undefined;
  const limit = new Promise<never>((_, reject) => {
    timer = setTimeout(() => {
      const error = new Error(`the job took longer than its limit of ${Math.round(timeLimitMs / 1000)} s`);
      controller.abort(error);
      reject(error);
    }, timeLimitMs);
  });
  try {
    await Promise.race([run(controller.signal), limit]);
  } finally {
    clearTimeout(timer);
  }
}

export function backoffFor(backoffMs: number, attempt: number): number {
  return backoffMs * 2 ** Math.max(0, attempt - 1);
}
