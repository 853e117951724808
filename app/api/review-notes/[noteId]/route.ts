import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { respondToNote } from "@/lib/services/reviews/note-thread";

/** One step in a review note's conversation: { action: reply | addressed | closed | reopened, body?, seen? }. */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ noteId: string }> }) => {
  const ctx = await requireContext();
  const { noteId } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const input = typeof body.body === "object" && body.body !== null ? body.body : {};
  return NextResponse.json(respondToNote(ctx, { ...input, noteId }));
});
