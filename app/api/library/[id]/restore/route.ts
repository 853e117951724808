import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { optionalVersionSchema } from "@/lib/schemas/edges";
import { restoreLibraryItem } from "@/lib/services/library/restore";

/** POST /api/library/<id>/restore, optionally with { version } → the item, back in the picker. A body left out means "whatever version is current". */
export const POST = defineRoute({
  access: "user",
  permission: "library:edit",
  json: optionalVersionSchema,
  optional: true,
  maxBytes: 4 * 1024,
  run: ({ ctx, params, body }) => NextResponse.json({ item: restoreLibraryItem(ctx, params.id ?? "", body.version) }),
});
