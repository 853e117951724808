/**
 * The headers every response carries, in one place for the proxy (pages and
 * route handlers) and next.config (static files and the upload route, which
 * bypasses the proxy). Edge-safe: no node built-ins.
 */

/** Sent on every response, whatever it is. */
export const STATIC_SECURITY_HEADERS: Record<string, string> = {
  // A MIME type is the only thing a browser uses to decide how to treat a response.
  "X-Content-Type-Options": "nosniff",
  // Project names and ids in paths stay on our site; other sites learn only our origin.
  "Referrer-Policy": "strict-origin-when-cross-origin",
  "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=()",
};

/** Two years, with subdomains: what the HSTS preload list asks for (hstspreload.org). */
export const HSTS = "max-age=63072000; includeSubDomains";

/** A fresh, unguessable nonce per request (16 random bytes, base64). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/**
 * The page policy. Scripts run only with this response's nonce (Next.js reads
 * it from the request's CSP header and puts it on its own scripts), plus what
 * those load ('strict-dynamic'). Styles allow inline attributes: React's
 * style props and the chart library set them, and a style cannot run code.
 * Frames: the packet PDF (same origin) and the template preview (a blob URL).
 */
export function pageContentSecurityPolicy(nonce: string, options: { https: boolean; dev: boolean }): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${options.dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "frame-src 'self' blob:",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(options.https ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

/** Route handlers answer data, never a page: nothing in them may run or be framed. */
export const API_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'";

/**
 * Files we serve inline (packet PDFs, uploaded attachments, label sheets): a
 * sandboxed document, so script inside a PDF or an image cannot act as our
 * origin. Our own pages may frame them (the reviewer's reading frame).
 */
export const INLINE_FILE_CONTENT_SECURITY_POLICY = "sandbox; default-src 'none'; img-src 'self' data:; style-src 'unsafe-inline'; frame-ancestors 'self'";

/** Headers for a file response shown in the browser. */
export function inlineFileHeaders(): Record<string, string> {
  return { "Content-Security-Policy": INLINE_FILE_CONTENT_SECURITY_POLICY, "X-Content-Type-Options": "nosniff" };
}

/** Whether the request reached us over https (directly, or through a proxy that says so). */
export function isHttps(url: URL, headers: Headers): boolean {
  return url.protocol === "https:" || (headers.get("x-forwarded-proto") ?? "").split(",")[0]?.trim() === "https";
}
