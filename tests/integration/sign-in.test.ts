import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { auditLog, users } from "../../db/schema";
import { verifyCredentials } from "../../lib/services/auth/verify-credentials";
import { makeOrg, makeUser, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const policy = { maxFailures: 3, lockMinutes: 15 };
const t0 = new Date("2026-06-01T09:00:00Z");
const minutes = (n: number) => new Date(t0.getTime() + n * 60_000);

describe("sign-in", () => {
  const org = makeOrg(db);

  it("accepts the right password, case-insensitively for the e-mail", async () => {
    const user = makeUser(db, org.id, ["designer"], { email: "ada@example.test", password: "right password 1" });
    const outcome = await verifyCredentials(db, "  ADA@example.test ", "right password 1", policy, t0);
    expect(outcome).toMatchObject({ ok: true, user: { id: user.id, orgId: org.id, roles: ["designer"] } });
  });

  it("refuses a wrong password and an unknown e-mail with the same answer", async () => {
    makeUser(db, org.id, ["designer"], { email: "bo@example.test", password: "right password 2" });
    expect(await verifyCredentials(db, "bo@example.test", "wrong", policy, t0)).toEqual({ ok: false, reason: "invalid" });
    expect(await verifyCredentials(db, "nobody@example.test", "wrong", policy, t0)).toEqual({ ok: false, reason: "invalid" });
  });

  it("locks an account after repeated failures, refuses even the right password while locked, and opens again later", async () => {
    const user = makeUser(db, org.id, ["designer"], { email: "cy@example.test", password: "right password 3" });
    expect((await verifyCredentials(db, "cy@example.test", "x", policy, t0)).ok).toBe(false);
    expect((await verifyCredentials(db, "cy@example.test", "x", policy, minutes(1))).ok).toBe(false);
    const third = await verifyCredentials(db, "cy@example.test", "x", policy, minutes(2));
    expect(third).toMatchObject({ ok: false, reason: "locked" });
    expect(await verifyCredentials(db, "cy@example.test", "right password 3", policy, minutes(5))).toMatchObject({ ok: false, reason: "locked" });
    expect(db.select().from(auditLog).where(eq(auditLog.entityId, user.id)).all().map((a) => a.action)).toContain("sign-in.locked");
    expect(await verifyCredentials(db, "cy@example.test", "right password 3", policy, minutes(18))).toMatchObject({ ok: true });
    expect(db.select().from(users).where(eq(users.id, user.id)).get()?.failedSignIns).toBe(0);
  });

  it("resets the failure count after a successful sign-in", async () => {
    makeUser(db, org.id, ["designer"], { email: "di@example.test", password: "right password 4" });
    await verifyCredentials(db, "di@example.test", "x", policy, t0);
    await verifyCredentials(db, "di@example.test", "x", policy, t0);
    expect((await verifyCredentials(db, "di@example.test", "right password 4", policy, t0)).ok).toBe(true);
    expect((await verifyCredentials(db, "di@example.test", "x", policy, t0)).ok).toBe(false);
    expect((await verifyCredentials(db, "di@example.test", "x", policy, t0)).ok).toBe(false);
    expect(await verifyCredentials(db, "di@example.test", "right password 4", policy, t0)).toMatchObject({ ok: true });
  });

  it("refuses a deactivated user even with the right password", async () => {
    makeUser(db, org.id, ["designer"], { email: "ed@example.test", password: "right password 5", active: false });
    expect(await verifyCredentials(db, "ed@example.test", "right password 5", policy, t0)).toEqual({ ok: false, reason: "inactive" });
  });
});
