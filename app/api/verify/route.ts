import { createHash } from "node:crypto";
import { NextResponse } from "next/server";
import { env } from "@/lib/env";
import { readJson } from "@/lib/http";
import { checkStampedFile, SHA256_HEX } from "@/lib/services/verify/stamped-file";
import { clientAddress, takeVerifyPoint } from "@/lib/services/verify/rate-limit";
import { BodyTooLargeError, forEachChunkLimited, readFormDataLimited } from "@/lib/uploads/limited-body";

/**
 * Public: checks whether a file is a stamped packet, by its SHA-256 or by the
 * file itself. GET ?sha256=…; POST a JSON {"sha256": …}, the PDF as the raw
 * body (Content-Type: application/pdf) or as "file" in multipart/form-data.
 * The body is hashed as it streams and never stored.
 */

/** Packets carry merged datasheets, so they run larger than one upload; four uploads' worth is a generous packet. */
const maxPacketBytes = () => env().UPLOAD_MAX_BYTES * 4;

function refuse(status: number, error: string, headers?: HeadersInit) {
  return NextResponse.json({ error, code: status === 429 ? "rate-limited" : "invalid", issues: [] }, { status, headers });
}

async function limited(request: Request): Promise<Response | null> {
  const wait = await takeVerifyPoint(clientAddress(request.headers));
  return wait === null ? null : refuse(429, `Too many checks from this address; try again in ${wait} s.`, { "retry-after": String(wait) });
}

function answer(sha256: string) {
  return NextResponse.json(checkStampedFile(sha256), { headers: { "cache-control": "no-store" } });
}

async function hashStream(request: Request, limitBytes: number): Promise<string> {
  const hash = createHash("sha256");
  await forEachChunkLimited(request, limitBytes, (chunk) => hash.update(chunk));
  return hash.digest("hex");
}

export async function GET(request: Request): Promise<Response> {
  const refused = await limited(request);
  if (refused) return refused;
  const sha256 = (new URL(request.url).searchParams.get("sha256") ?? "").trim().toLowerCase();
  if (!SHA256_HEX.test(sha256)) return refuse(400, "Give the file's SHA-256 as 64 hexadecimal characters.");
  return answer(sha256);
}

export async function POST(request: Request): Promise<Response> {
  const refused = await limited(request);
  if (refused) return refused;
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  const limit = maxPacketBytes();
  try {
    if (type.startsWith("application/json")) {
      // {"sha256": "<64 hex>"} is under 100 bytes; a larger JSON body is refused as it streams, not parsed.
      const read = await readJson(request, { maxBytes: 4 * 1024 });
      if (!read.ok) return read.response;
      const body = read.body as { sha256?: unknown } | null;
      const sha256 = typeof body?.sha256 === "string" ? body.sha256.trim().toLowerCase() : "";
      if (!SHA256_HEX.test(sha256)) return refuse(400, "Give the file's SHA-256 as 64 hexadecimal characters.");
      return answer(sha256);
    }
    if (type.startsWith("application/pdf") || type.startsWith("application/octet-stream")) return answer(await hashStream(request, limit));
    if (type.startsWith("multipart/form-data")) {
      const form = await readFormDataLimited(request, limit + 64 * 1024);
      const file = form.get("file");
      if (file instanceof File) return answer(createHash("sha256").update(new Uint8Array(await file.arrayBuffer())).digest("hex"));
      const sha256 = form.get("sha256");
      if (typeof sha256 === "string" && SHA256_HEX.test(sha256.trim().toLowerCase())) return answer(sha256.trim().toLowerCase());
      return refuse(400, "Send the PDF under “file”, or its SHA-256 under “sha256”.");
    }
    return refuse(415, "Send the PDF (application/pdf or multipart/form-data) or its SHA-256 (application/json).");
  } catch (error) {
    if (error instanceof BodyTooLargeError) return refuse(413, "The file is larger than any packet this server issues.");
    throw error;
  }
}
