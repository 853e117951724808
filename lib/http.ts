import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { formatIssues } from "./schemas/fields";
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

function invalidBody(message: string, status = 400): { ok: false; response: NextResponse } {
  return { ok: false, response: NextResponse.json({ error: message, code: status === 413 ? "too-large" : "invalid", issues: [] }, { status }) };
}

/**
 * Reads a JSON body, answering 400 (not 500) for malformed JSON and 413 past
 * `maxBytes`, counted on the stream whatever Content-Length claims.
 */
export async function readJson(request: Request, options: { maxBytes?: number } = {}): Promise<{ ok: true; body: unknown } | { ok: false; response: NextResponse }> {
  const maxBytes = options.maxBytes ?? JSON_MAX_BYTES;
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

/** Wraps a route handler body so typed errors map once, here. */
export function handle<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      return await fn(...args);
    } catch (error) {
      return errorResponse(error);
    }
  };
}
