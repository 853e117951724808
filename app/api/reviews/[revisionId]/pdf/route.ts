import { defineRoute } from "@/lib/http";
import { getRevisionFile } from "@/lib/services/revisions";
import { inlineFileHeaders } from "@/lib/security-headers";

/**
 * The revision's PDF shown inline, for the reviewer's reading frame: the same
 * bytes, checked against the same SHA-256, as the download route serves.
 */
export const GET = defineRoute({
  access: "user",
  run: async ({ ctx, params }) => {
    const file = await getRevisionFile(ctx, params.revisionId ?? "", "pdf");
    return new Response(Buffer.from(file.bytes), {
      headers: {
        "content-type": file.contentType,
        "content-disposition": `inline; filename="${file.fileName}"`,
        "content-length": String(file.bytes.length),
        ...inlineFileHeaders(),
        etag: `"${file.sha256}"`,
        "cache-control": "private, no-store",
      },
    });
  },
});
