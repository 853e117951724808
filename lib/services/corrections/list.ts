import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { correctionItems, submissionEvents, submissions, users } from "../../../db/schema";
import { can } from "../../auth/permissions";
import { requirePermission, type ServiceContext } from "../context";
import { findProjectInOrg } from "../projects/load";
import { findSubmissionInOrg } from "../submissions/shared";
import type { CorrectionView } from "../../schemas/corrections";
import { assignableUsers, voidedEventIds, type Assignee } from "./shared";

export type { CorrectionView };

export interface CorrectionsView {
  items: CorrectionView[];
  open: number;
  assignable: Assignee[];
}

function readItems(ctx: ServiceContext, where: ReturnType<typeof and>, submissionIds: string[]): CorrectionView[] {
  const voided = voidedEventIds(ctx.db, ctx.orgId, submissionIds);
  const names = new Map(ctx.db.select({ id: users.id, name: users.name }).from(users).where(eq(users.orgId, ctx.orgId)).all().map((u) => [u.id, u.name]));
  return ctx.db
    .select({ item: correctionItems, letterOn: submissionEvents.occurredOn })
    .from(correctionItems)
    .innerJoin(submissionEvents, eq(submissionEvents.id, correctionItems.eventId))
    .where(where)
    .orderBy(asc(submissionEvents.occurredOn), asc(correctionItems.createdAt), asc(correctionItems.number))
    .all()
    .filter((r) => !voided.has(r.item.eventId))
    .map(({ item, letterOn }) => ({
      id: item.id,
      submissionId: item.submissionId,
      letterOn,
      number: item.number,
      comment: item.comment,
      citation: item.citation,
      sheet: item.sheet,
      assigneeId: item.assigneeId,
      assigneeName: item.assigneeId ? (names.get(item.assigneeId) ?? null) : null,
      response: item.response,
      resolvedByName: item.resolvedBy ? (names.get(item.resolvedBy) ?? null) : null,
      resolvedAt: item.resolvedAt,
      open: item.resolvedAt === null,
      version: item.version,
    }));
}

/** Every comment the AHJ has made on the project's submissions, oldest letter first; comments of a voided letter are left out. */
export function listProjectCorrections(ctx: ServiceContext, projectId: string): CorrectionsView {
  requirePermission(ctx, "correction:read", "read corrections");
  const project = findProjectInOrg(ctx, projectId);
  const submissionIds = ctx.db
    .select({ id: submissions.id })
    .from(submissions)
    .where(and(eq(submissions.orgId, ctx.orgId), eq(submissions.projectId, project.id)))
    .all()
    .map((s) => s.id);
  const items = readItems(ctx, and(eq(correctionItems.orgId, ctx.orgId), eq(correctionItems.projectId, project.id)), submissionIds);
  return { items, open: items.filter((i) => i.open).length, assignable: assignableUsers(ctx.db, ctx.orgId) };
}

export function listSubmissionCorrections(ctx: ServiceContext, submissionId: string): CorrectionsView {
  requirePermission(ctx, "correction:read", "read corrections");
  const { submission } = findSubmissionInOrg(ctx, submissionId);
  const items = readItems(ctx, and(eq(correctionItems.orgId, ctx.orgId), eq(correctionItems.submissionId, submission.id)), [submission.id]);
  return { items, open: items.filter((i) => i.open).length, assignable: assignableUsers(ctx.db, ctx.orgId) };
}

/** How many of the AHJ's comments on the project wait for a response; counted on the project's tabs. */
export function openCorrectionCount(ctx: ServiceContext, projectId: string): number {
  if (!can(ctx.roles, "correction:read")) return 0;
  return listProjectCorrections(ctx, projectId).items.filter((i) => i.open).length;
}
