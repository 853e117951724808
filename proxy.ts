import NextAuth from "next-auth";
import { authConfig } from "./auth.config";

/**
 * Sends signed-out visitors to sign-in. This is navigation, not
 * authorisation: every service checks the actor's permission itself.
 */
export default NextAuth(authConfig).auth;

export const config = {
  // Route handlers bypass the proxy: each checks the session itself (requireContext
  // answers 401 JSON), so decoding the token here too only doubled the work of every
  // API call; health is public; and uploads would be buffered to 10 MB by the proxy.
  // The sign-in handlers under /api/auth need no redirect either.
  matcher: ["/((?!_next/static|_next/image|favicon.ico|fonts/|api/).*)"],
};
