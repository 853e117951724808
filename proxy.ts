import NextAuth from "next-auth";
import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { authConfig } from "./auth.config";
import { HSTS, isHttps, newNonce, pageContentSecurityPolicy, STATIC_SECURITY_HEADERS } from "./lib/security-headers";

const { auth } = NextAuth(authConfig);

/**
 * Sends signed-out visitors to sign-in (the `authorized` callback). This is
 * navigation, not authorisation: every service checks the actor's permission
 * itself. A page request that passes gets a nonce in its CSP request header,
 * which Next.js puts on the scripts it renders.
 */
const withSession = auth((request) => {
  const csp = pageContentSecurityPolicy(newNonce(), { https: isHttps(request.nextUrl, request.headers), dev: process.env.NODE_ENV === "development" });
  const headers = new Headers(request.headers);
  headers.set("content-security-policy", csp);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", csp);
  return response;
});

/** Every page response carries the security headers, redirects included; route handlers set theirs in lib/http.ts. */
export default async function proxy(request: NextRequest, event: NextFetchEvent): Promise<Response> {
  const response = (await withSession(request, event as never)) as Response;
  for (const [name, value] of Object.entries(STATIC_SECURITY_HEADERS)) response.headers.set(name, value);
  if (isHttps(request.nextUrl, request.headers)) response.headers.set("Strict-Transport-Security", HSTS);
  return response;
}

export const config = {
  // Route handlers bypass the proxy: each checks the session itself (requireContext
  // answers 401 JSON), so decoding the token here too only doubled the work of every
  // API call; health is public; and uploads would be buffered to 10 MB by the proxy.
  // The sign-in handlers under /api/auth need no redirect either.
  matcher: ["/((?!_next/static|_next/image|favicon.ico|fonts/|api/).*)"],
};
