import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { formatIssues } from "./schemas/fields";
import { env } from "./env";
import { API_CONTENT_SECURITY_POLICY } from "./security-headers";
import { HTTP_STATUS, ServiceError } from "./services/errors";
import { BodyTooLargeError, readTextLimited } from "./uploads/limited-body";

/** Maps any error thrown below a route handler to a JSON answer; never a stack trace. */
export function errorResponse(error: unknown): NextResponse {
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

/** Wraps a route handler body so the origin is checked, typed errors map once, and the API headers are set, here. */
export function handle<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      const request = args[0];
      if (request instanceof Request) {
        const refused = originRefusal(request);
        if (refused) return withApiHeaders(refused);
      }
      return withApiHeaders(await fn(...args));
    } catch (error) {
      return withApiHeaders(errorResponse(error));
    }
  };
}
