"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionResult } from "@/lib/auth/action";
import { ROLES } from "@/lib/auth/roles";
import { addUser, setUserActive, setUserRoles } from "@/lib/services/users/manage";

function rolesFrom(formData: FormData): string[] {
  return ROLES.filter((role) => formData.get(`role-${role}`) === "on");
}

export async function addUserAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await runAction(
    (ctx) =>
      addUser(ctx, {
        name: formData.get("name"),
        email: formData.get("email"),
        password: formData.get("password"),
        roles: rolesFrom(formData),
      }),
    "User added. Hand them their first password in person or by phone.",
  );
  if (result.ok) revalidatePath("/admin/users");
  return result as ActionResult;
}

export async function setRolesAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await runAction(
    (ctx) => setUserRoles(ctx, { userId: formData.get("userId"), version: formData.get("version"), roles: rolesFrom(formData) }),
    "Roles saved.",
  );
  if (result.ok) revalidatePath("/admin/users");
  return result as ActionResult;
}

export async function setActiveAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await runAction(
    (ctx) =>
      setUserActive(ctx, { userId: formData.get("userId"), version: formData.get("version"), active: formData.get("active") === "true" }),
    "Saved.",
  );
  if (result.ok) revalidatePath("/admin/users");
  return result as ActionResult;
}
