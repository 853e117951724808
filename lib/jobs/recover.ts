import fs from "node:fs/promises";
import path from "node:path";
import { eq } from "drizzle-orm";
import type { Db } from "../../db/client";
import { jobs, packetRevisions } from "../../db/schema";
import { failRevision } from "../services/revisions/generate";

/**
 * What a worker tidies when it starts, after a process was killed outright.
 *
 * A revision is marked "generating" in one transaction and its job queued
 * just after; a server killed between the two leaves a revision that no job
 * will ever finish. Such a revision is marked failed with the reason, so the
 * designer (or, for a stamped set, the reviewer) sees it and renders it again.
 * Only the jobs table can say no job is coming: with BullMQ the jobs live in
 * Redis, and a lost job there ends through its own retries.
 */
export function recoverLostRenders(db: Db): { revisionId: string; number: number }[] {
  const generating = db
    .select({ id: packetRevisions.id, number: packetRevisions.number, reviewState: packetRevisions.reviewState })
    .from(packetRevisions)
    .where(eq(packetRevisions.state, "generating"))
    .all();
  if (generating.length === 0) return [];
  const pending = new Set<string>();
  for (const job of db.select({ kind: jobs.kind, payload: jobs.payload, state: jobs.state }).from(jobs).all()) {
    if ((job.state === "queued" || job.state === "running") && (job.kind === "packet.generate" || job.kind === "packet.restamp")) {
      const id = job.payload?.revisionId;
      if (typeof id === "string") pending.add(id);
    }
  }
  const recovered: { revisionId: string; number: number }[] = [];
  for (const row of generating) {
    if (pending.has(row.id)) continue;
    const again = row.reviewState === "approved" ? "render the stamped packet again" : "generate a new revision";
    failRevision(db, row.id, `the server stopped before this rendering was queued, so it never ran; ${again}.`);
    recovered.push({ revisionId: row.id, number: row.number });
  }
  return recovered;
}

/**
 * Files are written beside their final name as "<name>.<uuid>.part" and
 * renamed when whole; a process killed mid-write leaves the part behind.
 * Parts older than `olderThanMs` are no one's write in progress any more.
 */
export async function removeStalePartFiles(roots: string[], olderThanMs: number, now = Date.now()): Promise<string[]> {
  const removed: string[] = [];
  for (const root of roots) {
    let names: string[];
    try {
      names = (await fs.readdir(root, { recursive: true })).map(String);
    } catch {
      continue;
    }
    for (const name of names) {
      if (!name.endsWith(".part")) continue;
      const file = path.join(root, name);
      try {
        if (now - (await fs.stat(file)).mtimeMs < olderThanMs) continue;
        await fs.rm(file, { force: true });
        removed.push(file);
      } catch {
        // Renamed or removed by its writer meanwhile.
      }
    }
  }
  return removed;
}
