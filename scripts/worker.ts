/**
 * npm run worker — runs background jobs (packet rendering, re-stamping, mail
 * delivery) from the configured queue: the database file (JOBS_BACKEND=sqlite,
 * this machine) or Redis (JOBS_BACKEND=bullmq, REDIS_URL; any machine that
 * reaches it and the same storage). Built to dist/worker.cjs by
 * `npm run build:worker`; the web server starts one beside itself unless
 * JOBS_WORKER=external.
 */
import { getDb } from "../db/client";
import { env } from "../lib/env";
import { startWorker } from "../lib/jobs/worker";

function main(): void {
  const { JOBS_BACKEND, JOBS_CONCURRENCY } = env();
  const db = getDb();
  const log = (message: string) => console.log(`[worker ${process.pid}] ${message}`);
  const worker = startWorker(db, log);
  log(`running ${JOBS_BACKEND} jobs, ${JOBS_CONCURRENCY} at a time`);

  let stopping = false;
  const stop = (why: string) => {
    if (stopping) return;
    stopping = true;
    log(`stopping (${why}); finishing the jobs in hand`);
    void worker.stop().then(() => {
      db.$client.close();
      process.exit(0);
    });
  };
  process.on("SIGTERM", () => stop("SIGTERM"));
  process.on("SIGINT", () => stop("SIGINT"));
  // Started by the web server: leave with it. A job cut short is claimed again once its lease passes.
  if (process.send) process.on("disconnect", () => stop("the web server went away"));
}

main();
