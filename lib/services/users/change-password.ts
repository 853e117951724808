import "server-only";
import bcrypt from "bcryptjs";
import { and, eq, sql } from "drizzle-orm";
import { users } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { changePasswordSchema } from "../../schemas/account-links";
import { hashPassword } from "../auth/verify-credentials";
import { audit, type ServiceContext } from "../context";
import { invalid, notFound } from "../errors";


/**
 * A signed-in person changes their own password. The current one is asked
 * for, so an unattended browser cannot lock its owner out. The session version
 * is raised, which ends every session signed in with the old password,
 * including this one: the person signs in again with the new password.
 */
export async function changeOwnPassword(ctx: ServiceContext, input: unknown): Promise<{ message: string }> {
  const parsed = changePasswordSchema.safeParse(input);
  if (!parsed.success) throw invalid("The password was not changed: some fields are not valid.", formatIssues(parsed.error));
  const { currentPassword, newPassword } = parsed.data;
  const user = ctx.db.select().from(users).where(and(eq(users.id, ctx.user.id), eq(users.orgId, ctx.orgId))).get();
  if (!user) throw notFound("User");
  if (!(await bcrypt.compare(currentPassword, user.passwordHash))) {
    throw invalid("The password was not changed: the current password is not right.", [{ path: "currentPassword", message: "is not your current password" }]);
  }
  if (currentPassword === newPassword) throw invalid("Choose a password different from the current one.", [{ path: "newPassword", message: "is the same as the current password" }]);
  const passwordHash = await hashPassword(newPassword);
  ctx.db.transaction((tx) => {
    tx.update(users)
      .set({ passwordHash, mustChangePassword: false, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date().toISOString() })
      .where(and(eq(users.id, user.id), eq(users.orgId, ctx.orgId)))
      .run();
    audit(tx, ctx, "user.password-changed", "user", user.id);
  });
  return { message: "Password changed. Sign in again with your new password." };
}
