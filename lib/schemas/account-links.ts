import { z } from "zod";
import { passwordSchema } from "./password";
import { roleListSchema } from "./users";

/** An invitation: the person chooses their own first password from the link, so the admin never knows it. */
export const inviteUserSchema = z.object({
  name: z.string().trim().min(1, { message: "is required" }).max(120),
  email: z.string().trim().toLowerCase().email({ message: "must be an e-mail address" }).max(254),
  roles: roleListSchema,
});

export const resetRequestSchema = z.object({
  email: z.string().trim().toLowerCase().email({ message: "must be an e-mail address" }).max(254),
});

/** A token is 32 random bytes in base64url: 43 characters. */
export const accountTokenSchema = z
  .string({ error: "is missing" })
  .trim()
  .regex(/^[A-Za-z0-9_-]{43}$/, { message: "is not a link this app sent" });

export const redeemLinkSchema = z
  .object({
    token: accountTokenSchema,
    newPassword: passwordSchema,
    confirmPassword: z.string({ error: "is required" }),
  })
  .refine((v) => v.newPassword === v.confirmPassword, { path: ["confirmPassword"], message: "does not match the new password" });

export const adminSetPasswordSchema = z.object({
  userId: z.string().min(1).max(64),
  version: z.coerce.number().int(),
  password: passwordSchema,
});

export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: "is required" }).min(1, { message: "is required" }).max(200),
  newPassword: passwordSchema,
});
