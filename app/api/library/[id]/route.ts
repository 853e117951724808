import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { versionedItemSchema } from "@/lib/schemas/edges";
import { getLibraryItem } from "@/lib/services/library/get";
import { updateLibraryItem } from "@/lib/services/library/update";

export const GET = defineRoute({
  access: "user",
  run: ({ ctx, params }) => NextResponse.json({ item: getLibraryItem(ctx, params.id ?? "") }),
});

/** PATCH /api/library/<id> with { version, item } → the stored item; a stale version answers 409. */
export const PATCH = defineRoute({
  access: "user",
  permission: "library:edit",
  json: versionedItemSchema,
  run: ({ ctx, params, body }) => NextResponse.json({ item: updateLibraryItem(ctx, params.id ?? "", body.item, body.version ?? Number.NaN) }),
});
