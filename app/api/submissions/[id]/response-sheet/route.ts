import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { correctionResponseSheet } from "@/lib/services/corrections";
import { inlineFileHeaders } from "@/lib/security-headers";

/** The response sheet for a resubmittal: each of the AHJ's comments with its response, as a PDF. */
export const GET = handle(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const sheet = await correctionResponseSheet(ctx, id);
  return new NextResponse(Buffer.from(sheet.bytes), {
    headers: { "content-type": "application/pdf", "content-disposition": `inline; filename="${sheet.fileName}"`, ...inlineFileHeaders() },
  });
});
