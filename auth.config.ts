import type { NextAuthConfig } from "next-auth";

/**
 * A session slides while it is used (IDLE), but ends a fixed time after
 * sign-in however busy it is (ABSOLUTE): a stolen token is not good forever,
 * and a day's work fits in one sign-in (common practice for business apps).
 */
export const SESSION_IDLE_SECONDS = 8 * 60 * 60;
export const SESSION_ABSOLUTE_SECONDS = 12 * 60 * 60;

/** True when a token issued at `signedInAt` (epoch seconds) has outlived the absolute lifetime at `nowSeconds`. */
export function sessionExpired(signedInAt: unknown, nowSeconds: number): boolean {
  return typeof signedInAt !== "number" || nowSeconds - signedInAt > SESSION_ABSOLUTE_SECONDS;
}

/** Pages a signed-out visitor may open. */
export const PUBLIC_PAGES: ReadonlySet<string> = new Set(["/sign-in", "/verify", "/forgot-password", "/set-password"]);
export const CHANGE_PASSWORD_PAGE = "/account/password";

/**
 * The part of the auth configuration the proxy needs: no database, no
 * password hashing. Providers are added in auth.ts.
 */
export const authConfig = {
  pages: { signIn: "/sign-in" },
  trustHost: true,
  session: { strategy: "jwt", maxAge: SESSION_IDLE_SECONDS },
  providers: [],
  callbacks: {
    authorized({ auth, request }) {
      // Pages only: route handlers are outside the proxy's matcher and check the session themselves.
      // /verify answers a permit counter without an account: whether one file is a stamped packet, nothing more.
      // Choosing a password from an e-mailed link, or asking for one, is done signed out.
      const path = request.nextUrl.pathname;
      if (PUBLIC_PAGES.has(path)) return true;
      if (auth?.user) {
        // A password someone else chose (an admin's) is replaced before anything else is done.
        if ((auth.user as { mustChangePassword?: boolean }).mustChangePassword && path !== CHANGE_PASSWORD_PAGE) {
          return Response.redirect(new URL(CHANGE_PASSWORD_PAGE, request.nextUrl));
        }
        return true;
      }
      // The redirect is made here rather than by returning false, because the proxy's own handler runs only for allowed requests.
      const signIn = new URL("/sign-in", request.nextUrl);
      signIn.searchParams.set("callbackUrl", request.nextUrl.href);
      return Response.redirect(signIn);
    },
    jwt({ token, user }) {
      if (user) {
        token.userId = user.id;
        token.orgId = (user as { orgId?: string }).orgId;
        // Roles as of sign-in, for display; services re-read them from the database on every request.
        token.roles = (user as { roles?: string[] }).roles ?? [];
        // Checked against the user's row on every request (lib/services/context.ts): a raised version ends this session.
        token.sessionVersion = (user as { sessionVersion?: number }).sessionVersion ?? 0;
        token.signedInAt = Math.floor(Date.now() / 1000);
        // Changing the password raises the session version, so a token never outlives this flag being cleared.
        token.mustChangePassword = (user as { mustChangePassword?: boolean }).mustChangePassword === true;
      }
      // Null ends the session: re-issuing the token on each request must not extend it past the absolute lifetime.
      if (sessionExpired(token.signedInAt, Math.floor(Date.now() / 1000))) return null;
      return token;
    },
    session({ session, token }) {
      if (session.user) {
        session.user.id = String(token.userId ?? "");
        (session.user as { orgId?: string }).orgId = token.orgId as string | undefined;
        (session.user as { roles?: string[] }).roles = (token.roles as string[] | undefined) ?? [];
        (session.user as { mustChangePassword?: boolean }).mustChangePassword = token.mustChangePassword === true;
        (session.user as { sessionVersion?: number }).sessionVersion = typeof token.sessionVersion === "number" ? token.sessionVersion : -1;
      }
      return session;
    },
  },
} satisfies NextAuthConfig;
