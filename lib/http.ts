import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { formatIssues } from "./schemas/fields";
import { env } from "./env";
import { API_CONTENT_SECURITY_POLICY } from "./security-headers";
import { HTTP_STATUS, ServiceError } from "./services/errors";
import { BodyTooLargeError, declaresMoreThan, readTextLimited } from "./uploads/limited-body";
import { UploadRefusedError } from "./uploads/refusal";
import { requireContext } from "./auth/session";
import type { Permission } from "./auth/permissions";
import { requirePermission, type ServiceContext } from "./services/context";

/** Maps any error thrown below a route handler to a JSON answer; never a stack trace. */
export function errorResponse(error: unknown): NextResponse {
  if (error instanceof UploadRefusedError) {
    return NextResponse.json({ error: error.message, code: "upload-refused", reason: error.reason, issues: [] }, { status: error.httpStatus });
  }
  if (error instanceof BodyTooLargeError) {
    return NextResponse.json({ error: "The request body is larger than this route accepts; nothing was changed.", code: "too-large", issues: [] }, { status: 413 });
  }
  if (error instanceof ServiceError) {
    return NextResponse.json({ error: error.message, code: error.code, issues: error.issues }, { status: HTTP_STATUS[error.code] });
  }
  console.error(error);
  return NextResponse.json({ error: "Something went wrong on our side. Nothing was changed.", code: "internal" }, { status: 500 });
}

export function zodErrorResponse(error: z.ZodError, message = "Some fields are not valid."): NextResponse {
  return NextResponse.json({ error: message, code: "invalid", issues: formatIssues(error) }, { status: 400 });
}

/**
 * The largest JSON body a route reads. A project record of a large hybrid
 * system (hundreds of circuits, loads and notes) is a few hundred kilobytes;
 * 2 MB leaves room and keeps one request from holding the server's memory.
 */
export const JSON_MAX_BYTES = 2 * 1024 * 1024;

/** application/json, or a +json type (RFC 6839), with any parameters. */
export function isJsonContentType(header: string | null): boolean {
  const type = (header ?? "").split(";")[0]!.trim().toLowerCase();
  return type === "application/json" || /^application\/[a-z0-9.+-]+\+json$/.test(type);
}

function invalidBody(message: string, status = 400): { ok: false; response: NextResponse } {
  return { ok: false, response: NextResponse.json({ error: message, code: status === 413 ? "too-large" : status === 415 ? "unsupported-type" : "invalid", issues: [] }, { status }) };
}

/**
 * Reads a JSON body, answering 400 (not 500) for malformed JSON and 413 past
 * `maxBytes`, counted on the stream whatever Content-Length claims.
 */
export async function readJson(request: Request, options: { maxBytes?: number } = {}): Promise<{ ok: true; body: unknown } | { ok: false; response: NextResponse }> {
  const maxBytes = options.maxBytes ?? JSON_MAX_BYTES;
  // A form post (text/plain, urlencoded, multipart) is what a hostile page can send without CORS; only JSON is read.
  if (!isJsonContentType(request.headers.get("content-type"))) {
    return invalidBody("Send the body as JSON, with Content-Type: application/json.", 415);
  }
  let text: string;
  try {
    text = await readTextLimited(request, maxBytes);
  } catch (error) {
    if (error instanceof BodyTooLargeError) return invalidBody(`The request body is larger than ${Math.round(maxBytes / 1024)} KB; nothing was changed.`, 413);
    return invalidBody("The request body could not be read. Try again.");
  }
  try {
    return { ok: true, body: JSON.parse(text) };
  } catch {
    return invalidBody("The request body is not valid JSON.");
  }
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Refuses a data-changing request that a browser sent from another site
 * (cross-site request forgery): its Origin must be the app's own (APP_URL, or
 * the host the request was addressed to), and Sec-Fetch-Site, where the
 * browser sends it, must say same-origin. A request with neither header is
 * not from a browser page, and carries no one's cookies by accident.
 */
export function originRefusal(request: Request): NextResponse | null {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return null;
  const refuse = () =>
    NextResponse.json({ error: "This request came from another site and was refused. Nothing was changed.", code: "forbidden", issues: [] }, { status: 403 });
  const site = request.headers.get("sec-fetch-site");
  if (site !== null && site !== "same-origin" && site !== "none") return refuse();
  const origin = request.headers.get("origin");
  if (origin === null) return null;
  const allowed = new Set<string>();
  try {
    allowed.add(new URL(env().APP_URL).origin);
    allowed.add(new URL(request.url).origin);
  } catch {
    return refuse();
  }
  return allowed.has(origin) ? null : refuse();
}

