import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { RateLimiterMemory } from "rate-limiter-flexible";
import { getDb, type Db } from "../../../db/client";
import { accountTokens, auditLog, userRoles, users } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { deliverLater } from "../../jobs";
import { formatIssues } from "../../schemas/fields";
import { accountTokenSchema, inviteUserSchema, redeemLinkSchema, resetRequestSchema } from "../../schemas/account-links";
import { hashPassword } from "../auth/verify-credentials";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid, ServiceError } from "../errors";

/**
 * An invitation is read within days (a new hire starts on Monday); a reset
 * link is used at once, so an old e-mail found later in a mailbox no longer
 * opens the account (common practice: OWASP Forgot Password Cheat Sheet).
 */
export const INVITE_HOURS = 72;
export const RESET_MINUTES = 60;

type Purpose = "invite" | "reset";
type Deliver = (db: Db, orgId: string) => Promise<unknown>;

/** The SHA-256 of a token; the token itself lives only in the e-mail. */
export function tokenHash(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

function newToken(): string {
  return randomBytes(32).toString("base64url");
}

function linkFor(token: string): string {
  return `/set-password?token=${token}`;
}

async function deliverQuietly(deliver: Deliver, db: Db, orgId: string) {
  try {
    await deliver(db, orgId);
  } catch (error) {
    console.error("mail delivery of an account link failed", error);
  }
}

/**
 * Adds a person without a password and e-mails them a one-time link to choose
 * one. Until they do, no password signs in as them: the stored hash is of
 * random bytes nobody saw.
 */
export async function inviteUser(ctx: ServiceContext, input: unknown, options: { deliver?: Deliver; now?: Date } = {}): Promise<{ id: string }> {
  requirePermission(ctx, "users:manage", "manage users");
  const parsed = inviteUserSchema.safeParse(input);
  if (!parsed.success) throw invalid("The invitation was not sent: some fields are not valid.", formatIssues(parsed.error));
  const { name, email, roles } = parsed.data;
  const taken = ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email)).get();
  if (taken) throw invalid("The invitation was not sent.", [{ path: "email", message: "is already in use" }]);
  const passwordHash = await hashPassword(newToken());
  const token = newToken();
  const now = options.now ?? new Date();
  const row = ctx.db.transaction((tx) => {
    const user = tx.insert(users).values({ orgId: ctx.orgId, name, email, passwordHash }).returning({ id: users.id }).get();
    tx.insert(userRoles).values([...new Set(roles)].map((role) => ({ userId: user.id, role }))).run();
    tx.insert(accountTokens)
      .values({ orgId: ctx.orgId, userId: user.id, purpose: "invite", tokenHash: tokenHash(token), expiresAt: new Date(now.getTime() + INVITE_HOURS * 3_600_000).toISOString() })
      .run();
    queueEmail(tx, ctx.orgId, email, "invitation", { name, inviterName: ctx.user.name, link: linkFor(token), hours: INVITE_HOURS });
    audit(tx, ctx, "user.invited", "user", user.id, { email, roles, granted: roles, grantedBy: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email } });
    return user;
  });
  await deliverQuietly(options.deliver ?? deliverLater, ctx.db, ctx.orgId);
  return row;
}

/**
 * Per e-mail, a few links an hour is enough for a person who mistyped or lost
 * one, and stops anyone from filling a colleague's inbox; per client, a
 * machine asking for many addresses is slowed (common practice).
 */
const RESETS_PER_EMAIL = 3;
const RESETS_PER_CLIENT = 20;
const RESET_WINDOW_SECONDS = 60 * 60;

export interface ResetThrottle {
  /** False when this request must not send anything. */
  allow(email: string, client: string): Promise<"ok" | "email" | "client">;
}

export function memoryResetThrottle(): ResetThrottle {
  const perEmail = new RateLimiterMemory({ keyPrefix: "reset-email", points: RESETS_PER_EMAIL, duration: RESET_WINDOW_SECONDS });
  const perClient = new RateLimiterMemory({ keyPrefix: "reset-client", points: RESETS_PER_CLIENT, duration: RESET_WINDOW_SECONDS });
  return {
    async allow(email, client) {
      try {
        await perClient.consume(client);
      } catch {
        return "client";
      }
      try {
        await perEmail.consume(email);
      } catch {
        return "email";
      }
      return "ok";
    },
  };
}

let sharedResetThrottle: ResetThrottle | undefined;
function resetThrottle(): ResetThrottle {
  sharedResetThrottle ??= memoryResetThrottle();
  return sharedResetThrottle;
}

export const RESET_ANSWER =
  "If that e-mail belongs to an active account, a link to choose a new password is on its way. It works once, within an hour.";

/**
 * Anyone may ask; the answer is the same whether or not the e-mail has an
 * account, so the form does not tell which addresses exist. A new link
 * cancels the person's earlier unused reset links.
 */
