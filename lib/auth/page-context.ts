import "server-only";
import { redirect } from "next/navigation";
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
