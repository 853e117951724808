import "server-only";
import { cache } from "react";
import { auth } from "../../auth";
import { getDb } from "../../db/client";
import { contextForUser, type ServiceContext } from "../services/context";
import { ServiceError } from "../services/errors";

/** The session version the token was issued with; -1 for a token from before versions, which no user has. */
function tokenSessionVersion(session: { user?: unknown } | null): number {
  const v = (session?.user as { sessionVersion?: unknown } | undefined)?.sessionVersion;
  return typeof v === "number" ? v : -1;
}

/**
 * The service context of the signed-in user, or null when signed out or deactivated.
 * Cached per request so a layout, its page and their helpers share one read of the
 * user and roles (and one context object, which keys the other per-request caches).
 */
export const currentContext = cache(async function currentContext(): Promise<ServiceContext | null> {
  const session = await auth();
  const userId = session?.user?.id;
  if (!userId) return null;
  try {
    return contextForUser(getDb(), userId, tokenSessionVersion(session));
  } catch (error) {
    if (error instanceof ServiceError && error.code === "unauthenticated") return null;
    throw error;
  }
});

/**
 * As currentContext, but throws the typed 401 for route handlers and actions.
 * A person still holding a password an admin chose gets 403 from everything
 * but the password change itself (pages are sent there by the proxy).
 */
export async function requireContext(options: { passwordChange?: boolean } = {}): Promise<ServiceContext> {
  const session = await auth();
  const ctx = contextForUser(getDb(), session?.user?.id, tokenSessionVersion(session));
  if (ctx.mustChangePassword && !options.passwordChange) {
    throw new ServiceError("forbidden", "Choose your own password first, on the Password page: an administrator set the one you signed in with.");
  }
  return ctx;
}
