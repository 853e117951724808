import "server-only";
import { desc, eq } from "drizzle-orm";
import { outbox, type OutboxMessage } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";

export function listOutbox(ctx: ServiceContext, limit = 200): OutboxMessage[] {
  requirePermission(ctx, "outbox:read", "read the outbox");
  return ctx.db.select().from(outbox).where(eq(outbox.orgId, ctx.orgId)).orderBy(desc(outbox.createdAt)).limit(limit).all();
}
