import { NextResponse } from "next/server";
import { parseProjectFile, runChecks } from "@/lib/compliance";
import { defineRoute } from "@/lib/http";
import { editionParam } from "@/lib/schemas/edition-param";
import { jsonObjectSchema } from "@/lib/schemas/edges";

/** Checks a project file sent in the body; the answer is the same JSON as `npm run check -- --json`. */
export const POST = defineRoute({
  access: "user",
  // Checking a record is part of designing one; it runs the engine, so only people who read projects may use it.
  permission: "project:read",
  json: jsonObjectSchema,
  run: ({ request, body }) => {
    const edition = editionParam(request.url);
    if (!edition.ok) return NextResponse.json({ error: edition.message, code: "invalid", issues: [{ path: "edition", message: edition.message }] }, { status: 400 });
    const parsed = parseProjectFile(body);
    if (!parsed.ok) return NextResponse.json({ error: "The project file is not valid.", code: "invalid", issues: parsed.issues }, { status: 400 });
    return NextResponse.json(runChecks(parsed.record, edition.edition ? { edition: edition.edition } : {}));
  },
});
