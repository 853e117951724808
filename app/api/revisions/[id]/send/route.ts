import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { sendForReview } from "@/lib/services/reviews";

/** The designer sends a ready revision to the organisation's reviewers. */
export const POST = handle(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  return NextResponse.json(await sendForReview(ctx, id));
});
