import { z } from "zod";
import { passwordSchema } from "./password";
import { ROLES } from "../auth/roles";

export const roleListSchema = z
  .array(z.enum(ROLES, { error: `must be one of ${ROLES.join(", ")}` }))
  .min(1, { message: "choose at least one role" });

export const newUserSchema = z.object({
  name: z.string().trim().min(1, { message: "is required" }).max(120),
  email: z.string().trim().toLowerCase().email({ message: "must be an e-mail address" }).max(254),
  roles: roleListSchema,
  /** The first password, handed to the person by the admin; at least 12 characters. */
  password: passwordSchema,
});
export type NewUserInput = z.input<typeof newUserSchema>;

export const setRolesSchema = z.object({ userId: z.string().min(1), roles: roleListSchema, version: z.coerce.number().int() });
export const setActiveSchema = z.object({ userId: z.string().min(1), active: z.boolean(), version: z.coerce.number().int() });
