import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { getSubmission } from "@/lib/services/submissions";

export const GET = handle(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  return NextResponse.json({ submission: getSubmission(ctx, id) });
});
