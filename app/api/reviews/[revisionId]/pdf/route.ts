import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { getRevisionFile } from "@/lib/services/revisions";
import { inlineFileHeaders } from "@/lib/security-headers";

/**
 * The revision's PDF shown inline, for the reviewer's reading frame: the same
 * bytes, checked against the same SHA-256, as the download route serves.
 */
export const GET = handle(async (_request: Request, { params }: { params: Promise<{ revisionId: string }> }) => {
  const ctx = await requireContext();
  const { revisionId } = await params;
  const file = await getRevisionFile(ctx, revisionId, "pdf");
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
});
