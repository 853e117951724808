import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { deleteAttachment, getAttachmentFile, linkAttachmentToEquipment } from "@/lib/services/attachments";
import { inlineFileHeaders } from "@/lib/security-headers";

/** RFC 6266 / RFC 5987: an ASCII fallback name and the exact UTF-8 name. */
function contentDisposition(kind: "attachment" | "inline", fileName: string): string {
  const fallback = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `${kind}; filename="${fallback}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

export const GET = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const { attachment, bytes } = await getAttachmentFile(ctx, id);
  const inline = new URL(request.url).searchParams.get("inline") === "1";
  return new Response(bytes as Uint8Array<ArrayBuffer>, {
    status: 200,
    headers: {
      "Content-Type": attachment.mimeType,
      "Content-Length": String(bytes.byteLength),
      "Content-Disposition": contentDisposition(inline ? "inline" : "attachment", attachment.fileName),
      ...inlineFileHeaders(),
      "Cache-Control": "private, no-store",
      ETag: `"${attachment.sha256}"`,
    },
  });
});

export const PATCH = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const raw = (body.body as { equipmentTag?: unknown } | null)?.equipmentTag;
  const tag = typeof raw === "string" ? raw : null;
  return NextResponse.json({ attachment: linkAttachmentToEquipment(ctx, id, tag) });
});

export const DELETE = handle(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  return NextResponse.json(await deleteAttachment(ctx, id));
});
