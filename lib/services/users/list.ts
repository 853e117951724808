import "server-only";
import { asc, eq } from "drizzle-orm";
import { userRoles, users } from "../../../db/schema";
import type { Role } from "../../auth/roles";
import { requirePermission, type ServiceContext } from "../context";

export interface UserListRow {
  id: string;
  name: string;
  email: string;
  active: boolean;
  roles: Role[];
  lockedUntil: string | null;
  lastSignInAt: string | null;
  version: number;
}

export function listUsers(ctx: ServiceContext): UserListRow[] {
  requirePermission(ctx, "users:manage", "manage users");
  const rows = ctx.db.select().from(users).where(eq(users.orgId, ctx.orgId)).orderBy(asc(users.name)).all();
  const roleRows = ctx.db
    .select({ userId: userRoles.userId, role: userRoles.role })
    .from(userRoles)
    .innerJoin(users, eq(users.id, userRoles.userId))
    .where(eq(users.orgId, ctx.orgId))
    .all();
  return rows.map((u) => ({
    id: u.id,
    name: u.name,
    email: u.email,
    active: u.active,
    roles: roleRows.filter((r) => r.userId === u.id).map((r) => r.role),
    lockedUntil: u.lockedUntil,
    lastSignInAt: u.lastSignInAt,
    version: u.version,
  }));
}
