import { defineRoute } from "@/lib/http";
import { getRevisionFile } from "@/lib/services/revisions";
import { inlineFileHeaders } from "@/lib/security-headers";

export const GET = defineRoute({
  access: "user",
  run: async ({ ctx, params }) => {
    const file = await getRevisionFile(ctx, params.id ?? "", "pdf");
    return new Response(Buffer.from(file.bytes), {
      headers: {
        "content-type": file.contentType,
        "content-disposition": `attachment; filename="${file.fileName}"`,
        "content-length": String(file.bytes.length),
        ...inlineFileHeaders(),        etag: `"${file.sha256}"`,
        "cache-control": "private, no-store",
      },
    });
  },
});
