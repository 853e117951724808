import NextAuth from "next-auth";
import { authConfig } from "./auth.config";

/**
 * Sends signed-out visitors to sign-in. This is navigation, not
 * authorisation: every service checks the actor's permission itself.
 */
export default NextAuth(authConfig).auth;

export const config = {
  // Uploads bypass the proxy: it would buffer only the first 10 MB of a body, and
  // the upload route checks the session itself like every route handler.
  matcher: ["/((?!_next/static|_next/image|favicon.ico|fonts/|api/uploads).*)"],
};