/**
 * A route handler's answer is data, never a page: nothing in it may run or be
 * framed. Files served inline set their own sandboxed policy, which is kept.
 * (next.config adds the headers every response carries.)
 */
export function withApiHeaders(response: Response): Response {
  try {
    if (!response.headers.has("content-security-policy")) response.headers.set("Content-Security-Policy", API_CONTENT_SECURITY_POLICY);
    response.headers.set("X-Content-Type-Options", "nosniff");
  } catch {
    // A redirect's headers are immutable; it has no body to protect.
  }
  return response;
}

type RouteParams = Record<string, string | string[] | undefined>;

/** What a route's `run` receives, once the wrapper has let the request through. */
export interface RouteCall<A extends "user" | "public", B> {
  request: Request;
  /** The signed-in person's context; null on a public route. */
  ctx: A extends "public" ? null : ServiceContext;
  /** The path's dynamic segments; catch-all segments are left out. */
  params: Record<string, string>;
  /** The parsed JSON body, when the route declares `json`. */
  body: B;
  /** The byte bound a route that reads its own body (`stream`) must read it within. */
  maxBytes: number;
}

export interface RouteSpec<A extends "user" | "public", S extends z.ZodType | undefined> {
  access: A;
  /** Checked before a byte of the body is read; the service checks it again on its first line. */
  permission?: A extends "public" ? never : Permission;
  /** A JSON body, parsed with this schema from lib/schemas: 415 for another content type, 413 past `maxBytes`, 400 with the fields otherwise. */
  json?: S;
  /** The JSON body may be left out (no Content-Type, no bytes): the schema then parses `{}`. */
  optional?: true;
  /**
   * The route reads its body itself (a file upload, a CSV, a raw PDF), within
   * `maxBytes`: a declared length past it is refused here, and the readers in
   * lib/uploads/limited-body count the bytes that actually arrive.
   */
  stream?: true;
  maxBytes?: number;
  run: (call: RouteCall<A, S extends z.ZodType ? z.output<S> : undefined>) => Response | Promise<Response>;
}

/** Marks a handler made by defineRoute, so a test can tell every exported handler went through it. */
export const ROUTE_WRAPPED = Symbol.for("sundocket.defineRoute");

/**
 * The one wrapper for route handlers. In this order: the origin of a
 * data-changing request, the session (unless the route is public), the
 * permission, the body (content type, byte bound, schema), then `run`; every
 * error below is mapped to JSON once (errorResponse) and every answer carries
 * the API headers. A route states what it needs and holds only its own work.
 */
export function defineRoute<A extends "user" | "public", S extends z.ZodType | undefined = undefined>(spec: RouteSpec<A, S>) {
  const handler = async (request: Request, context?: { params?: Promise<RouteParams> }): Promise<Response> => {
    try {
      const refused = originRefusal(request);
      if (refused) return withApiHeaders(refused);
      const ctx = spec.access === "public" ? null : await requireContext();
      if (ctx && spec.permission) requirePermission(ctx, spec.permission);
      const maxBytes = spec.maxBytes ?? JSON_MAX_BYTES;
      let body: unknown = undefined;
      // An optional body with no Content-Type is taken as left out, whatever bytes came with it.
      const empty = spec.optional && !request.headers.has("content-type");
      if (spec.json && empty) {
        const parsed = spec.json.safeParse({});
        if (!parsed.success) return withApiHeaders(zodErrorResponse(parsed.error));
        body = parsed.data;
      } else if (spec.json) {
        const read = await readJson(request, { maxBytes });
        if (!read.ok) return withApiHeaders(read.response);
        const parsed = spec.json.safeParse(read.body);
        if (!parsed.success) return withApiHeaders(zodErrorResponse(parsed.error));
        body = parsed.data;
      } else if (spec.stream && declaresMoreThan(request, maxBytes)) {
        return withApiHeaders(errorResponse(new BodyTooLargeError(maxBytes)));
      }
      const raw = (await context?.params) ?? {};
      const params = Object.fromEntries(Object.entries(raw).filter((e): e is [string, string] => typeof e[1] === "string"));
      const call = { request, ctx, params, body, maxBytes } as RouteCall<A, S extends z.ZodType ? z.output<S> : undefined>;
      return withApiHeaders(await spec.run(call));
    } catch (error) {
      return withApiHeaders(errorResponse(error));
    }
  };
  return Object.assign(handler, { [ROUTE_WRAPPED]: true });
}
