import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { submissionEvents, submissions } from "../../../db/schema";
import { summariseJurisdiction, type JurisdictionSummary } from "../../schemas/jurisdiction-summary";
import { requirePermission, type ServiceContext } from "../context";
import { effectiveEvents } from "../submissions/events";
import { findJurisdictionInOrg } from "./get";

/** The office's figures for one jurisdiction, from its submissions' standing events (voided ones ignored). */
export function jurisdictionSummary(ctx: ServiceContext, jurisdictionId: string): JurisdictionSummary {
  requirePermission(ctx, "submission:read", "read submissions");
  const j = findJurisdictionInOrg(ctx, jurisdictionId);
  const subs = ctx.db
    .select({ id: submissions.id, status: submissions.status })
    .from(submissions)
    .where(and(eq(submissions.orgId, ctx.orgId), eq(submissions.jurisdictionId, j.id)))
    .all();
  if (subs.length === 0) return summariseJurisdiction([]);
  const rows = ctx.db
    .select()
    .from(submissionEvents)
    .where(and(eq(submissionEvents.orgId, ctx.orgId), inArray(submissionEvents.submissionId, subs.map((s) => s.id))))
    .orderBy(asc(submissionEvents.createdAt), asc(sql`rowid`))
    .all();
  return summariseJurisdiction(
    subs.map((s) => ({
      status: s.status,
      events: effectiveEvents(rows.filter((r) => r.submissionId === s.id)).map((e) => ({ kind: e.kind, occurredOn: e.occurredOn })),
    })),
  );
}