export async function requestPasswordReset(
  db: Db,
  input: unknown,
  options: { client?: string; throttle?: ResetThrottle; deliver?: Deliver; now?: Date } = {},
): Promise<{ message: string }> {
  const parsed = resetRequestSchema.safeParse(input);
  if (!parsed.success) throw invalid("No link was sent: enter the e-mail you sign in with.", formatIssues(parsed.error));
  const { email } = parsed.data;
  const verdict = await (options.throttle ?? resetThrottle()).allow(email, options.client ?? "unknown");
  if (verdict === "client") throw new ServiceError("locked", "Too many reset requests from this network. Wait an hour and try again.");
  if (verdict === "email") return { message: RESET_ANSWER };
  const user = db.select().from(users).where(eq(users.email, email)).get();
  if (!user || !user.active) return { message: RESET_ANSWER };
  const token = newToken();
  const now = options.now ?? new Date();
  db.transaction((tx) => {
    tx.update(accountTokens)
      .set({ usedAt: now.toISOString() })
      .where(and(eq(accountTokens.userId, user.id), eq(accountTokens.purpose, "reset"), isNull(accountTokens.usedAt)))
      .run();
    tx.insert(accountTokens)
      .values({ orgId: user.orgId, userId: user.id, purpose: "reset", tokenHash: tokenHash(token), expiresAt: new Date(now.getTime() + RESET_MINUTES * 60_000).toISOString() })
      .run();
    queueEmail(tx, user.orgId, user.email, "password-reset", { name: user.name, link: linkFor(token), minutes: RESET_MINUTES });
    tx.insert(auditLog)
      .values({ orgId: user.orgId, userId: user.id, action: "user.reset-requested", entity: "user", entityId: user.id, detail: { client: options.client ?? "unknown" } })
      .run();
  });
  await deliverQuietly(options.deliver ?? deliverLater, db, user.orgId);
  return { message: RESET_ANSWER };
}

export interface AccountLinkView {
  purpose: Purpose;
  name: string;
  email: string;
}

function liveToken(db: Db, token: string, now: Date) {
  return db
    .select({ id: accountTokens.id, purpose: accountTokens.purpose, userId: accountTokens.userId, orgId: accountTokens.orgId, name: users.name, email: users.email, active: users.active })
    .from(accountTokens)
    .innerJoin(users, eq(users.id, accountTokens.userId))
    .where(and(eq(accountTokens.tokenHash, tokenHash(token)), isNull(accountTokens.usedAt), gt(accountTokens.expiresAt, now.toISOString())))
    .get();
}

export const DEAD_LINK = "This link has expired or was already used. Ask your administrator for a new invitation, or ask for a new reset link.";

/** What the set-password page shows for a link, or null when it no longer works. */
export function describeAccountLink(token: unknown, options: { db?: Db; now?: Date } = {}): AccountLinkView | null {
  const parsed = accountTokenSchema.safeParse(token);
  if (!parsed.success) return null;
  const row = liveToken(options.db ?? getDb(), parsed.data, options.now ?? new Date());
  if (!row || !row.active) return null;
  return { purpose: row.purpose, name: row.name, email: row.email };
}

/**
 * Sets the password chosen from an e-mailed link. The token is spent in the
 * same statement that checks it, so two submissions of one link cannot both
 * succeed; every other open link of the person is spent too, and every session
 * signed in with the old password ends.
 */
export async function redeemAccountLink(db: Db, input: unknown, options: { now?: Date } = {}): Promise<{ message: string; email: string }> {
  const parsed = redeemLinkSchema.safeParse(input);
  if (!parsed.success) {
    const issues = formatIssues(parsed.error);
    if (issues.some((i) => i.path === "token")) throw invalid(DEAD_LINK, issues);
    throw invalid("The password was not set: some fields are not valid.", issues);
  }
  const { token, newPassword } = parsed.data;
  const now = options.now ?? new Date();
  // Refuse a dead link before spending a bcrypt round on it.
  if (!describeAccountLink(token, { db, now })) throw invalid(DEAD_LINK, [{ path: "token", message: "has expired or was already used" }]);
  const passwordHash = await hashPassword(newPassword);
  return db.transaction((tx) => {
    const spent = tx
      .update(accountTokens)
      .set({ usedAt: now.toISOString() })
      .where(and(eq(accountTokens.tokenHash, tokenHash(token)), isNull(accountTokens.usedAt), gt(accountTokens.expiresAt, now.toISOString())))
      .returning({ userId: accountTokens.userId, orgId: accountTokens.orgId, purpose: accountTokens.purpose })
      .get();
    if (!spent) throw invalid(DEAD_LINK, [{ path: "token", message: "has expired or was already used" }]);
    const user = tx.select().from(users).where(eq(users.id, spent.userId)).get();
    if (!user || !user.active) throw invalid(DEAD_LINK, [{ path: "token", message: "belongs to an account that is not active" }]);
    tx.update(accountTokens).set({ usedAt: now.toISOString() }).where(and(eq(accountTokens.userId, user.id), isNull(accountTokens.usedAt))).run();
    tx.update(users)
      .set({
        passwordHash,
        mustChangePassword: false,
        failedSignIns: 0,
        lockedUntil: null,
        sessionVersion: sql`${users.sessionVersion} + 1`,
        version: sql`${users.version} + 1`,
        updatedAt: now.toISOString(),
      })
      .where(eq(users.id, user.id))
      .run();
    tx.insert(auditLog)
      .values({ orgId: user.orgId, userId: user.id, action: spent.purpose === "invite" ? "user.invitation-accepted" : "user.password-reset", entity: "user", entityId: user.id, detail: {} })
      .run();
    return { message: "Password set. Sign in with it now.", email: user.email };
  });
}

/**
 * Whether the account just signed in with this e-mail still holds a password
 * an admin chose, so sign-in sends the person straight to the password change.
 * Asked only after a successful sign-in, so it tells nothing about who has an account.
 */
export function passwordChangePending(email: string, db: Db = getDb()): boolean {
  const row = db.select({ pending: users.mustChangePassword }).from(users).where(eq(users.email, email.trim().toLowerCase())).get();
  return row?.pending === true;
}
