import "server-only";
import { notFound, redirect } from "next/navigation";
import { ServiceError } from "../services/errors";
import { can, type Permission } from "./permissions";
import { currentContext } from "./session";

/**
 * For pages: the signed-in context, or a redirect to sign-in. `allowed` tells
 * the page whether to render or show the refusal; the services it then calls
 * check the permission again for themselves.
 */
export async function pageContext(permission: Permission) {
  const ctx = await currentContext();
  if (!ctx) redirect("/sign-in");
  return { ctx, allowed: can(ctx.roles, permission) };
}

/** Runs a service read for a page; a row that is not found (or another organisation's) becomes the 404 page. */
export function orNotFound<T>(read: () => T): T {
  try {
    return read();
  } catch (error) {
    if (error instanceof ServiceError && error.code === "not-found") notFound();
    throw error;
  }
}
