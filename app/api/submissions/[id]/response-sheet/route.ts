import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { correctionResponseSheet } from "@/lib/services/corrections";
import { inlineFileHeaders } from "@/lib/security-headers";

/** The response sheet for a resubmittal: each of the AHJ's comments with its response, as a PDF. */
export const GET = defineRoute({
  access: "user",
  run: async ({ ctx, params }) => {
    const sheet = await correctionResponseSheet(ctx, params.id ?? "");
    return new NextResponse(Buffer.from(sheet.bytes), {
      headers: { "content-type": "application/pdf", "content-disposition": `inline; filename="${sheet.fileName}"`, ...inlineFileHeaders() },
    });
  },
});
