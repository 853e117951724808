import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { sendForReview } from "@/lib/services/reviews";

/** The designer sends a ready revision to the organisation's reviewers: { message? } (required when checks fail). */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  let message: string | undefined;
  // An empty body sends without a message (a revision without failing checks needs none).
  if (request.headers.get("content-type")?.includes("application/json")) {
    const body = await readJson(request);
    if (!body.ok) return body.response;
    const m = (body.body as { message?: unknown } | null)?.message;
    message = typeof m === "string" ? m : undefined;
  }
  return NextResponse.json(await sendForReview(ctx, id, { message }));
});
