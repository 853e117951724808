import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { getRevisionFile } from "@/lib/services/revisions";
import { inlineFileHeaders } from "@/lib/security-headers";

export const GET = handle(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const file = await getRevisionFile(ctx, id, "pdf");
  return new Response(Buffer.from(file.bytes), {
    headers: {
      "content-type": file.contentType,
      "content-disposition": `attachment; filename="${file.fileName}"`,
      "content-length": String(file.bytes.length),
      ...inlineFileHeaders(),
      etag: `"${file.sha256}"`,
      "cache-control": "private, no-store",
    },
  });
});
