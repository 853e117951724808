"use server";

import { defineAction, formText } from "@/lib/auth/action";
import { resetRequestSchema } from "@/lib/schemas/account-links";
import { requestPasswordReset } from "@/lib/services/users/account-links";

export const requestResetAction = defineAction({
  access: "public",
  read: (_prev: unknown, formData: FormData) => ({ email: formText(formData)("email") }),
  schema: resetRequestSchema,
  invalidMessage: "No link was sent: enter the e-mail you sign in with.",
  run: (ctx, input) => requestPasswordReset(ctx.db, input, { client: ctx.client }),
  message: (data) => data.message,
});
