import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { retireLibraryItem } from "@/lib/services/library/retire";
import { versionedBody } from "../../versioned-body";

/** POST /api/library/<id>/retire, optionally with { version } → the item, out of the picker but still readable. */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const { version } = versionedBody(await request.json().catch(() => ({})));
  return NextResponse.json({ item: retireLibraryItem(ctx, id, version) });
});
