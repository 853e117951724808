import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { projectTemplateRenameSchema } from "@/lib/schemas/edges";
import { deleteTemplate, renameTemplate } from "@/lib/services/templates/save";

export const PATCH = defineRoute({
  access: "user",
  json: projectTemplateRenameSchema,
  run: ({ ctx, params, body }) => NextResponse.json(renameTemplate(ctx, params.id ?? "", { name: body.name, description: body.description }, body.version)),
});

export const DELETE = defineRoute({
  access: "user",
  run: ({ ctx, params }) => {
    deleteTemplate(ctx, params.id ?? "");
    return new NextResponse(null, { status: 204 });
  },
});
