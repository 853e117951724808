import "server-only";
import bcrypt from "bcryptjs";
import { eq } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { auditLog, userRoles, users } from "../../../db/schema";
import { isRole, type Role } from "../../auth/roles";

export type SignInOutcome =
  | { ok: true; user: { id: string; name: string; email: string; orgId: string; roles: Role[] } }
  | { ok: false; reason: "invalid" | "locked" | "inactive"; lockedUntil?: string };

export interface LockoutPolicy {
  maxFailures: number;
  lockMinutes: number;
}

// A real hash of a random password, compared when the e-mail is unknown so the
// answer takes as long as for a known account and does not reveal which exists.
const DUMMY_HASH = "$2b$10$Z0/AXlullI/UDcDUMAZ8WetlBt.tSuN2veUmofyTTbqriYT/V0tOe";

/**
 * Checks an e-mail and password. After `maxFailures` consecutive failures the
 * account is locked for `lockMinutes`; while locked even the right password is
 * refused, so guessing cannot continue. `now` is passed in for testability.
 */
export async function verifyCredentials(
  db: Db,
  emailInput: string,
  password: string,
  policy: LockoutPolicy,
  now: Date = new Date(),
): Promise<SignInOutcome> {
  const email = emailInput.trim().toLowerCase();
  const user = db.select().from(users).where(eq(users.email, email)).get();
  if (!user) {
    await bcrypt.compare(password, DUMMY_HASH);
    return { ok: false, reason: "invalid" };
  }
  if (user.lockedUntil && new Date(user.lockedUntil) > now) {
    return { ok: false, reason: "locked", lockedUntil: user.lockedUntil };
  }
  const matches = await bcrypt.compare(password, user.passwordHash);
  if (!matches) {
    const failures = user.failedSignIns + 1;
    const lock = failures >= policy.maxFailures;
    const lockedUntil = lock ? new Date(now.getTime() + policy.lockMinutes * 60_000).toISOString() : null;
    db.transaction((tx) => {
      tx.update(users)
        .set({ failedSignIns: lock ? 0 : failures, lockedUntil })
        .where(eq(users.id, user.id))
        .run();
      if (lock) {
        tx.insert(auditLog)
          .values({ orgId: user.orgId, userId: user.id, action: "sign-in.locked", entity: "user", entityId: user.id, detail: { lockedUntil } })
          .run();
      }
    });
    return lock ? { ok: false, reason: "locked", lockedUntil: lockedUntil ?? undefined } : { ok: false, reason: "invalid" };
  }
  if (!user.active) return { ok: false, reason: "inactive" };
  db.update(users)
    .set({ failedSignIns: 0, lockedUntil: null, lastSignInAt: now.toISOString() })
    .where(eq(users.id, user.id))
    .run();
  const roles = db
    .select({ role: userRoles.role })
    .from(userRoles)
    .where(eq(userRoles.userId, user.id))
    .all()
    .map((r) => r.role)
    .filter(isRole);
  return { ok: true, user: { id: user.id, name: user.name, email: user.email, orgId: user.orgId, roles } };
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, 10);
}
