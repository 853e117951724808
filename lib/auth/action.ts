import "server-only";
import type { ServiceContext } from "../services/context";
import { ServiceError, type FieldIssue } from "../services/errors";
import { requireContext } from "./session";

export type ActionResult<T = undefined> =
  | { ok: true; data?: T; message?: string }
  | { ok: false; error: string; issues: FieldIssue[]; code: string };

/**
 * The one wrapper for server actions: resolves the signed-in context and maps
 * typed service errors to a result the form can show. The permission check
 * itself is the service's first line.
 */
export async function runAction<T>(fn: (ctx: ServiceContext) => T | Promise<T>, message?: string): Promise<ActionResult<T>> {
  try {
    const ctx = await requireContext();
    const data = await fn(ctx);
    return { ok: true, data, message };
  } catch (error) {
    if (error instanceof ServiceError) return { ok: false, error: error.message, issues: error.issues, code: error.code };
    console.error(error);
    return { ok: false, error: "Something went wrong on our side. Nothing was changed.", issues: [], code: "internal" };
  }
}
