import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { projects } from "../../../db/schema";
import { projectTransition, type ProjectStatus } from "../../schemas/project-status";
import { audit, type ServiceContext } from "../context";
import { conflict, notFound } from "../errors";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export interface MoveOptions {
  /** Why the project moves, kept in the audit row ("review.approved", "submission.permit-issued" …). */
  reason: string;
  /**
   * When the table refuses, leave the status as it is instead of failing.
   * For moves that follow from something else that stands on its own (a
   * decision on an older revision, an inspection recorded after closing).
   */
  ifAllowed?: boolean;
  /** The move undoes a voided event; the table's backward moves apply. */
  undo?: boolean;
  now?: Date;
}

export interface MoveResult {
  from: ProjectStatus;
  to: ProjectStatus;
  moved: boolean;
}

/**
 * The one place a project's status changes. Reads the current status inside
 * the caller's transaction, asks the transition table, writes the new status
 * and an audit row. The caller has already checked its own permission.
 */
export function moveProjectStatus(tx: Tx, ctx: ServiceContext, projectId: string, to: ProjectStatus, options: MoveOptions): MoveResult {
  const row = tx
    .select({ status: projects.status })
    .from(projects)
    .where(and(eq(projects.id, projectId), eq(projects.orgId, ctx.orgId)))
    .get();
  if (!row) throw notFound("Project");
  const from = row.status;
  if (from === to) return { from, to, moved: false };
  const verdict = projectTransition(from, to, { undo: options.undo });
  if (!verdict.allowed) {
    if (options.ifAllowed) return { from, to: from, moved: false };
    throw conflict(verdict.reason);
  }
  const at = (options.now ?? new Date()).toISOString();
  const changed = tx
    .update(projects)
    .set({ status: to, updatedAt: at })
    .where(and(eq(projects.id, projectId), eq(projects.orgId, ctx.orgId), eq(projects.status, from)))
    .run();
  if (changed.changes === 0) throw conflict(`The project's status changed while this was being recorded; reload the page.`);
  audit(tx, ctx, "project.status", "project", projectId, { from, to, reason: options.reason, ...(options.undo ? { undo: true } : {}) });
  return { from, to, moved: true };
}
