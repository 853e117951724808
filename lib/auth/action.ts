import "server-only";
import { headers } from "next/headers";
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import { formatIssues } from "../schemas/fields";
import { publicContext, requirePermission, type PublicContext, type ServiceContext } from "../services/context";
import type { Permission } from "./permissions";
import { ServiceError, type FieldIssue } from "../services/errors";
import { requireContext } from "./session";

export type ActionResult<T = undefined> =
  | { ok: true; data?: T; message?: string }
  | { ok: false; error: string; issues: FieldIssue[]; code: string };

/** Who may call an action: a signed-in person, one who must first replace an admin-set password, or anyone. */
export type ActionAccess = "user" | "password-change" | "public";

type ContextFor<A extends ActionAccess> = A extends "public" ? PublicContext : ServiceContext;

export interface ActionSpec<A extends ActionAccess, Args extends unknown[], S extends z.ZodType, T> {
  access: A;
  /**
   * Refused before the input is read, so a role without it learns nothing
   * from validation messages. The service checks it again on its first line.
   */
  permission?: A extends "public" ? never : Permission;
  /** The arguments as the form or component sends them, turned into the object the schema parses. */
  read: (...args: Args) => unknown | Promise<unknown>;
  /** The shape and bounds of the input, from lib/schemas. The service checks meaning and permission. */
  schema: S;
  invalidMessage?: string;
  run: (ctx: ContextFor<A>, input: z.output<S>) => T | Promise<T>;
  /** The line shown on success, fixed or from the service's answer. */
  message?: string | ((data: T) => string | undefined);
  /** Work after a success (revalidating the pages that show what changed). */
  after?: (input: z.output<S>, data: T) => void;
}

const INTERNAL = "Something went wrong on our side. Nothing was changed.";

function mapError(error: unknown): ActionResult<never> {
  if (error instanceof ServiceError) return { ok: false, error: error.message, issues: error.issues, code: error.code };
  console.error(error);
  return { ok: false, error: INTERNAL, issues: [], code: "internal" };
}

/**
 * Refuses an action posted from another site. The framework compares Origin
 * with Host too; checking here as well keeps the rule in our hands (and the
 * same as route handlers': lib/http.ts originRefusal).
 */
async function crossSite(): Promise<boolean> {
  const h = await headers();
  const site = h.get("sec-fetch-site");
  if (site !== null && site !== "same-origin" && site !== "none") return true;
  const origin = h.get("origin");
  const host = h.get("x-forwarded-host") ?? h.get("host");
  if (origin === null || host === null) return false;
  try {
    return new URL(origin).host !== host;
  } catch {
    return true;
  }
}

async function clientAddress(): Promise<string> {
  const h = await headers();
  return h.get("x-forwarded-for")?.split(",")[0]?.trim() || "local";
}

/**
 * The one wrapper for server actions: origin, session (or an explicit
 * "public"), input parsed with its schema, and every error mapped to a result
 * the form can show, here and only here. The body's size is bounded by the
 * framework before this runs (serverActions.bodySizeLimit, 1 MB by default).
 * The permission check itself is the service's first line.
 */
export function defineAction<A extends ActionAccess, Args extends unknown[], S extends z.ZodType, T>(spec: ActionSpec<A, Args, S, T>) {
  return async (...args: Args): Promise<ActionResult<T>> => {
    try {
      if (await crossSite()) return { ok: false, error: "This request came from another site and was refused. Nothing was changed.", issues: [], code: "forbidden" };
      const ctx = (
        spec.access === "public" ? publicContext(await clientAddress()) : await requireContext({ passwordChange: spec.access === "password-change" })
      ) as ContextFor<A>;
      if (spec.permission) requirePermission(ctx as ServiceContext, spec.permission);
      const parsed = spec.schema.safeParse(await spec.read(...args));
      if (!parsed.success) {
        return { ok: false, error: spec.invalidMessage ?? "Some fields are not valid; nothing was changed.", issues: formatIssues(parsed.error), code: "invalid" };
      }
      const data = await spec.run(ctx, parsed.data);
      spec.after?.(parsed.data, data);
      const message = typeof spec.message === "function" ? spec.message(data) : spec.message;
      return { ok: true, data, message };
    } catch (error) {
      // A redirect (after signing in or out) is the framework's way of answering, not a failure.
      unstable_rethrow(error);
      return mapError(error);
    }
  };
}

/** A form's text fields by name; a file or a missing field reads as undefined. */
export function formText(formData: FormData) {
  return (name: string): string | undefined => {
    const v = formData?.get?.(name);
    return typeof v === "string" ? v : undefined;
  };
}
