import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { LABEL_STOCKS, renderLabelSheet, type LabelStockName } from "@/lib/labels";
import { getApprovedSet } from "@/lib/services/install/approved-set";
import { inlineFileHeaders } from "@/lib/security-headers";

/** The approved set's labels as a printable PDF: `?stock=` one of LABEL_STOCKS; `?only=<label id>` for one label. */
export const GET = defineRoute({
  access: "user",
  run: async ({ ctx, request, params }) => {
    const url = new URL(request.url);
    const stock = (url.searchParams.get("stock") ?? "sheet-letter") as LabelStockName;
    if (!Object.hasOwn(LABEL_STOCKS, stock)) {
      return NextResponse.json({ error: `stock must be one of ${Object.keys(LABEL_STOCKS).join(", ")}`, code: "invalid", issues: [] }, { status: 400 });
    }
    const set = getApprovedSet(ctx, params.revisionId ?? "");
    const only = url.searchParams.get("only");
    const labels = only ? set.labels.filter((l) => l.id === only) : set.labels;
    if (labels.length === 0) return NextResponse.json({ error: "No such label in this approved set.", code: "not-found", issues: [] }, { status: 404 });
    const sheet = await renderLabelSheet(labels, { stock });
    const name = `${set.projectName.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").toLowerCase()}-rev${set.revisionNumber}-labels-${stock}.pdf`;
    return new NextResponse(Buffer.from(sheet.bytes), {
      headers: { "content-type": "application/pdf", "content-disposition": `inline; filename="${name}"`, ...inlineFileHeaders() },
    });
  },
});
