import { NextResponse } from "next/server";
import { parseProjectFile, runChecks } from "@/lib/compliance";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { requirePermission } from "@/lib/services/context";
import { editionParam } from "@/lib/schemas/edition-param";

/** Checks a project file sent in the body; the answer is the same JSON as `npm run check -- --json`. */
export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  // Checking a record is part of designing one; it runs the engine, so only people who read projects may use it.
  requirePermission(ctx, "project:read", "run code checks");
  const edition = editionParam(request.url);
  if (!edition.ok) return NextResponse.json({ error: edition.message, code: "invalid", issues: [{ path: "edition", message: edition.message }] }, { status: 400 });
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = parseProjectFile(body.body);
  if (!parsed.ok) return NextResponse.json({ error: "The project file is not valid.", code: "invalid", issues: parsed.issues }, { status: 400 });
  return NextResponse.json(runChecks(parsed.record, edition.edition ? { edition: edition.edition } : {}));
});
