import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { projectTemplateFromProjectSchema } from "@/lib/schemas/edges";
import { listTemplates } from "@/lib/services/templates/list";
import { saveTemplateFromProject } from "@/lib/services/templates/save";

export const GET = defineRoute({
  access: "user",
  run: ({ ctx }) => NextResponse.json({ templates: listTemplates(ctx) }),
});

/** Saves a project's design as a template: a new one, or in place of `replaceTemplateId`. */
export const POST = defineRoute({
  access: "user",
  json: projectTemplateFromProjectSchema,
  run: ({ ctx, body }) => {
    const { projectId, ...input } = body;
    const saved = saveTemplateFromProject(ctx, projectId, input);
    return NextResponse.json(saved, { status: saved.replaced ? 200 : 201 });
  },
});
