import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { correctionItems, submissionEvents, userRoles, users } from "../../../db/schema";
import type { ServiceContext } from "../context";
import { invalid, notFound } from "../errors";
import type { Tx } from "../submissions/shared";

export interface Assignee {
  id: string;
  name: string;
  roles: ("designer" | "reviewer")[];
}

/** Designers and reviewers of the organisation who are active: the people a correction can be given to. */
export function assignableUsers(db: Db | Tx, orgId: string): Assignee[] {
  const rows = db
    .select({ id: users.id, name: users.name, role: userRoles.role })
    .from(users)
    .innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(and(eq(users.orgId, orgId), eq(users.active, true), inArray(userRoles.role, ["designer", "reviewer"])))
    .orderBy(asc(users.name))
    .all();
  const byId = new Map<string, Assignee>();
  for (const r of rows) {
    const a = byId.get(r.id) ?? { id: r.id, name: r.name, roles: [] };
    a.roles.push(r.role as "designer" | "reviewer");
    byId.set(r.id, a);
  }
  return [...byId.values()];
}

/** The assignee a form named, checked to be an active designer or reviewer of the organisation. */
export function checkedAssignee(db: Db | Tx, orgId: string, assigneeId: string, path = "assigneeId"): Assignee {
  const found = assignableUsers(db, orgId).find((a) => a.id === assigneeId);
  if (!found) throw invalid("That person cannot take a correction: it goes to an active designer or reviewer.", [{ path, message: "is not an active designer or reviewer" }]);
  return found;
}

/** Ids of "corrections requested" events that a later entry voided: their comments no longer stand. */
export function voidedEventIds(db: Db | Tx, orgId: string, submissionIds: readonly string[]): Set<string> {
  if (submissionIds.length === 0) return new Set();
  const rows = db
    .select({ data: submissionEvents.data })
    .from(submissionEvents)
    .where(and(eq(submissionEvents.orgId, orgId), inArray(submissionEvents.submissionId, [...submissionIds]), eq(submissionEvents.kind, "voided")))
    .all();
  return new Set(rows.map((r) => String(r.data.voidsEventId)));
}

/** The comments of a submission that stand (their letter not voided), in letter order. */
export function standingItems(db: Db | Tx, orgId: string, submissionId: string) {
  const voided = voidedEventIds(db, orgId, [submissionId]);
  return db
    .select()
    .from(correctionItems)
    .where(and(eq(correctionItems.orgId, orgId), eq(correctionItems.submissionId, submissionId)))
    .orderBy(asc(correctionItems.createdAt), asc(correctionItems.number))
    .all()
    .filter((i) => !voided.has(i.eventId));
}

export function findItemInOrg(ctx: ServiceContext, itemId: string) {
  const item = ctx.db
    .select()
    .from(correctionItems)
    .where(and(eq(correctionItems.id, itemId), eq(correctionItems.orgId, ctx.orgId)))
    .get();
  if (!item) throw notFound("Correction");
  if (voidedEventIds(ctx.db, ctx.orgId, [item.submissionId]).has(item.eventId)) throw notFound("Correction");
  return item;
}
