import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { createLibraryItem } from "@/lib/services/library/create";
import { listLibraryItems } from "@/lib/services/library/list";

/** GET /api/library?kind=<kind>[,<kind>…]&includeRetired=0|1 → { items }; the project editor's picker reads this. */
export const GET = handle(async (request: Request) => {
  const ctx = await requireContext();
  const url = new URL(request.url);
  const kind = url.searchParams.get("kind") ?? undefined;
  const includeRetired = url.searchParams.get("includeRetired") === "1";
  return NextResponse.json({ items: listLibraryItems(ctx, { kind, includeRetired }) });
});

/** POST /api/library with the item (kind, manufacturer, model and its ratings) → the stored item. */
export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  return NextResponse.json({ item: createLibraryItem(ctx, body.body) }, { status: 201 });
});
