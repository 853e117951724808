import { NextResponse } from "next/server";
import { z } from "zod";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson, zodErrorResponse } from "@/lib/http";
import { listTemplates } from "@/lib/services/templates/list";
import { saveTemplateFromProject } from "@/lib/services/templates/save";

export const GET = handle(async () => {
  const ctx = await requireContext();
  return NextResponse.json({ templates: listTemplates(ctx) });
});

const fromProject = z.object({
  projectId: z.string({ error: "the project to save from is required" }).min(1),
  name: z.unknown().optional(),
  description: z.unknown().optional(),
  replaceTemplateId: z.string().optional(),
  expectedVersion: z.number().int().optional(),
});

/** Saves a project's design as a template: a new one, or in place of `replaceTemplateId`. */
export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = fromProject.safeParse(body.body);
  if (!parsed.success) return zodErrorResponse(parsed.error);
  const { projectId, ...input } = parsed.data;
  const saved = saveTemplateFromProject(ctx, projectId, input);
  return NextResponse.json(saved, { status: saved.replaced ? 200 : 201 });
});
