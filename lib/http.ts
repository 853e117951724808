import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { formatIssues } from "./schemas/fields";
import { HTTP_STATUS, ServiceError } from "./services/errors";

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

/** Reads a JSON body, answering 400 (not 500) for malformed JSON. */
export async function readJson(request: Request): Promise<{ ok: true; body: unknown } | { ok: false; response: NextResponse }> {
  try {
    return { ok: true, body: await request.json() };
  } catch {
    return {
      ok: false,
      response: NextResponse.json({ error: "The request body is not valid JSON.", code: "invalid", issues: [] }, { status: 400 }),
    };
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
