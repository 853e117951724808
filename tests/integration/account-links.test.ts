import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { accountTokens, auditLog, outbox, users } from "../../db/schema";
import { verifyCredentials } from "../../lib/services/auth/verify-credentials";
import { contextForUser } from "../../lib/services/context";
import { listOutbox } from "../../lib/services/outbox/list";
import {
  DEAD_LINK,
  describeAccountLink,
  inviteUser,
  memoryResetThrottle,
  RESET_ANSWER,
  redeemAccountLink,
  requestPasswordReset,
} from "../../lib/services/users/account-links";
import { changeOwnPassword } from "../../lib/services/users/change-password";
import { addUser, setPasswordByAdmin } from "../../lib/services/users/manage";
import { makeContext, makeOrg, makeUser, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const policy = { maxFailures: 5, lockMinutes: 15 };
const org = makeOrg(db);
const admin = makeContext(db, org.id, ["admin"]);
const noDelivery = { deliver: async () => undefined };
const row = (id: string) => db.select().from(users).where(eq(users.id, id)).get()!;
const mailTo = (email: string) => db.select().from(outbox).where(eq(outbox.toAddress, email)).all();

/** The token in the newest message to an address, as the person would click it. */
function tokenFromMail(email: string): string {
  const messages = mailTo(email);
  const body = messages[messages.length - 1]!.bodyText;
  const match = /set-password\?token=([A-Za-z0-9_-]{43})/.exec(body);
  if (!match) throw new Error(`no link in: ${body}`);
  return match[1]!;
}

async function rejection(promise: Promise<unknown>) {
  try {
    await promise;
  } catch (error) {
    return error as { code?: string; message: string; issues?: { path: string }[] };
  }
  throw new Error("expected a refusal");
}

describe("inviting a person by e-mail", () => {
  it("adds them with no usable password, e-mails a one-time link, and keeps only its hash", async () => {
    const { id } = await inviteUser(admin, { name: "Noor Achterberg", email: "noor@example.test", roles: ["designer"] }, noDelivery);
    const token = tokenFromMail("noor@example.test");
    const stored = db.select().from(accountTokens).where(eq(accountTokens.userId, id)).all();
    expect(stored).toHaveLength(1);
    // SHA-256 as FIPS 180-4 defines it, computed here independently of the service.
    expect(stored[0]!.tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(db.select().from(accountTokens).all())).not.toContain(token);
    expect(describeAccountLink(token, { db })).toMatchObject({ purpose: "invite", email: "noor@example.test" });
    expect(db.select().from(auditLog).where(and(eq(auditLog.entityId, id), eq(auditLog.action, "user.invited"))).all()).toHaveLength(1);
  });

  it("lets the link set the first password once; the second use changes nothing", async () => {
    await inviteUser(admin, { name: "Ilse Varga", email: "ilse@example.test", roles: ["installer"] }, noDelivery);
    const token = tokenFromMail("ilse@example.test");
    await redeemAccountLink(db, { token, newPassword: "ilse chose this one", confirmPassword: "ilse chose this one" });
    expect(await verifyCredentials(db, "ilse@example.test", "ilse chose this one", policy)).toMatchObject({ ok: true });
    const user = db.select().from(users).where(eq(users.email, "ilse@example.test")).get()!;
    const again = await rejection(redeemAccountLink(db, { token, newPassword: "someone else's pick", confirmPassword: "someone else's pick" }));
    expect(again.message).toBe(DEAD_LINK);
    expect(row(user.id).passwordHash).toBe(user.passwordHash);
    expect(describeAccountLink(token, { db })).toBeNull();
  });

  it("spends a link exactly once when it is submitted twice at the same moment", async () => {
    await inviteUser(admin, { name: "Tove Ramsey", email: "tove@example.test", roles: ["designer"] }, noDelivery);
    const token = tokenFromMail("tove@example.test");
    const outcomes = await Promise.allSettled([
      redeemAccountLink(db, { token, newPassword: "first tab password", confirmPassword: "first tab password" }),
      redeemAccountLink(db, { token, newPassword: "second tab password", confirmPassword: "second tab password" }),
    ]);
    expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
  });

  it("refuses a link after 72 hours", async () => {
    const sent = new Date("2026-03-02T09:00:00Z");
    await inviteUser(admin, { name: "Edda Quist", email: "edda@example.test", roles: ["designer"] }, { ...noDelivery, now: sent });
    const token = tokenFromMail("edda@example.test");
    const late = new Date(sent.getTime() + 72 * 3_600_000 + 1000);
    const refused = await rejection(redeemAccountLink(db, { token, newPassword: "too late password", confirmPassword: "too late password" }, { now: late }));
    expect(refused.code).toBe("invalid");
    const early = new Date(sent.getTime() + 71 * 3_600_000);
    await expect(redeemAccountLink(db, { token, newPassword: "in time password", confirmPassword: "in time password" }, { now: early })).resolves.toMatchObject({ email: "edda@example.test" });
  });

  it("is for admins only, and refuses an e-mail already in use", async () => {
    const designer = makeContext(db, org.id, ["designer"]);
    expect((await rejection(inviteUser(designer, { name: "X", email: "x@example.test", roles: ["admin"] }, noDelivery))).code).toBe("forbidden");
    expect(mailTo("x@example.test")).toHaveLength(0);
    const taken = await rejection(inviteUser(admin, { name: "Noor again", email: "NOOR@example.test", roles: ["designer"] }, noDelivery));
    expect(taken.issues?.[0]?.path).toBe("email");
  });
});

describe("bad input on a link changes nothing", () => {
  it("names the field and leaves the link working", async () => {
    await inviteUser(admin, { name: "Bo Lindgren", email: "bo@example.test", roles: ["designer"] }, noDelivery);
    const token = tokenFromMail("bo@example.test");
    const user = db.select().from(users).where(eq(users.email, "bo@example.test")).get()!;
    const short = await rejection(redeemAccountLink(db, { token, newPassword: "short", confirmPassword: "short" }));
    expect(short.issues?.map((i) => i.path)).toContain("newPassword");
    const mismatch = await rejection(redeemAccountLink(db, { token, newPassword: "long enough one", confirmPassword: "long enough two" }));
    expect(mismatch.issues?.map((i) => i.path)).toContain("confirmPassword");
    // bcrypt reads 72 bytes (Provos and Mazières 1999); 73 would be accepted on a prefix.
    const long = await rejection(redeemAccountLink(db, { token, newPassword: "x".repeat(73), confirmPassword: "x".repeat(73) }));
    expect(long.issues?.map((i) => i.path)).toContain("newPassword");
    const forged = await rejection(redeemAccountLink(db, { token: "A".repeat(43), newPassword: "long enough pass", confirmPassword: "long enough pass" }));
    expect(forged.message).toBe(DEAD_LINK);
    const garbage = await rejection(redeemAccountLink(db, { token: { $ne: null }, newPassword: 5, confirmPassword: [] }));
    expect(garbage.code).toBe("invalid");
    expect(row(user.id).passwordHash).toBe(user.passwordHash);
    expect(row(user.id).version).toBe(user.version);
    expect(describeAccountLink(token, { db })).not.toBeNull();
  });
});

describe("resetting a forgotten password by e-mail", () => {
  it("gives the same answer for an unknown e-mail and sends nothing", async () => {
    const answer = await requestPasswordReset(db, { email: "nobody@example.test" }, { ...noDelivery, throttle: memoryResetThrottle() });
    expect(answer.message).toBe(RESET_ANSWER);
    expect(mailTo("nobody@example.test")).toHaveLength(0);
  });

  it("sends a link that sets a new password, ends open sessions and lifts a lockout; an earlier link stops working", async () => {
    const user = makeUser(db, org.id, ["designer"], { email: "forgetful@example.test", password: "the old password" });
    db.update(users).set({ failedSignIns: 9, lockedUntil: new Date(Date.now() + 600_000).toISOString() }).where(eq(users.id, user.id)).run();
    const throttle = memoryResetThrottle();
    await requestPasswordReset(db, { email: "Forgetful@Example.test " }, { ...noDelivery, throttle });
    const first = tokenFromMail("forgetful@example.test");
    await requestPasswordReset(db, { email: "forgetful@example.test" }, { ...noDelivery, throttle });
    const second = tokenFromMail("forgetful@example.test");
    expect(second).not.toBe(first);
    expect(describeAccountLink(first, { db })).toBeNull();
    await redeemAccountLink(db, { token: second, newPassword: "the new password", confirmPassword: "the new password" });
    const after = row(user.id);
    expect(after.sessionVersion).toBe(user.sessionVersion + 1);
    expect(after.lockedUntil).toBeNull();
    expect(() => contextForUser(db, user.id, user.sessionVersion)).toThrow();
    expect(await verifyCredentials(db, "forgetful@example.test", "the new password", policy)).toMatchObject({ ok: true });
    expect(await verifyCredentials(db, "forgetful@example.test", "the old password", policy)).toMatchObject({ ok: false });
  });

  it("expires a reset link after an hour", async () => {
    makeUser(db, org.id, ["designer"], { email: "slow@example.test" });
    const asked = new Date();
    await requestPasswordReset(db, { email: "slow@example.test" }, { ...noDelivery, throttle: memoryResetThrottle(), now: asked });
    const token = tokenFromMail("slow@example.test");
    expect(describeAccountLink(token, { db, now: new Date(asked.getTime() + 61 * 60_000) })).toBeNull();
  });

  it("sends at most three links an hour to one address, still answering the same", async () => {
    makeUser(db, org.id, ["designer"], { email: "flooded@example.test" });
    const throttle = memoryResetThrottle();
    for (let i = 0; i < 5; i++) expect((await requestPasswordReset(db, { email: "flooded@example.test" }, { ...noDelivery, throttle, client: `192.0.2.${i}` })).message).toBe(RESET_ANSWER);
    expect(mailTo("flooded@example.test")).toHaveLength(3);
  });

  it("refuses a malformed e-mail with a clear message", async () => {
    const refused = await rejection(requestPasswordReset(db, { email: "not an address" }, { ...noDelivery, throttle: memoryResetThrottle() }));
    expect(refused.issues?.[0]?.path).toBe("email");
  });

  it("does not send a reset to a deactivated account", async () => {
    makeUser(db, org.id, ["designer"], { email: "gone@example.test", active: false });
    await requestPasswordReset(db, { email: "gone@example.test" }, { ...noDelivery, throttle: memoryResetThrottle() });
    expect(mailTo("gone@example.test")).toHaveLength(0);
  });
});

describe("a password someone else chose", () => {
  it("must be changed at the next sign-in after an admin sets it, and the person's sessions end", async () => {
    const person = makeUser(db, org.id, ["designer"], { email: "helped@example.test", password: "forgotten password" });
    await setPasswordByAdmin(admin, { userId: person.id, version: person.version, password: "admin picked this" });
    expect(row(person.id).sessionVersion).toBe(person.sessionVersion + 1);
    const signedIn = await verifyCredentials(db, "helped@example.test", "admin picked this", policy);
    expect(signedIn).toMatchObject({ ok: true, user: { mustChangePassword: true } });
    const ctx = contextForUser(db, person.id);
    expect(ctx.mustChangePassword).toBe(true);
    await changeOwnPassword(ctx, { currentPassword: "admin picked this", newPassword: "my very own password" });
    expect(row(person.id).mustChangePassword).toBe(false);
    expect(await verifyCredentials(db, "helped@example.test", "my very own password", policy)).toMatchObject({ ok: true, user: { mustChangePassword: false } });
  });

  it("applies to the first password an admin gives at adding, not to one chosen from an invitation", async () => {
    const { id } = await addUser(admin, { name: "Handed Over", email: "handed@example.test", roles: ["office"], password: "given in person" });
    expect(row(id).mustChangePassword).toBe(true);
    const invited = await inviteUser(admin, { name: "Chose Own", email: "chose@example.test", roles: ["office"] }, noDelivery);
    await redeemAccountLink(db, { token: tokenFromMail("chose@example.test"), newPassword: "chosen by myself", confirmPassword: "chosen by myself" });
    expect(row(invited.id).mustChangePassword).toBe(false);
  });

  it("is refused to a non-admin and for another organisation's user, changing nothing", async () => {
    const person = makeUser(db, org.id, ["designer"]);
    const office = makeContext(db, org.id, ["office"]);
    expect((await rejection(setPasswordByAdmin(office, { userId: person.id, version: 1, password: "office picked it" }))).code).toBe("forbidden");
    const foreignAdmin = makeContext(db, makeOrg(db).id, ["admin"]);
    expect((await rejection(setPasswordByAdmin(foreignAdmin, { userId: person.id, version: 1, password: "foreign picked it" }))).code).toBe("not-found");
    expect((await rejection(setPasswordByAdmin(admin, { userId: person.id, version: 1, password: "short" }))).issues?.[0]?.path).toBe("password");
    expect(row(person.id).passwordHash).toBe(person.passwordHash);
    expect(row(person.id).mustChangePassword).toBe(false);
  });
});

describe("the outbox", () => {
  it("shows invitation and reset e-mails without their working link", async () => {
    await inviteUser(admin, { name: "Outbox Reader", email: "reader@example.test", roles: ["designer"] }, noDelivery);
    const token = tokenFromMail("reader@example.test");
    const office = makeContext(db, org.id, ["office"]);
    const listed = listOutbox(office).filter((m) => m.toAddress === "reader@example.test");
    expect(listed).toHaveLength(1);
    expect(listed[0]!.bodyText).not.toContain(token);
    expect(listed[0]!.bodyText).toContain("token=[withheld]");
  });
});
