import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { authConfig } from "./auth.config";
import { getDb } from "./db/client";
import { env } from "./lib/env";
import { signInThrottle } from "./lib/services/auth/throttle";
import { verifyCredentials } from "./lib/services/auth/verify-credentials";

class LockedSignIn extends CredentialsSignin {
  code = "locked";
}
class InactiveSignIn extends CredentialsSignin {
  code = "inactive";
}
class ThrottledSignIn extends CredentialsSignin {
  code = "throttled";
}
class WrongCredentials extends CredentialsSignin {
  code = "credentials";
}

const credentialsSchema = z.object({
  email: z.string().trim().email().max(254),
  password: z.string().min(1).max(200),
});

export const { handlers, auth, signIn, signOut } = NextAuth({
  ...authConfig,
  logger: {
    // A wrong password or a forged token is an expected refusal, answered to the user; not a server error.
    error(error) {
      const name = (error as { type?: string }).type ?? error.name;
      if (name === "CredentialsSignin" || name === "JWTSessionError") return;
      console.error(error);
    },
  },
  providers: [
    Credentials({
      credentials: { email: { label: "E-mail" }, password: { label: "Password", type: "password" } },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) throw new WrongCredentials();
        const { SIGNIN_MAX_FAILURES, SIGNIN_LOCK_MINUTES } = env();
        const policy = { maxFailures: SIGNIN_MAX_FAILURES, lockMinutes: SIGNIN_LOCK_MINUTES };
        const client = request.headers.get("x-forwarded-for")?.split(",")[0]?.trim() || "local";
        const outcome = await verifyCredentials(getDb(), parsed.data.email, parsed.data.password, policy, {
          client,
          throttle: signInThrottle(policy.maxFailures, policy.lockMinutes),
        });
        if (outcome.ok) return { ...outcome.user };
        if (outcome.reason === "locked") throw new LockedSignIn();
        if (outcome.reason === "inactive") throw new InactiveSignIn();
        if (outcome.reason === "throttled") throw new ThrottledSignIn();
        throw new WrongCredentials();
      },
    }),
  ],
});
