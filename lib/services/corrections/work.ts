import "server-only";
import { and, eq } from "drizzle-orm";
import { correctionItems } from "../../../db/schema";
import { assignCorrectionSchema, reopenCorrectionSchema, resolveCorrectionSchema } from "../../schemas/corrections";
import { formatIssues } from "../../schemas/fields";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { checkedAssignee, findItemInOrg } from "./shared";

export interface WorkedCorrection {
  itemId: string;
  version: number;
  message: string;
}

type ItemRow = ReturnType<typeof findItemInOrg>;

/** Writes one change to an item if nobody changed it since the form read it. */
function writeItem(ctx: ServiceContext, item: ItemRow, version: number | undefined, set: Partial<typeof correctionItems.$inferInsert>, action: string, detail: Record<string, unknown>): number {
  if (version !== undefined && version !== item.version) throw conflict(`Comment ${item.number} was changed since you opened it; reload the page to see its answer.`);
  return ctx.db.transaction((tx) => {
    const moved = tx
      .update(correctionItems)
      .set({ ...set, version: item.version + 1 })
      .where(and(eq(correctionItems.id, item.id), eq(correctionItems.orgId, ctx.orgId), eq(correctionItems.version, item.version)))
      .run();
    if (moved.changes === 0) throw conflict(`Comment ${item.number} was changed at the same time; reload the page to see its answer.`);
    // Logged against the submission so the project history, which reads submissions' entries, shows the work.
    audit(tx, ctx, action, "submission", item.submissionId, { itemId: item.id, number: item.number, ...detail });
    return item.version + 1;
  });
}

/** Answers a comment: the response is what the response sheet prints beside it for the resubmittal. */
export function resolveCorrection(ctx: ServiceContext, input: unknown, now = new Date()): WorkedCorrection {
  requirePermission(ctx, "correction:resolve", "answer corrections");
  const parsed = resolveCorrectionSchema.safeParse(input);
  if (!parsed.success) throw invalid("The response was not saved: some fields are not valid.", formatIssues(parsed.error));
  const item = findItemInOrg(ctx, parsed.data.itemId);
  if (item.resolvedAt) throw conflict(`Comment ${item.number} is already resolved; reopen it to change the response.`);
  const version = writeItem(ctx, item, parsed.data.version, { response: parsed.data.response, resolvedBy: ctx.user.id, resolvedAt: now.toISOString() }, "correction.resolved", {
    response: parsed.data.response,
  });
  return { itemId: item.id, version, message: `Comment ${item.number} resolved.` };
}

/** Takes a resolved comment back to open, keeping its last response as the draft of the next. */
export function reopenCorrection(ctx: ServiceContext, input: unknown): WorkedCorrection {
  requirePermission(ctx, "correction:resolve", "reopen corrections");
  const parsed = reopenCorrectionSchema.safeParse(input);
  if (!parsed.success) throw invalid("The comment was not reopened.", formatIssues(parsed.error));
  const item = findItemInOrg(ctx, parsed.data.itemId);
  if (!item.resolvedAt) throw conflict(`Comment ${item.number} is already open.`);
  const version = writeItem(ctx, item, parsed.data.version, { resolvedBy: null, resolvedAt: null }, "correction.reopened", {});
  return { itemId: item.id, version, message: `Comment ${item.number} reopened.` };
}

export function assignCorrection(ctx: ServiceContext, input: unknown): WorkedCorrection {
  requirePermission(ctx, "correction:assign", "assign corrections");
  const parsed = assignCorrectionSchema.safeParse(input);
  if (!parsed.success) throw invalid("The comment was not assigned.", formatIssues(parsed.error));
  const item = findItemInOrg(ctx, parsed.data.itemId);
  const to = checkedAssignee(ctx.db, ctx.orgId, parsed.data.assigneeId);
  const version = writeItem(ctx, item, parsed.data.version, { assigneeId: to.id }, "correction.assigned", { to: to.name });
  return { itemId: item.id, version, message: `Comment ${item.number} assigned to ${to.name}.` };
}
