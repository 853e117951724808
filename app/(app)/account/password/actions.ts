"use server";

import { defineAction, formText } from "@/lib/auth/action";
import { changePasswordSchema } from "@/lib/schemas/account-links";
import { changeOwnPassword } from "@/lib/services/users/change-password";

/** Open to a person who must first replace an admin-set password: this is where they do it. */
export const changePasswordAction = defineAction({
  access: "password-change",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { currentPassword: text("currentPassword"), newPassword: text("newPassword") };
  },
  schema: changePasswordSchema,
  invalidMessage: "The password was not changed: some fields are not valid.",
  run: (ctx, input) => changeOwnPassword(ctx, input),
  message: (data) => data.message,
});
