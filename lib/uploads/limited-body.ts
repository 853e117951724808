/**
 * Request bodies read with their size counted as the bytes arrive. A
 * Content-Length header is only a claim, and a chunked request has none, so
 * the count on the stream is what holds: past the limit the stream is
 * cancelled and nothing more is read or kept.
 */

export class BodyTooLargeError extends Error {
  constructor(readonly limitBytes: number) {
    super(`the request body is larger than ${limitBytes} bytes`);
    this.name = "BodyTooLargeError";
  }
}

/** The declared length when the header is present and says more than `limitBytes`; lets an honest client be refused before sending. */
export function declaresMoreThan(request: Request, limitBytes: number): boolean {
  const header = request.headers.get("content-length");
  if (header === null || header.trim() === "") return false;
  const declared = Number(header);
  return Number.isFinite(declared) && declared > limitBytes;
}

/**
 * Hands each chunk of the body to `onChunk` as it arrives, and throws BodyTooLargeError as soon as more than
 * `limitBytes` have arrived (the stream is cancelled then). Returns the byte count.
 */
export async function forEachChunkLimited(request: Request, limitBytes: number, onChunk: (chunk: Uint8Array) => void): Promise<number> {
  if (declaresMoreThan(request, limitBytes)) throw new BodyTooLargeError(limitBytes);
  if (!request.body) return 0;
  const reader = request.body.getReader();
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limitBytes) {
      await reader.cancel().catch(() => undefined);
      throw new BodyTooLargeError(limitBytes);
    }
    onChunk(value);
  }
  return total;
}

/** The whole body, or BodyTooLargeError as soon as more than `limitBytes` have arrived. */
export async function readBodyLimited(request: Request, limitBytes: number): Promise<Uint8Array> {
  const chunks: Uint8Array[] = [];
  const total = await forEachChunkLimited(request, limitBytes, (chunk) => chunks.push(chunk));
  const out = new Uint8Array(total);
  let at = 0;
  for (const chunk of chunks) {
    out.set(chunk, at);
    at += chunk.byteLength;
  }
  return out;
}

/** The body as text (UTF-8), counted on the stream like readBodyLimited. */
export async function readTextLimited(request: Request, limitBytes: number): Promise<string> {
  return new TextDecoder().decode(await readBodyLimited(request, limitBytes));
}

/** A multipart/form-data body, parsed only after it arrived whole within `limitBytes`. */
export async function readFormDataLimited(request: Request, limitBytes: number): Promise<FormData> {
  const bytes = await readBodyLimited(request, limitBytes);
  const type = request.headers.get("content-type") ?? "";
  return new Response(bytes as Uint8Array<ArrayBuffer>, { headers: { "content-type": type } }).formData();
}
