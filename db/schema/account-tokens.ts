import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { organisations } from "./organisations";
import { users } from "./users";

/**
 * One-time links sent by e-mail: an invitation to set a first password, or a
 * password reset. Only the SHA-256 of the token is kept, so a copy of the
 * database does not hold a working link; a token is good once and until it expires.
 */
export const accountTokens = sqliteTable(
  "account_tokens",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    purpose: text("purpose", { enum: ["invite", "reset"] }).notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: text("expires_at").notNull(),
    usedAt: text("used_at"),
    createdAt: createdAt(),
  },
  (t) => [index("account_tokens_user_idx").on(t.userId, t.purpose)],
);
export type AccountToken = typeof accountTokens.$inferSelect;
