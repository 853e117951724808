import "server-only";
import bcrypt from "bcryptjs";
import { eq, sql } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { auditLog, userRoles, users } from "../../../db/schema";
import { isRole, type Role } from "../../auth/roles";
import { PASSWORD_MAX_BYTES } from "../../schemas/password";
import { memoryThrottle, type SignInThrottle } from "./throttle";

export type SignInOutcome =
  | { ok: true; user: { id: string; name: string; email: string; orgId: string; roles: Role[]; sessionVersion: number; mustChangePassword: boolean } }
  | { ok: false; reason: "invalid" | "locked" | "inactive" | "throttled"; retryAfterSeconds?: number };

export interface LockoutPolicy {
  maxFailures: number;
  lockMinutes: number;
}

export interface VerifyOptions {
  now?: Date;
  /** The client's network address, for per-client throttling. */
  client?: string;
  /** Shared across requests in the app; each call gets a fresh one when not given. */
  throttle?: SignInThrottle;
}

// A real hash of a random password, compared when the e-mail is unknown so the
// answer takes as long as for a known account and does not reveal which exists.
const DUMMY_HASH = "$2b$10$Z0/AXlullI/UDcDUMAZ8WetlBt.tSuN2veUmofyTTbqriYT/V0tOe";

function record(db: Db, user: { id: string; orgId: string }, action: string, detail: Record<string, unknown>) {
  db.insert(auditLog).values({ orgId: user.orgId, userId: user.id, action, entity: "user", entityId: user.id, detail }).run();
}

/**
 * Checks an e-mail and password. After `maxFailures` consecutive failures the
 * account is locked for `lockMinutes`; while locked even the right password is
 * refused, so guessing cannot continue. The failure count is raised in one
 * SQL statement after the hash comparison, so guesses sent in parallel are
 * each counted. An unknown e-mail is throttled the same way in memory and
 * answers "locked" after as many failures, so the answer never tells which
 * e-mails have accounts. Every success and failure of an account is written
 * to the audit log. `now` is passed in for testability.
 */
export async function verifyCredentials(db: Db, emailInput: string, password: string, policy: LockoutPolicy, nowOrOptions: Date | VerifyOptions = {}): Promise<SignInOutcome> {
  const options = nowOrOptions instanceof Date ? { now: nowOrOptions } : nowOrOptions;
  const now = options.now ?? new Date();
  const client = options.client ?? "unknown";
  const throttle = options.throttle ?? memoryThrottle(policy.maxFailures, policy.lockMinutes);
  const email = emailInput.trim().toLowerCase();

  const blocked = await throttle.blockedFor(email, client);
  if (blocked) return { ok: false, reason: blocked.scope === "email" ? "locked" : "throttled", retryAfterSeconds: blocked.seconds };

  const user = db.select().from(users).where(eq(users.email, email)).get();
  // bcrypt reads only the first 72 bytes; a longer password would be accepted on its prefix, so it never matches.
  const tooLong = Buffer.byteLength(password, "utf8") > PASSWORD_MAX_BYTES;
  if (!user) {
    await bcrypt.compare(password, DUMMY_HASH);
    const exhausted = await throttle.fail(email, client);
    return { ok: false, reason: exhausted ? "locked" : "invalid" };
  }
  if (user.lockedUntil && new Date(user.lockedUntil) > now) {
    record(db, user, "sign-in.refused", { reason: "locked", lockedUntil: user.lockedUntil, client });
    return { ok: false, reason: "locked" };
  }
  const matches = !tooLong && (await bcrypt.compare(password, user.passwordHash));
  if (!matches) {
    const lockUntil = new Date(now.getTime() + policy.lockMinutes * 60_000).toISOString();
    const counted = db.transaction((tx) => {
      // One statement reads and raises the count, so no parallel guess is lost between a read and a write.
      const row = tx
        .update(users)
        .set({
          failedSignIns: sql`${users.failedSignIns} + 1`,
          lockedUntil: sql`case when ${users.failedSignIns} + 1 >= ${policy.maxFailures} then ${lockUntil} else ${users.lockedUntil} end`,
        })
        .where(eq(users.id, user.id))
        .returning({ failedSignIns: users.failedSignIns, lockedUntil: users.lockedUntil })
        .get()!;
      tx.insert(auditLog)
        .values({ orgId: user.orgId, userId: user.id, action: "sign-in.failed", entity: "user", entityId: user.id, detail: { failures: row.failedSignIns, client, ...(tooLong ? { reason: "password over 72 bytes" } : {}) } })
        .run();
      if (row.failedSignIns === policy.maxFailures) {
        tx.insert(auditLog).values({ orgId: user.orgId, userId: user.id, action: "sign-in.locked", entity: "user", entityId: user.id, detail: { lockedUntil: row.lockedUntil } }).run();
      }
      return row;
    });
    const exhausted = await throttle.fail(email, client);
    return counted.failedSignIns >= policy.maxFailures || exhausted ? { ok: false, reason: "locked" } : { ok: false, reason: "invalid" };
  }
  if (!user.active) {
    record(db, user, "sign-in.refused", { reason: "inactive", client });
    return { ok: false, reason: "inactive" };
  }
  db.transaction((tx) => {
    tx.update(users).set({ failedSignIns: 0, lockedUntil: null, lastSignInAt: now.toISOString() }).where(eq(users.id, user.id)).run();
    tx.insert(auditLog).values({ orgId: user.orgId, userId: user.id, action: "sign-in.succeeded", entity: "user", entityId: user.id, detail: { client } }).run();
  });
  await throttle.succeed(email);
  const roles = db
    .select({ role: userRoles.role })
    .from(userRoles)
    .where(eq(userRoles.userId, user.id))
    .all()
    .map((r) => r.role)
    .filter(isRole);
  return { ok: true, user: { id: user.id, name: user.name, email: user.email, orgId: user.orgId, roles, sessionVersion: user.sessionVersion, mustChangePassword: user.mustChangePassword } };
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, 10);
}
