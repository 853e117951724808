import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { getRevisionFile } from "@/lib/services/revisions";

export const GET = handle(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const file = await getRevisionFile(ctx, id, "docx");
  return new Response(Buffer.from(file.bytes), {
    headers: {
      "content-type": file.contentType,
      "content-disposition": `attachment; filename="${file.fileName}"`,
      "content-length": String(file.bytes.length),
      etag: `"${file.sha256}"`,
      "cache-control": "private, no-store",
    },
  });
});
