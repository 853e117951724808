"use server";

import { defineAction, formText } from "@/lib/auth/action";
import { redeemLinkSchema } from "@/lib/schemas/account-links";
import { redeemAccountLink } from "@/lib/services/users/account-links";

export const redeemLinkAction = defineAction({
  access: "public",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { token: text("token"), newPassword: text("newPassword"), confirmPassword: text("confirmPassword") };
  },
  schema: redeemLinkSchema,
  invalidMessage: "The password was not set: some fields are not valid.",
  run: (ctx, input) => redeemAccountLink(ctx.db, input),
  message: (data) => data.message,
});
