import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb, type Db } from "../../db/client";
import { auditLog, userRoles, users } from "../../db/schema";
import { can, PERMISSION_WORDS, type Permission } from "../auth/permissions";
import { isRole, type Role } from "../auth/roles";
import { forbidden, unauthenticated } from "./errors";

/** Who is acting, for which organisation, with which database. Every service takes one. */
export interface ServiceContext {
  db: Db;
  user: { id: string; name: string; email: string };
  orgId: string;
  roles: Role[];
  /** An admin chose this person's password; until they choose their own, only the password change is open to them. */
  mustChangePassword?: boolean;
}

export function requirePermission(ctx: ServiceContext, permission: Permission, what?: string): void {
  if (!can(ctx.roles, permission)) throw forbidden(what ?? PERMISSION_WORDS[permission]);
}

/**
 * Builds the context from the signed-in user's id, re-reading the user so a
 * deactivated account or a changed role takes effect on the next request,
 * whatever the session token still says. Given the session version the token
 * was issued with (every request from a browser gives it), a token older than
 * the user's current version is refused: that session has ended.
 */
export function contextForUser(db: Db, userId: string | undefined | null, sessionVersion?: number | null): ServiceContext {
  if (!userId) throw unauthenticated();
  const user = db.select().from(users).where(eq(users.id, userId)).get();
  if (!user || !user.active) throw unauthenticated();
  // A session token issued before deactivation, a role change or a password change no longer holds.
  if (sessionVersion !== undefined && sessionVersion !== user.sessionVersion) throw unauthenticated();
  const roles = db
    .select({ role: userRoles.role })
    .from(userRoles)
    .where(eq(userRoles.userId, user.id))
    .all()
    .map((r) => r.role)
    .filter(isRole);
  return { db, user: { id: user.id, name: user.name, email: user.email }, orgId: user.orgId, roles, mustChangePassword: user.mustChangePassword };
}

/** What an action open to anyone (asking for a reset link, choosing a password from one) works with: no user, no organisation. */
export interface PublicContext {
  db: Db;
  /** The caller's network address as the proxy in front reports it, for throttling. */
  client: string;
}

export function publicContext(client: string): PublicContext {
  return { db: getDb(), client };
}

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export function audit(
  tx: Tx | Db,
  ctx: ServiceContext,
  action: string,
  entity: string,
  entityId: string | null,
  detail: Record<string, unknown> = {},
): void {
  tx.insert(auditLog).values({ orgId: ctx.orgId, userId: ctx.user.id, action, entity, entityId, detail }).run();
}

export { and, eq };
