import type { NextAuthConfig } from "next-auth";

/**
 * The part of the auth configuration the proxy needs: no database, no
 * password hashing. Providers are added in auth.ts.
 */
export const authConfig = {
  pages: { signIn: "/sign-in" },
  trustHost: true,
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  providers: [],
  callbacks: {
    authorized({ auth, request }) {
      // Pages only: route handlers are outside the proxy's matcher and check the session themselves.
      if (request.nextUrl.pathname === "/sign-in") return true;
      if (auth?.user) return true;
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
      }
      return token;
    },
    session({ session, token }) {
      if (session.user) {
        session.user.id = String(token.userId ?? "");
        (session.user as { orgId?: string }).orgId = token.orgId as string | undefined;
        (session.user as { roles?: string[] }).roles = (token.roles as string[] | undefined) ?? [];
      }
      return session;
    },
  },
} satisfies NextAuthConfig;
