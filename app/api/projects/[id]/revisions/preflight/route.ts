import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { preflightPacket } from "@/lib/services/revisions";

/** What a packet generated now would lack: missing documents, failing checks, incomplete labels. */
export const GET = handle(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  return NextResponse.json(preflightPacket(ctx, id), { headers: { "cache-control": "no-store" } });
});
