import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { organisations } from "./organisations";

/** Every e-mail the product sends, written before sending and marked after. */
export const outbox = sqliteTable(
  "outbox",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    bodyText: text("body_text").notNull(),
    template: text("template").notNull(),
    status: text("status", { enum: ["queued", "sent", "failed"] }).notNull().default("queued"),
    error: text("error"),
    messageId: text("message_id"),
    sentAt: text("sent_at"),
    createdAt: createdAt(),
  },
  (t) => [index("outbox_org_idx").on(t.orgId, t.createdAt)],
);
export type OutboxMessage = typeof outbox.$inferSelect;
