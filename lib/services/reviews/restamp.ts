import { and, eq } from "drizzle-orm";
import { packetRevisions } from "../../../db/schema";
import { can } from "../../auth/permissions";
import { audit, type ServiceContext } from "../context";
import { conflict, forbidden } from "../errors";
import { renderLater } from "../../jobs";
import { findRevisionForReview } from "./shared";

export interface RestampOptions {
  dispatch?: (revisionId: string) => void | Promise<unknown>;
}

/**
 * Renders an approved revision's stamped packet again after its rendering
 * failed (a stamp image that could not be read, a process that stopped). The
 * approval itself stands: it is bound to the record, not to the file.
 */
export async function renderStampedPacketAgain(ctx: ServiceContext, revisionId: string, options: RestampOptions = {}): Promise<{ revisionId: string; message: string }> {
  if (!can(ctx.roles, "review:decide") && !can(ctx.roles, "packet:generate")) throw forbidden("render packets");
  const { row } = findRevisionForReview(ctx, revisionId);
  if (row.reviewState !== "approved") throw conflict(`Revision ${row.number} is not approved; only a stamped packet is rendered again here.`);
  if (row.state !== "failed") throw conflict(`Revision ${row.number}'s stamped packet is ${row.state === "generating" ? "being rendered" : "ready"}.`);
  ctx.db.transaction((tx) => {
    const moved = tx
      .update(packetRevisions)
      .set({ state: "generating", progressStep: "queued", error: null })
      .where(and(eq(packetRevisions.id, row.id), eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.state, "failed"), eq(packetRevisions.reviewState, "approved")))
      .run();
    if (moved.changes === 0) throw conflict(`Revision ${row.number} changed meanwhile; reload the page.`);
    audit(tx, ctx, "review.restamp", "packet_revision", row.id, { number: row.number, previousError: row.error });
  });
  await (options.dispatch ?? ((id: string) => renderLater(ctx.db, "packet.restamp", id)))(row.id);
  return { revisionId: row.id, message: `Rendering the stamped packet of revision ${row.number} again.` };
}
