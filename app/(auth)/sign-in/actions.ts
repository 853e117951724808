"use server";

import { AuthError, CredentialsSignin } from "next-auth";
import { redirect } from "next/navigation";
import { signIn } from "@/auth";
import { CHANGE_PASSWORD_PAGE } from "@/auth.config";
import { defineAction, formText } from "@/lib/auth/action";
import { env } from "@/lib/env";
import { signInFormSchema } from "@/lib/schemas/edges";
import { passwordChangePending } from "@/lib/services/users/account-links";

/** What the form shows after a refused sign-in: the message, and the e-mail typed, to keep in the field. */
export interface SignInState {
  error?: string;
  email?: string;
}

function messageFor(code: string | undefined): string {
  switch (code) {
    case "locked":
      return `This account is locked for ${env().SIGNIN_LOCK_MINUTES} minutes after repeated failed sign-ins. Try again later, or ask your administrator to unlock it.`;
    case "throttled":
      return `Too many failed sign-ins from this network. Wait ${env().SIGNIN_LOCK_MINUTES} minutes and try again.`;
    case "inactive":
      return "This account has been deactivated. Ask your administrator if you still need access.";
    default:
      return "That e-mail and password do not match an account. Check both and try again.";
  }
}

export const signInAction = defineAction({
  access: "public",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return { email: text("email") ?? "", password: text("password") ?? "", next: text("next") ?? "/" };
  },
  schema: signInFormSchema,
  run: async (_ctx, { email, password, next }): Promise<SignInState> => {
    if (!email.trim() || !password) return { error: "Enter your e-mail and password.", email };
    // Only same-site paths, so the sign-in page cannot be used to send people elsewhere.
    const redirectTo = next.startsWith("/") && !next.startsWith("//") ? next : "/";
    try {
      await signIn("credentials", { email, password, redirect: false });
    } catch (error) {
      if (error instanceof CredentialsSignin) return { error: messageFor(error.code), email };
      if (error instanceof AuthError) return { error: messageFor(undefined), email };
      throw error;
    }
    // A password an admin chose is replaced before anything else; going there directly keeps the address bar honest.
    redirect(passwordChangePending(email) ? CHANGE_PASSWORD_PAGE : redirectTo);
  },
});
