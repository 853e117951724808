import { and, eq, max } from "drizzle-orm";
import { packetRevisions } from "../../../db/schema";
import { canonicalJson, sha256Hex } from "../../canonical-json";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict } from "../errors";
import { renderLater } from "../../jobs";
import { buildPreflight, type Preflight } from "./preflight";

/** A generation still "generating" after this long has lost its process; a packet takes seconds, not minutes. */
export const STALE_GENERATION_MS = 10 * 60 * 1000;

export interface StartOptions {
  /** Hands the revision to the process that renders it; tests render in-process instead. */
  dispatch?: (revisionId: string) => void;
  now?: Date;
}

export interface StartedRevision {
  revisionId: string;
  number: number;
  isDraft: boolean;
  preflight: Preflight;
}

/**
 * Freezes the record and its check run as a new revision and hands the
 * rendering to a worker through the job queue, so the request returns at once and other
 * users are not kept waiting. The approval of any revision is bound to the
 * SHA-256 of this snapshot's canonical JSON.
 */
export function startRevision(ctx: ServiceContext, projectId: string, options: StartOptions = {}): StartedRevision {
  requirePermission(ctx, "packet:generate", "generate packets");
  const { stored, run, documents, preflight } = buildPreflight(ctx, projectId);
  const recordSha256 = sha256Hex(canonicalJson(stored.record));
  const now = options.now ?? new Date();

  const created = ctx.db.transaction((tx) => {
    const running = tx
      .select()
      .from(packetRevisions)
      .where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, stored.projectId), eq(packetRevisions.state, "generating")))
      .all()
      // A stamped set being rendered again after approval is not a new generation, and its createdAt says nothing of when that began.
      .filter((r) => r.reviewState === "draft");
    for (const r of running) {
      const age = now.getTime() - Date.parse(r.createdAt);
      if (age < STALE_GENERATION_MS) throw conflict(`Revision ${r.number} is still being generated; wait for it to finish.`);
      tx.update(packetRevisions)
        .set({ state: "failed", error: `Step "${r.progressStep}": the generation stopped without finishing.` })
        .where(eq(packetRevisions.id, r.id))
        .run();
    }
    // Numbers of failed revisions are not reused, so "Rev 3" always means one packet.
    const last = tx
      .select({ n: max(packetRevisions.number) })
      .from(packetRevisions)
      .where(eq(packetRevisions.projectId, stored.projectId))
      .get();
    const number = (last?.n ?? 0) + 1;
    const row = tx
      .insert(packetRevisions)
      .values({
        orgId: ctx.orgId,
        projectId: stored.projectId,
        number,
        state: "generating",
        progressStep: "queued",
        reviewState: "draft",
        recordSnapshot: stored.record as unknown as Record<string, unknown>,
        resultsSnapshot: run,
        recordSha256,
        attachmentIds: documents.attachmentIds,
        isDraft: preflight.isDraft,
        createdBy: ctx.user.id,
        createdAt: now.toISOString(),
      })
      .returning({ id: packetRevisions.id, number: packetRevisions.number })
      .get();
    audit(tx, ctx, "packet.generate", "packet_revision", row.id, {
      projectId: stored.projectId,
      number,
      recordSha256,
      isDraft: preflight.isDraft,
      draftReasons: preflight.draftReasons,
    });
    return row;
  });

  (options.dispatch ?? ((id: string) => void renderLater(ctx.db, "packet.generate", id)))(created.id);
  return { revisionId: created.id, number: created.number, isDraft: preflight.isDraft, preflight };
}
