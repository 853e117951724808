import { NextResponse } from "next/server";
import { z } from "zod";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson, zodErrorResponse } from "@/lib/http";
import { importProject } from "@/lib/services/projects/import";

const importBody = z.object({
  file: z.unknown(),
  jurisdictionId: z.string().min(1).optional(),
});

/** Imports a project file as a new project: `{ file: <project file JSON>, jurisdictionId? }`. */
export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = importBody.safeParse(body.body);
  if (!parsed.success) return zodErrorResponse(parsed.error);
  return NextResponse.json(importProject(ctx, parsed.data.file, parsed.data.jurisdictionId), { status: 201 });
});
