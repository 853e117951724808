import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { optionalVersionSchema } from "@/lib/schemas/edges";
import { retireLibraryItem } from "@/lib/services/library/retire";

/** POST /api/library/<id>/retire, optionally with { version } → the item, out of the picker but still readable. A body left out means "whatever version is current". */
export const POST = defineRoute({
  access: "user",
  permission: "library:edit",
  json: optionalVersionSchema,
  optional: true,
  maxBytes: 4 * 1024,
  run: ({ ctx, params, body }) => NextResponse.json({ item: retireLibraryItem(ctx, params.id ?? "", body.version) }),
});
