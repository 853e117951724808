import NextAuth from "next-auth";
import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { authConfig } from "./auth.config";
import { API_CONTENT_SECURITY_POLICY, HSTS, isHttps, newNonce, pageContentSecurityPolicy, STATIC_SECURITY_HEADERS } from "./lib/security-headers";

const { auth } = NextAuth(authConfig);

/**
 * Sends signed-out visitors to sign-in (the `authorized` callback). This is
 * navigation, not authorisation: every service checks the actor's permission
 * itself. A page request that passes gets a nonce in its CSP request header,
 * which Next.js puts on the scripts it renders.
 */
const withSession = auth((request) => {
  const path = request.nextUrl.pathname;
  if (path.startsWith("/api/")) return NextResponse.next();
  const csp = pageContentSecurityPolicy(newNonce(), { https: isHttps(request.nextUrl, request.headers), dev: process.env.NODE_ENV === "development" });
  const headers = new Headers(request.headers);
  headers.set("content-security-policy", csp);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", csp);
  return response;
});

/** Every response the proxy passes carries the security headers, redirects and refusals included. */
export default async function proxy(request: NextRequest, event: NextFetchEvent): Promise<Response> {
  const response = (await withSession(request, event as never)) as Response;
  for (const [name, value] of Object.entries(STATIC_SECURITY_HEADERS)) response.headers.set(name, value);
  if (isHttps(request.nextUrl, request.headers)) response.headers.set("Strict-Transport-Security", HSTS);
  // Route handlers that serve files set their own (sandboxed) policy, which replaces this one.
  if (!response.headers.has("Content-Security-Policy")) response.headers.set("Content-Security-Policy", API_CONTENT_SECURITY_POLICY);
  return response;
}

export const config = {
  // Uploads bypass the proxy: it would buffer only the first 10 MB of a body, and
  // the upload route checks the session itself like every route handler
  // (next.config gives it the security headers).
  matcher: ["/((?!_next/static|_next/image|favicon.ico|fonts/|api/uploads).*)"],
};
