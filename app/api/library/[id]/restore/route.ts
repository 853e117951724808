import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { restoreLibraryItem } from "@/lib/services/library/restore";
import { versionedBody } from "../../versioned-body";

/** POST /api/library/<id>/restore, optionally with { version } → the item, back in the picker. */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const { version } = versionedBody(await request.json().catch(() => ({})));
  return NextResponse.json({ item: restoreLibraryItem(ctx, id, version) });
});
