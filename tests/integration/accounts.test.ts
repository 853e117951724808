import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { authConfig, SESSION_ABSOLUTE_SECONDS } from "../../auth.config";
import { auditLog, users } from "../../db/schema";
import { newUserSchema } from "../../lib/schemas/users";
import { memoryThrottle } from "../../lib/services/auth/throttle";
import { verifyCredentials } from "../../lib/services/auth/verify-credentials";
import { contextForUser } from "../../lib/services/context";
import { changeOwnPassword } from "../../lib/services/users/change-password";
import { setUserActive, setUserRoles } from "../../lib/services/users/manage";
import { codeOf, makeContext, makeOrg, makeUser, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const policy = { maxFailures: 5, lockMinutes: 15 };
const org = makeOrg(db);
const row = (id: string) => db.select().from(users).where(eq(users.id, id)).get()!;

describe("lockout under parallel guessing", () => {
  it("counts every one of 100 wrong guesses sent at once, and locks the account", async () => {
    const user = makeUser(db, org.id, ["designer"], { email: "target@example.test", password: "the real password" });
    const outcomes = await Promise.all(Array.from({ length: 100 }, (_, i) => verifyCredentials(db, "target@example.test", `guess ${i}`, policy)));
    expect(outcomes.every((o) => !o.ok)).toBe(true);
    expect(row(user.id).failedSignIns).toBe(100);
    expect(row(user.id).lockedUntil).not.toBeNull();
    expect(await verifyCredentials(db, "target@example.test", "the real password", policy)).toMatchObject({ ok: false, reason: "locked" });
    expect(db.select().from(auditLog).where(and(eq(auditLog.entityId, user.id), eq(auditLog.action, "sign-in.failed"))).all()).toHaveLength(100);
  });
});

describe("what a refusal tells", () => {
  it("answers an unknown e-mail with the same 'locked' after the same number of failures as a known one", async () => {
    makeUser(db, org.id, ["designer"], { email: "known@example.test", password: "known password 1" });
    const throttle = memoryThrottle(3, 15);
    const tries = async (email: string) => {
      const answers = [];
      for (let i = 0; i < 4; i++) answers.push(await verifyCredentials(db, email, `wrong ${i}`, { maxFailures: 3, lockMinutes: 15 }, { throttle, client: `198.51.100.${email.length}` }));
      return answers.map((a) => (a.ok ? "ok" : a.reason));
    };
    const known = await tries("known@example.test");
    const unknown = await tries("nobody-here@example.test");
    expect(known).toEqual(["invalid", "invalid", "locked", "locked"]);
    expect(unknown).toEqual(known);
  });

  it("throttles one client trying many e-mails", async () => {
    // One failure allowed per e-mail, so the client's allowance (ten times that) runs out after ten e-mails.
    const strict = { maxFailures: 1, lockMinutes: 15 };
    const throttle = memoryThrottle(strict.maxFailures, strict.lockMinutes);
    for (let i = 0; i < 10; i++) await verifyCredentials(db, `spray-${i}@example.test`, "x", strict, { throttle, client: "203.0.113.9" });
    expect(await verifyCredentials(db, "fresh@example.test", "x", strict, { throttle, client: "203.0.113.9" })).toMatchObject({ ok: false, reason: "throttled" });
    expect(await verifyCredentials(db, "fresh@example.test", "x", strict, { throttle, client: "203.0.113.10" })).toMatchObject({ ok: false, reason: "locked" });
  }, 60_000);
});

describe("passwords longer than bcrypt reads", () => {
  // bcrypt compares only the first 72 bytes (bcrypt, Provos and Mazières 1999).
  const seventyTwo = "p".repeat(72);

  it("does not let a password match on its first 72 bytes", async () => {
    makeUser(db, org.id, ["designer"], { email: "long@example.test", password: seventyTwo });
    expect((await verifyCredentials(db, "long@example.test", seventyTwo, policy)).ok).toBe(true);
    expect(await verifyCredentials(db, "long@example.test", `${seventyTwo}anything`, policy)).toMatchObject({ ok: false, reason: "invalid" });
  });

  it("refuses to set one: 72 bytes pass, 73 do not, nor 37 two-byte letters", () => {
    const base = { name: "Long Pass", email: "lp@example.test", roles: ["designer"] };
    expect(newUserSchema.safeParse({ ...base, password: seventyTwo }).success).toBe(true);
    expect(newUserSchema.safeParse({ ...base, password: `${seventyTwo}x` }).success).toBe(false);
    expect(newUserSchema.safeParse({ ...base, password: "é".repeat(37) }).success).toBe(false);
  });
});

describe("the audit log", () => {
  it("records each success and failure of an account's sign-in", async () => {
    const user = makeUser(db, org.id, ["designer"], { email: "audited@example.test", password: "audited password" });
    await verifyCredentials(db, "audited@example.test", "wrong", policy, { client: "192.0.2.4" });
    await verifyCredentials(db, "audited@example.test", "audited password", policy, { client: "192.0.2.4" });
    const actions = db.select().from(auditLog).where(eq(auditLog.entityId, user.id)).all();
    expect(actions.map((a) => a.action)).toEqual(["sign-in.failed", "sign-in.succeeded"]);
    expect(actions[1]!.detail).toMatchObject({ client: "192.0.2.4" });
  });
});

describe("sessions", () => {
  const jwt = authConfig.callbacks.jwt as unknown as (p: { token: Record<string, unknown>; user?: unknown }) => Record<string, unknown> | null;
  const nowS = () => Math.floor(Date.now() / 1000);

  it("end a fixed time after sign-in however recently they were used", () => {
    const fresh = jwt({ token: { userId: "u", signedInAt: nowS() - 60 } });
    expect(fresh).not.toBeNull();
    expect(jwt({ token: { userId: "u", signedInAt: nowS() - SESSION_ABSOLUTE_SECONDS - 1 } })).toBeNull();
    // A token without a sign-in time cannot show it is within its lifetime.
    expect(jwt({ token: { userId: "u" } })).toBeNull();
    const issued = jwt({ token: {}, user: { id: "u", sessionVersion: 4 } })!;
    expect(issued.sessionVersion).toBe(4);
    expect(Math.abs((issued.signedInAt as number) - nowS())).toBeLessThanOrEqual(2);
  });

  it("end when the user's roles change or the account is deactivated: the token's version no longer matches", () => {
    const admin = makeContext(db, org.id, ["admin"]);
    const user = makeUser(db, org.id, ["designer"]);
    const issuedWith = row(user.id).sessionVersion;
    expect(contextForUser(db, user.id, issuedWith).user.id).toBe(user.id);

    setUserRoles(admin, { userId: user.id, roles: ["designer", "reviewer"], version: row(user.id).version });
    expect(codeOf(() => contextForUser(db, user.id, issuedWith))).toBe("unauthenticated");
    const afterRoles = row(user.id).sessionVersion;
    expect(contextForUser(db, user.id, afterRoles).roles).toContain("reviewer");

    setUserActive(admin, { userId: user.id, active: false, version: row(user.id).version });
    setUserActive(admin, { userId: user.id, active: true, version: row(user.id).version });
    expect(codeOf(() => contextForUser(db, user.id, afterRoles))).toBe("unauthenticated");
  });
});

describe("changing one's own password", () => {
  it("asks for the current password, refuses one over 72 bytes, and ends the sessions signed in with the old one", async () => {
    const user = makeUser(db, org.id, ["installer"], { email: "changer@example.test", password: "old password 123" });
    const issuedWith = row(user.id).sessionVersion;
    const ctx = contextForUser(db, user.id, issuedWith);
    const refused = async (input: Record<string, string>) => {
      try {
        await changeOwnPassword(ctx, input);
      } catch (error) {
        return (error as { issues?: { path: string }[] }).issues?.[0]?.path;
      }
      return undefined;
    };
    expect(await refused({ currentPassword: "not it", newPassword: "new password 456" })).toBe("currentPassword");
    expect(await refused({ currentPassword: "old password 123", newPassword: "n".repeat(73) })).toBe("newPassword");
    expect((await verifyCredentials(db, "changer@example.test", "old password 123", policy)).ok).toBe(true);

    await changeOwnPassword(ctx, { currentPassword: "old password 123", newPassword: "new password 456" });
    expect((await verifyCredentials(db, "changer@example.test", "old password 123", policy)).ok).toBe(false);
    expect((await verifyCredentials(db, "changer@example.test", "new password 456", policy)).ok).toBe(true);
    expect(codeOf(() => contextForUser(db, user.id, issuedWith))).toBe("unauthenticated");
    expect(db.select().from(auditLog).where(and(eq(auditLog.entityId, user.id), eq(auditLog.action, "user.password-changed"))).all()).toHaveLength(1);
  });
});
