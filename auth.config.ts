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
      const path = request.nextUrl.pathname;
      // /verify answers a permit counter without an account: whether one file is a stamped packet, nothing more.
      const isPublic = path === "/sign-in" || path === "/verify" || path === "/api/verify" || path.startsWith("/api/auth") || path.startsWith("/api/health");
      if (isPublic) return true;
      if (auth?.user) return true;
      // Route handlers answer JSON, not a redirect, so client code can show the refusal.
      if (path.startsWith("/api/")) {
        return Response.json({ error: "Sign in to continue.", code: "unauthenticated", issues: [] }, { status: 401 });
      }
      return false;
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
