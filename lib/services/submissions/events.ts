import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { submissionEvents, type SubmissionEvent } from "../../../db/schema";
import type { ProjectStatus } from "../../schemas/project-status";
import type { EventKind } from "../../schemas/submission";
import { projectStatusForEvents, standingKind, type StandingKind } from "../../schemas/submission-rules";
import type { ServiceContext } from "../context";
import { moveProjectStatus } from "../projects/status";
import type { Tx } from "./shared";

export type EffectiveEvent = SubmissionEvent & { kind: EventKind };

/**
 * Every stored row of a submission in the order it was recorded, which is the
 * order the event rules judge (a scheduled inspection is dated ahead of a fee
 * paid after it was booked). The timeline shows them by date.
 */
export function loadEventRows(db: Db | Tx, orgId: string, submissionId: string): SubmissionEvent[] {
  return db
    .select()
    .from(submissionEvents)
    .where(and(eq(submissionEvents.submissionId, submissionId), eq(submissionEvents.orgId, orgId)))
    .orderBy(asc(submissionEvents.createdAt), asc(sql`rowid`))
    .all();
}

/** Ids of events that a later void row cancels. */
export function voidedIds(rows: readonly SubmissionEvent[]): Set<string> {
  const ids = new Set<string>();
  for (const r of rows) if (r.kind === "voided" && typeof r.data.voidsEventId === "string") ids.add(r.data.voidsEventId);
  return ids;
}

/** The events that stand: voids and the events they void are left out, so derived status ignores them. */
export function effectiveEvents(rows: readonly SubmissionEvent[]): EffectiveEvent[] {
  const voided = voidedIds(rows);
  return rows.filter((r): r is EffectiveEvent => r.kind !== "voided" && !voided.has(r.id));
}

export function standingOf(events: readonly EffectiveEvent[]): StandingKind {
  return standingKind(events.map((e) => e.kind)) ?? "submitted";
}

/** The revision currently before the AHJ: the latest resubmitted one, else the one first submitted. */
export function currentRevisionId(events: readonly EffectiveEvent[], firstRevisionId: string): string {
  for (let i = events.length - 1; i >= 0; i--) {
    const e = events[i]!;
    if (e.kind === "resubmitted" && typeof e.data.revisionId === "string") return e.data.revisionId;
  }
  return firstRevisionId;
}

/** Moves the project to the status the remaining events give, through the project status table. */
export function moveProjectForEvents(
  tx: Tx,
  ctx: ServiceContext,
  projectId: string,
  events: readonly EffectiveEvent[],
  options: { reason: string; undo?: boolean; now?: Date },
): { from: ProjectStatus; to: ProjectStatus; moved: boolean } | null {
  const target = projectStatusForEvents(events);
  if (!target) return null;
  return moveProjectStatus(tx, ctx, projectId, target, { reason: options.reason, undo: options.undo, ifAllowed: true, now: options.now });
}
