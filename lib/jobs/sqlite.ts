import { randomUUID } from "node:crypto";
import os from "node:os";
import type { Db } from "../../db/client";
import {
  backoffFor,
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

/** The embedded backend: jobs are rows of the product's own database, so enqueuing needs nothing else running. */
export function sqliteJobQueue(db: Db): JobQueue {
  const insert = db.$client.prepare(
    "insert into jobs (id, kind, payload, state, attempts, max_attempts, run_at) values (?, ?, ?, 'queued', 0, ?, ?)",
  );
  return {
    backend: "sqlite",
    async enqueue<K extends JobKind>(kind: K, payload: JobPayloads[K], options: EnqueueOptions = {}) {
      const id = randomUUID();
      insert.run(id, kind, JSON.stringify(payload), options.maxAttempts ?? DEFAULT_MAX_ATTEMPTS, Date.now() + (options.delayMs ?? 0));
      return id;
    },
    async close() {},
  };
}

interface JobRow {
  id: string;
  kind: string;
  payload: string;
  attempts: number;
  max_attempts: number;
}

/**
 * A worker over the jobs table. A claim is one UPDATE … RETURNING, atomic in
 * SQLite, so two workers never hold one job. The claim is a lease renewed while
 * the job runs; a worker that dies stops renewing, and once the lease passes the
 * job is claimed again (counted as an attempt).
 */
export function runSqliteWorker(db: Db, options: WorkerOptions): RunningWorker {
  const sqlite = db.$client;
  const owner = `${os.hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  const pollMs = options.pollMs ?? 250;
  const log = options.log ?? (() => undefined);

  // Jobs whose worker died on their last attempt: failed rather than run once more.
  const sweep = sqlite.prepare(
    `update jobs set state = 'failed', lease_owner = null, lease_until = null, finished_at = ?,
       last_error = coalesce(last_error || '; ', '') || 'the worker running it stopped (lease lost)'
     where state = 'running' and lease_until < ? and attempts >= max_attempts
     returning id, kind, payload, attempts, max_attempts`,
  );
  const claim = sqlite.prepare(
    `update jobs set state = 'running', lease_owner = ?, lease_until = ?, attempts = attempts + 1
     where id = (
       select id from (
         select id, run_at from jobs where state = 'queued' and run_at <= ?
         union all
         select id, run_at from jobs where state = 'running' and lease_until < ?
       ) order by run_at limit 1
     )
     returning id, kind, payload, attempts, max_attempts`,
  );
  const renew = sqlite.prepare("update jobs set lease_until = ? where id = ? and lease_owner = ? and state = 'running'");
  const finish = sqlite.prepare(
    "update jobs set state = 'done', lease_owner = null, lease_until = null, finished_at = ?, last_error = null where id = ? and lease_owner = ?",
  );
  const retry = sqlite.prepare(
    "update jobs set state = 'queued', lease_owner = null, lease_until = null, run_at = ?, last_error = ? where id = ? and lease_owner = ?",
  );
  const giveUp = sqlite.prepare(
    "update jobs set state = 'failed', lease_owner = null, lease_until = null, finished_at = ?, last_error = ? where id = ? and lease_owner = ?",
  );

  let stopping = false;
  const active = new Set<Promise<void>>();
  let wake: (() => void) | undefined;

  async function finalFailure(row: JobRow, reason: string) {
    if (!options.onFinalFailure || !isJobKind(row.kind)) return;
    try {
      await options.onFinalFailure(row.kind, JSON.parse(row.payload) as Record<string, unknown>, reason);
    } catch (error) {
      log(`job ${row.id}: marking its subject failed did not work: ${(error as Error).message}`);
    }
  }

  async function runJob(row: JobRow): Promise<void> {
    const heartbeat = setInterval(() => renew.run(Date.now() + options.leaseMs, row.id, owner), Math.max(50, Math.floor(options.leaseMs / 3)));
    try {
      if (!isJobKind(row.kind)) throw new Error(`no handler for jobs of kind "${row.kind}"`);
      const handler = options.handlers[row.kind] as (payload: unknown, info: { id: string; attempt: number; signal: AbortSignal }) => Promise<void>;
      await withTimeLimit(options.timeLimitMs, (signal) => handler(JSON.parse(row.payload), { id: row.id, attempt: row.attempts, signal }));
      finish.run(new Date().toISOString(), row.id, owner);
      log(`job ${row.id} (${row.kind}) done`);
    } catch (error) {
      const reason = (error as Error).message?.slice(0, 500) || String(error);
      if (row.attempts < row.max_attempts) {
        retry.run(Date.now() + backoffFor(options.backoffMs, row.attempts), `attempt ${row.attempts}: ${reason}`, row.id, owner);
        log(`job ${row.id} (${row.kind}) attempt ${row.attempts} failed, will retry: ${reason}`);
      } else {
        const changed = giveUp.run(new Date().toISOString(), `attempt ${row.attempts}: ${reason}`, row.id, owner).changes;
        log(`job ${row.id} (${row.kind}) failed its last attempt: ${reason}`);
        if (changed) await finalFailure(row, reason);
      }
    } finally {
      clearInterval(heartbeat);
    }
  }

  async function loop(): Promise<void> {
    while (!stopping) {
      const now = Date.now();
      for (const lost of sweep.all(new Date().toISOString(), now) as JobRow[]) {
        await finalFailure(lost, "the worker running it stopped before it finished");
      }
      let claimed = false;
      if (active.size < options.concurrency) {
        const row = claim.get(owner, now + options.leaseMs, now, now) as JobRow | undefined;
        if (row) {
          claimed = true;
          const running = runJob(row).finally(() => {
            active.delete(running);
            wake?.();
          });
          active.add(running);
        }
      }
      if (!claimed) await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, pollMs);
        wake = () => {
          clearTimeout(timer);
          resolve();
        };
      });
    }
  }

  const looping = loop().catch((error) => log(`the job loop stopped: ${(error as Error).message}`));
  return {
    async stop() {
      stopping = true;
      wake?.();
      await looping;
      await Promise.allSettled([...active]);
    },
  };
}

