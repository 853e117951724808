import type { Db } from "../../db/client";
import { env, resolvePath } from "../env";
import { packetsRoot } from "../services/revisions/packet-files";
import { runBullmqWorker } from "./bullmq";
import { jobHandlers, markSubjectFailed } from "./handlers";
import { recoverLostRenders, removeStalePartFiles } from "./recover";
import { runSqliteWorker } from "./sqlite";
import type { RunningWorker } from "./types";

/** A 25 MB upload or a packet is written in seconds; a part this old is left by a process that was killed. */
const PART_FILE_MAX_AGE_MS = 10 * 60 * 1000;

/** Starts a worker on the configured backend with the product's handlers, after tidying what a killed process left. */
export function startWorker(db: Db, log: (message: string) => void = () => undefined): RunningWorker {
  const { JOBS_BACKEND, REDIS_URL, JOBS_CONCURRENCY, JOBS_TIME_LIMIT_S, JOBS_LEASE_S, JOBS_BACKOFF_S, STORAGE_BACKEND, UPLOADS_DIR } = env();
  if (JOBS_BACKEND === "sqlite") {
    for (const lost of recoverLostRenders(db)) log(`revision ${lost.number} (${lost.revisionId}) was left generating with no job; marked failed`);
  }
  const partRoots = [packetsRoot(), ...(STORAGE_BACKEND === "disk" ? [resolvePath(UPLOADS_DIR)] : [])];
  void removeStalePartFiles(partRoots, PART_FILE_MAX_AGE_MS).then((removed) => removed.length && log(`removed ${removed.length} unfinished file part(s)`));
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
