import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { listProjectRevisions, startRevision } from "@/lib/services/revisions";

type Params = { params: Promise<{ id: string }> };

export const GET = handle(async (_request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  return NextResponse.json({ revisions: listProjectRevisions(ctx, id) }, { headers: { "cache-control": "no-store" } });
});

/** Starts a generation; the packet is rendered by a separate process, so this answers 202 at once. */
export const POST = handle(async (_request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  const started = startRevision(ctx, id);
  return NextResponse.json(
    { revisionId: started.revisionId, number: started.number, isDraft: started.isDraft, statusUrl: `/api/revisions/${started.revisionId}` },
    { status: 202, headers: { location: `/api/revisions/${started.revisionId}` } },
  );
});
