import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { voidSubmissionEvent } from "@/lib/services/submissions";

/** Voids one event recorded in error: { reason, version? }. The void is a new entry; nothing is deleted. */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ id: string; eventId: string }> }) => {
  const ctx = await requireContext();
  const { id, eventId } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const input = typeof body.body === "object" && body.body !== null ? body.body : {};
  return NextResponse.json(voidSubmissionEvent(ctx, { ...input, submissionId: id, eventId }), { status: 201 });
});
