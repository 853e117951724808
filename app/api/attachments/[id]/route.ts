import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { attachmentLinkSchema } from "@/lib/schemas/edges";
import { deleteAttachment, getAttachmentFile, linkAttachmentToEquipment } from "@/lib/services/attachments";
import { inlineFileHeaders } from "@/lib/security-headers";

/** RFC 6266 / RFC 5987: an ASCII fallback name and the exact UTF-8 name. */
function contentDisposition(kind: "attachment" | "inline", fileName: string): string {
  const fallback = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `${kind}; filename="${fallback}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

export const GET = defineRoute({
  access: "user",
  run: async ({ ctx, request, params }) => {
    const { attachment, bytes } = await getAttachmentFile(ctx, params.id ?? "");
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
  },
});

export const PATCH = defineRoute({
  access: "user",
  permission: "attachment:upload",
  json: attachmentLinkSchema,
  run: ({ ctx, params, body }) => NextResponse.json({ attachment: linkAttachmentToEquipment(ctx, params.id ?? "", body.equipmentTag ?? null) }),
});

export const DELETE = defineRoute({
  access: "user",
  permission: "attachment:delete",
  run: async ({ ctx, params }) => NextResponse.json(await deleteAttachment(ctx, params.id ?? "")),
});
