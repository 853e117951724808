import type { Db } from "../../db/client";
import { env } from "../env";
import { runBullmqWorker } from "./bullmq";
import { jobHandlers, markSubjectFailed } from "./handlers";
import { runSqliteWorker } from "./sqlite";
import type { RunningWorker } from "./types";

/** Starts a worker on the configured backend with the product's handlers. */
export function startWorker(db: Db, log: (message: string) => void = () => undefined): RunningWorker {
  const { JOBS_BACKEND, REDIS_URL, JOBS_CONCURRENCY, JOBS_TIME_LIMIT_S, JOBS_LEASE_S, JOBS_BACKOFF_S } = env();
  const options = {
    handlers: jobHandlers(db),
    concurrency: JOBS_CONCURRENCY,
    timeLimitMs: JOBS_TIME_LIMIT_S * 1000,
    leaseMs: JOBS_LEASE_S * 1000,
    backoffMs: JOBS_BACKOFF_S * 1000,
    onFinalFailure: markSubjectFailed(db),
    log,
  };
  return JOBS_BACKEND === "bullmq" ? runBullmqWorker(REDIS_URL, options) : runSqliteWorker(db, options);
}
