import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { listProjectRevisions, startRevision } from "@/lib/services/revisions";

export const GET = defineRoute({
  access: "user",
  run: ({ ctx, params }) => NextResponse.json({ revisions: listProjectRevisions(ctx, params.id ?? "") }, { headers: { "cache-control": "no-store" } }),
});

/** Starts a generation; the packet is rendered by a separate process, so this answers 202 at once. */
export const POST = defineRoute({
  access: "user",
  permission: "packet:generate",
  run: ({ ctx, params }) => {
    const started = startRevision(ctx, params.id ?? "");
    return NextResponse.json(
      { revisionId: started.revisionId, number: started.number, isDraft: started.isDraft, statusUrl: `/api/revisions/${started.revisionId}` },
      { status: 202, headers: { location: `/api/revisions/${started.revisionId}` } },
    );
  },
});
