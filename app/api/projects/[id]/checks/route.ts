import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { editionParam } from "@/lib/schemas/edition-param";
import { checkProject } from "@/lib/services/projects/check-project";

export const GET = defineRoute({
  access: "user",
  run: ({ ctx, request, params }) => {
    const edition = editionParam(request.url);
    if (!edition.ok) return NextResponse.json({ error: edition.message, code: "invalid", issues: [{ path: "edition", message: edition.message }] }, { status: 400 });
    return NextResponse.json(checkProject(ctx, params.id ?? "", edition.edition));
  },
});
