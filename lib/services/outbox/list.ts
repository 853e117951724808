import "server-only";
import { desc, eq } from "drizzle-orm";
import { outbox, type OutboxMessage } from "../../../db/schema";
import { withheldLinks } from "../../email/render";
import { requirePermission, type ServiceContext } from "../context";

export function listOutbox(ctx: ServiceContext, limit = 200): OutboxMessage[] {
  requirePermission(ctx, "outbox:read", "read the outbox");
  const rows = ctx.db.select().from(outbox).where(eq(outbox.orgId, ctx.orgId)).orderBy(desc(outbox.createdAt)).limit(limit).all();
  // An office clerk reading the outbox must not be able to open someone else's account from an invitation or reset link.
  return rows.map((row) => ({ ...row, bodyText: withheldLinks(row.template, row.bodyText) }));
}
