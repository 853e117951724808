import type { ActionResult } from "../../../lib/auth/action";
import { HTTP_STATUS, type ServiceErrorCode } from "../../../lib/services/errors";

/** What one request answered, whether it went through a route handler or a server action. */
export interface Outcome {
  status: number;
  text: string;
}

export const BASE = "http://localhost:3000";

// Route handlers take (request, { params }); those without params ignore the second argument.
type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

export interface RequestOptions {
  json?: unknown;
  form?: FormData;
  text?: { body: string; type: string };
  params?: Record<string, string>;
  headers?: Record<string, string>;
}

/** Calls a route handler as Next would, from the app's own origin. */
export async function http(handler: unknown, method: string, url: string, options: RequestOptions = {}): Promise<Outcome> {
  const headers: Record<string, string> = { origin: BASE, "sec-fetch-site": "same-origin", ...options.headers };
  let body: BodyInit | undefined;
  if (options.json !== undefined) {
    body = JSON.stringify(options.json);
    headers["content-type"] = "application/json";
  } else if (options.form) {
    body = options.form;
  } else if (options.text) {
    body = options.text.body;
    headers["content-type"] = options.text.type;
  }
  const response = await (handler as Handler)(new Request(`${BASE}${url}`, { method, headers, body }), { params: Promise.resolve(options.params ?? {}) });
  const type = response.headers.get("content-type") ?? "";
  const text = type.includes("json") || type.startsWith("text/") ? await response.text() : `<${type}, ${(await response.arrayBuffer()).byteLength} bytes>`;
  return { status: response.status, text };
}

/** A server action's result as the status the same refusal has on a route. */
export async function action(result: Promise<ActionResult<unknown>>): Promise<Outcome> {
  const r = await result;
  if (r.ok) return { status: 200, text: JSON.stringify(r) };
  // "internal" is the action wrapper's answer to an error no service expected: the same as a 500.
  const status = r.code === "internal" ? 500 : (HTTP_STATUS[r.code as ServiceErrorCode] ?? 400);
  return { status, text: JSON.stringify(r) };
}

export function form(fields: Record<string, string | string[] | Blob>, files: Record<string, File> = {}): FormData {
  const f = new FormData();
  for (const [key, value] of Object.entries(fields)) {
    if (Array.isArray(value)) for (const v of value) f.append(key, v);
    else f.set(key, value);
  }
  for (const [key, file] of Object.entries(files)) f.set(key, file);
  return f;
}
