import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { pageRequestFrom } from "@/lib/services/page";
import { listSubmissions } from "@/lib/services/revisions/queues";
import { createSubmission } from "@/lib/services/submissions";

/** One page: { submissions, nextCursor }; pass ?cursor=nextCursor for the next (and ?limit= up to 200). */
export const GET = handle(async (request: Request) => {
  const ctx = await requireContext();
  const page = listSubmissions(ctx, pageRequestFrom(request.url));
  return NextResponse.json({ submissions: page.rows, nextCursor: page.nextCursor });
});

/** Submits an approved revision: { revisionId, method, referenceNumber?, occurredOn, note? }. */
export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  return NextResponse.json(await createSubmission(ctx, body.body), { status: 201 });
});
