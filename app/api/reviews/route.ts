import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { invalid } from "@/lib/services/errors";
import { listProjectReviews, listRevisionReviews } from "@/lib/services/reviews";

/** Review decisions with their notes: `?projectId=` for a project's revisions, `?revisionId=` for one revision. */
export const GET = defineRoute({
  access: "user",
  run: ({ ctx, request }) => {
    const url = new URL(request.url);
    const projectId = url.searchParams.get("projectId");
    const revisionId = url.searchParams.get("revisionId");
    if (!projectId && !revisionId) throw invalid("Name a projectId or a revisionId.");
    const reviews = revisionId ? listRevisionReviews(ctx, revisionId) : listProjectReviews(ctx, projectId!);
    return NextResponse.json({ reviews }, { headers: { "cache-control": "no-store" } });
  },
});
