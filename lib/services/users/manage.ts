import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { userRoles, users } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { adminSetPasswordSchema } from "../../schemas/account-links";
import { newUserSchema, setActiveSchema, setRolesSchema } from "../../schemas/users";
import type { Role } from "../../auth/roles";
import { hashPassword } from "../auth/verify-credentials";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid, notFound } from "../errors";

/**
 * Which roles a change granted and revoked, and who did it, by name as well
 * as by the audit row's user id: a reviewer who was granted a second role is
 * traced to the person who granted it even after an account is renamed.
 */
function roleChange(before: readonly Role[], after: readonly Role[], ctx: ServiceContext) {
  return {
    granted: after.filter((r, i) => !before.includes(r) && after.indexOf(r) === i),
    revoked: before.filter((r) => !after.includes(r)),
    grantedBy: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email },
  };
}

function findUserInOrg(ctx: ServiceContext, userId: string) {
  const user = ctx.db.select().from(users).where(and(eq(users.id, userId), eq(users.orgId, ctx.orgId))).get();
  if (!user) throw notFound("User");
  return user;
}

export async function addUser(ctx: ServiceContext, input: unknown): Promise<{ id: string }> {
  requirePermission(ctx, "users:manage", "manage users");
  const parsed = newUserSchema.safeParse(input);
  if (!parsed.success) throw invalid("The user was not added: some fields are not valid.", formatIssues(parsed.error));
  const { name, email, roles, password } = parsed.data;
  const taken = ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email)).get();
  if (taken) throw invalid("The user was not added.", [{ path: "email", message: "is already in use" }]);
  const passwordHash = await hashPassword(password);
  return ctx.db.transaction((tx) => {
    // The admin knows this password, so the person replaces it at their first sign-in.
    const row = tx.insert(users).values({ orgId: ctx.orgId, name, email, passwordHash, mustChangePassword: true }).returning({ id: users.id }).get();
    tx.insert(userRoles).values(roles.map((role) => ({ userId: row.id, role }))).run();
    audit(tx, ctx, "user.added", "user", row.id, { email, roles, ...roleChange([], roles, ctx) });
    return row;
  });
}

export function setUserRoles(ctx: ServiceContext, input: unknown): void {
  requirePermission(ctx, "users:manage", "manage users");
  const parsed = setRolesSchema.safeParse(input);
  if (!parsed.success) throw invalid("The roles were not changed.", formatIssues(parsed.error));
  const { userId, roles, version } = parsed.data;
  const user = findUserInOrg(ctx, userId);
  // An admin removing their own admin role could leave the organisation with nobody to manage it.
  if (user.id === ctx.user.id && !roles.includes("admin")) {
    throw invalid("You cannot remove your own administrator role.", [{ path: "roles", message: "keep admin on your own account" }]);
  }
  ctx.db.transaction((tx) => {
    const bumped = tx
      .update(users)
      // A new role set ends the user's sessions: they sign in again with exactly the roles they now hold.
      .set({ version: sql`${users.version} + 1`, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date().toISOString() })
      .where(and(eq(users.id, user.id), eq(users.version, version)))
      .run();
    if (bumped.changes === 0) throw conflict("This user was changed by someone else. Reload and try again.");
    const before = tx.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, user.id)).all().map((r) => r.role);
    tx.delete(userRoles).where(eq(userRoles.userId, user.id)).run();
    tx.insert(userRoles).values([...new Set(roles)].map((role) => ({ userId: user.id, role }))).run();
    audit(tx, ctx, "user.roles-set", "user", user.id, { roles, ...roleChange(before, roles, ctx) });
  });
}

export function setUserActive(ctx: ServiceContext, input: unknown): void {
  requirePermission(ctx, "users:manage", "manage users");
  const parsed = setActiveSchema.safeParse(input);
  if (!parsed.success) throw invalid("The user was not changed.", formatIssues(parsed.error));
  const { userId, active, version } = parsed.data;
  const user = findUserInOrg(ctx, userId);
  if (user.id === ctx.user.id && !active) throw invalid("You cannot deactivate your own account.");
  ctx.db.transaction((tx) => {
    const updated = tx
      .update(users)
      .set({ active, failedSignIns: 0, lockedUntil: null, version: sql`${users.version} + 1`, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date().toISOString() })
      .where(and(eq(users.id, user.id), eq(users.version, version)))
      .run();
    if (updated.changes === 0) throw conflict("This user was changed by someone else. Reload and try again.");
    audit(tx, ctx, active ? "user.reactivated" : "user.deactivated", "user", user.id);
  });
}

/**
 * An admin sets a person's password (they forgot it and have no mailbox at
 * hand). The admin now knows it, so the person must choose their own at the
 * next sign-in; sessions signed in with the old one end, and a lockout is lifted.
 */
export async function setPasswordByAdmin(ctx: ServiceContext, input: unknown): Promise<void> {
  requirePermission(ctx, "users:manage", "manage users");
  const parsed = adminSetPasswordSchema.safeParse(input);
  if (!parsed.success) throw invalid("The password was not set: some fields are not valid.", formatIssues(parsed.error));
  const { userId, version, password } = parsed.data;
  const user = findUserInOrg(ctx, userId);
  if (user.id === ctx.user.id) throw invalid("Change your own password on the Password page, where your current one is asked for.");
  const passwordHash = await hashPassword(password);
  ctx.db.transaction((tx) => {
    const updated = tx
      .update(users)
      .set({
        passwordHash,
        mustChangePassword: true,
        failedSignIns: 0,
        lockedUntil: null,
        version: sql`${users.version} + 1`,
        sessionVersion: sql`${users.sessionVersion} + 1`,
        updatedAt: new Date().toISOString(),
      })
      .where(and(eq(users.id, user.id), eq(users.version, version)))
      .run();
    if (updated.changes === 0) throw conflict("This user was changed by someone else. Reload and try again.");
    audit(tx, ctx, "user.password-set-by-admin", "user", user.id);
  });
}
