import { NextResponse } from "next/server";
import { z } from "zod";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson, zodErrorResponse } from "@/lib/http";
import { deleteTemplate, renameTemplate } from "@/lib/services/templates/save";

type Params = { params: Promise<{ id: string }> };

const renameBody = z.object({
  version: z.number({ error: "the version you opened is required" }).int(),
  name: z.unknown(),
  description: z.unknown().optional(),
});

export const PATCH = handle(async (request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = renameBody.safeParse(body.body);
  if (!parsed.success) return zodErrorResponse(parsed.error);
  return NextResponse.json(renameTemplate(ctx, id, { name: parsed.data.name, description: parsed.data.description }, parsed.data.version));
});

export const DELETE = handle(async (_request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  deleteTemplate(ctx, id);
  return new NextResponse(null, { status: 204 });
});
