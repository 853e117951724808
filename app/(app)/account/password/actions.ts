"use server";

import { runAction, type ActionResult } from "@/lib/auth/action";
import { changeOwnPassword } from "@/lib/services/users/change-password";

export async function changePasswordAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await runAction((ctx) => changeOwnPassword(ctx, { currentPassword: formData.get("currentPassword"), newPassword: formData.get("newPassword") }));
  return result.ok ? { ok: true, message: result.data?.message } : result;
}
