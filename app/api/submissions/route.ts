import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { listSubmissions } from "@/lib/services/revisions/queues";
import { createSubmission } from "@/lib/services/submissions";

export const GET = handle(async () => {
  const ctx = await requireContext();
  return NextResponse.json({ submissions: listSubmissions(ctx) });
});

/** Submits an approved revision: { revisionId, method, referenceNumber?, occurredOn, note? }. */
export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  return NextResponse.json(await createSubmission(ctx, body.body), { status: 201 });
});
