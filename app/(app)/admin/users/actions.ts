"use server";

import { revalidatePath } from "next/cache";
import { defineAction, formText } from "@/lib/auth/action";
import { ROLES } from "@/lib/auth/roles";
import { adminSetPasswordSchema, inviteUserSchema } from "@/lib/schemas/account-links";
import { newUserSchema, setActiveSchema, setRolesSchema } from "@/lib/schemas/users";
import { inviteUser } from "@/lib/services/users/account-links";
import { addUser, setPasswordByAdmin, setUserActive, setUserRoles } from "@/lib/services/users/manage";

function rolesFrom(formData: FormData): string[] {
  return ROLES.filter((role) => formData?.get?.(`role-${role}`) === "on");
}

const refreshUsers = () => revalidatePath("/admin/users");

export const addUserAction = defineAction({
  access: "user",
  permission: "users:manage",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { name: text("name"), email: text("email"), password: text("password"), roles: rolesFrom(formData) };
  },
  schema: newUserSchema,
  invalidMessage: "The user was not added: some fields are not valid.",
  run: (ctx, input) => addUser(ctx, input),
  message: "User added. Hand them their first password in person or by phone; they choose their own at first sign-in.",
  after: refreshUsers,
});

export const inviteUserAction = defineAction({
  access: "user",
  permission: "users:manage",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { name: text("name"), email: text("email"), roles: rolesFrom(formData) };
  },
  schema: inviteUserSchema,
  invalidMessage: "The invitation was not sent: some fields are not valid.",
  run: (ctx, input) => inviteUser(ctx, input),
  message: "Invitation sent. The link in it works once, for 72 hours.",
  after: refreshUsers,
});

export const setRolesAction = defineAction({
  access: "user",
  permission: "users:manage",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { userId: text("userId"), version: text("version"), roles: rolesFrom(formData) };
  },
  schema: setRolesSchema,
  invalidMessage: "The roles were not changed.",
  run: (ctx, input) => setUserRoles(ctx, input),
  message: "Roles saved.",
  after: refreshUsers,
});

export const setActiveAction = defineAction({
  access: "user",
  permission: "users:manage",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { userId: text("userId"), version: text("version"), active: text("active") === "true" };
  },
  schema: setActiveSchema,
  invalidMessage: "The user was not changed.",
  run: (ctx, input) => setUserActive(ctx, input),
  message: "Saved.",
  after: refreshUsers,
});

export const setPasswordAction = defineAction({
  access: "user",
  permission: "users:manage",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { userId: text("userId"), version: text("version"), password: text("password") };
  },
  schema: adminSetPasswordSchema,
  invalidMessage: "The password was not set: some fields are not valid.",
  run: (ctx, input) => setPasswordByAdmin(ctx, input),
  message: "Password set. They choose their own at their next sign-in.",
  after: refreshUsers,
});
