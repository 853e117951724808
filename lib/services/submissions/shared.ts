import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { jurisdictions, packetRevisions, projects, submissions, userRoles, users } from "../../../db/schema";
import type { ServiceContext } from "../context";
import { notFound } from "../errors";

export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/** "2026-12-01": event dates are calendar days, read in UTC like every timestamp the product stores. */
export function isoDay(now: Date): string {
  return now.toISOString().slice(0, 10);
}

export function addDays(day: string, days: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

/** A submission of the actor's organisation with its project, jurisdiction and revision, or not-found (also for another organisation's id). */
export function findSubmissionInOrg(ctx: ServiceContext, submissionId: string) {
  const found = ctx.db
    .select({ submission: submissions, project: projects, jurisdiction: jurisdictions, revision: packetRevisions })
    .from(submissions)
    .innerJoin(projects, and(eq(projects.id, submissions.projectId), eq(projects.orgId, ctx.orgId)))
    .innerJoin(jurisdictions, and(eq(jurisdictions.id, submissions.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .innerJoin(packetRevisions, and(eq(packetRevisions.id, submissions.revisionId), eq(packetRevisions.orgId, ctx.orgId)))
    .where(and(eq(submissions.id, submissionId), eq(submissions.orgId, ctx.orgId)))
    .get();
  if (!found) throw notFound("Submission");
  return found;
}

/** The designer who generated the revision, if still active in the organisation. */
export function revisionDesigner(db: Db | Tx, orgId: string, userId: string | null) {
  if (!userId) return undefined;
  const row = db
    .select({ name: users.name, email: users.email, active: users.active })
    .from(users)
    .where(and(eq(users.id, userId), eq(users.orgId, orgId)))
    .get();
  return row?.active ? row : undefined;
}

export function activeInstallers(db: Db | Tx, orgId: string): { name: string; email: string }[] {
  return activeWithRole(db, orgId, "installer");
}

/** Active users of the organisation holding a role, by name: who a hand-off mail goes to. */
export function activeWithRole(db: Db | Tx, orgId: string, role: "installer" | "office" | "designer" | "reviewer"): { name: string; email: string }[] {
  return db
    .select({ name: users.name, email: users.email })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, role)))
    .where(and(eq(users.orgId, orgId), eq(users.active, true)))
    .orderBy(users.name)
    .all();
}

/** Runs a mail delivery after commit; a failed delivery stays visible in the outbox and never undoes the record. */
export async function deliverAfterCommit(deliver: (db: Db, orgId: string) => Promise<unknown>, db: Db, orgId: string): Promise<void> {
  try {
    await deliver(db, orgId);
  } catch (error) {
    console.error("mail delivery after a submission event failed", error);
  }
}

export const METHOD_WORDS: Record<"portal" | "email" | "counter", string> = { portal: "portal", email: "e-mail", counter: "counter" };
