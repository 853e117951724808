import type { Db } from "../../db/client";
import { deliverQueued } from "../email/outbox";
import { failRevision, generateRevisionArtifacts } from "../services/revisions/generate";
import type { JobHandlers, JobKind } from "./types";

/**
 * What each job does. Rendering records its own outcome on the revision (a
 * missing datasheet is a failed revision, not a retry); only a crash or a
 * time-out reaches the queue and is retried.
 */
export function jobHandlers(db: Db): JobHandlers {
  const render = async ({ revisionId }: { revisionId: string }) => {
    await generateRevisionArtifacts(db, revisionId);
  };
  return {
    "packet.generate": render,
    "packet.restamp": render,
    "mail.deliver": async ({ orgId }) => {
      await deliverQueued(db, orgId);
    },
  };
}

/** After the last attempt: a revision still "generating" is marked failed so the designer sees why. */
export function markSubjectFailed(db: Db) {
  return (kind: JobKind, payload: Record<string, unknown>, reason: string) => {
    if ((kind === "packet.generate" || kind === "packet.restamp") && typeof payload.revisionId === "string") {
      failRevision(db, payload.revisionId, `the rendering did not finish after its retries (${reason})`);
    }
  };
}
