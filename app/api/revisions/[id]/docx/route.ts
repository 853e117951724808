import { defineRoute } from "@/lib/http";
import { getRevisionFile } from "@/lib/services/revisions";

export const GET = defineRoute({
  access: "user",
  run: async ({ ctx, params }) => {
    const file = await getRevisionFile(ctx, params.id ?? "", "docx");
    return new Response(Buffer.from(file.bytes), {
      headers: {
        "content-type": file.contentType,
        "content-disposition": `attachment; filename="${file.fileName}"`,
        "content-length": String(file.bytes.length),
        etag: `"${file.sha256}"`,
        "cache-control": "private, no-store",
      },
    });
  },
});
