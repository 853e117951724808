import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { editionParam } from "@/lib/schemas/edition-param";
import { checkProject } from "@/lib/services/projects/check-project";

export const GET = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const edition = editionParam(request.url);
  if (!edition.ok) return NextResponse.json({ error: edition.message, code: "invalid", issues: [{ path: "edition", message: edition.message }] }, { status: 400 });
  const { id } = await params;
  return NextResponse.json(checkProject(ctx, id, edition.edition));
});
