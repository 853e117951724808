import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { jsonObjectSchema } from "@/lib/schemas/edges";
import { createLibraryItem } from "@/lib/services/library/create";
import { listLibraryItems } from "@/lib/services/library/list";

/** GET /api/library?kind=<kind>[,<kind>…]&includeRetired=0|1 → { items }; the project editor's picker reads this. */
export const GET = defineRoute({
  access: "user",
  run: ({ ctx, request }) => {
    const url = new URL(request.url);
    const kind = url.searchParams.get("kind") ?? undefined;
    const includeRetired = url.searchParams.get("includeRetired") === "1";
    return NextResponse.json({ items: listLibraryItems(ctx, { kind, includeRetired }) });
  },
});

/** POST /api/library with the item (kind, manufacturer, model and its ratings) → the stored item. */
export const POST = defineRoute({
  access: "user",
  permission: "library:edit",
  json: jsonObjectSchema,
  run: ({ ctx, body }) => NextResponse.json({ item: createLibraryItem(ctx, body) }, { status: 201 }),
});
