import { index, integer, primaryKey, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id, updatedAt, version } from "./columns";
import { organisations } from "./organisations";

export const users = sqliteTable(
  "users",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    email: text("email").notNull().unique(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    /** Consecutive failed sign-ins since the last success; drives the lockout. */
    failedSignIns: integer("failed_sign_ins").notNull().default(0),
    lockedUntil: text("locked_until"),
    lastSignInAt: text("last_sign_in_at"),
    /**
     * Raised whenever a session must end: deactivation, a role change, a new
     * password. Each session token carries the value it was issued with, and a
     * request whose token carries an older one is signed out.
     */
    sessionVersion: integer("session_version").notNull().default(0),
    /**
     * Set when someone other than the person chose the password (an admin, at
     * adding or resetting): every page asks for a new one until it is changed.
     */
    mustChangePassword: integer("must_change_password", { mode: "boolean" }).notNull().default(false),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
  },
  (t) => [index("users_org_idx").on(t.orgId)],
);
export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;

export const userRoles = sqliteTable(
  "user_roles",
  {
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: text("role", { enum: ["designer", "reviewer", "office", "installer", "admin"] }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.role] })],
);
export type UserRole = typeof userRoles.$inferSelect;
