import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { jsonObjectSchema } from "@/lib/schemas/edges";
import { respondToNote } from "@/lib/services/reviews/note-thread";

/** One step in a review note's conversation: { action: reply | addressed | closed | reopened, body?, seen? }. */
export const POST = defineRoute({
  access: "user",
  json: jsonObjectSchema,
  run: ({ ctx, params, body }) => NextResponse.json(respondToNote(ctx, { ...body, noteId: params.noteId ?? "" })),
});
