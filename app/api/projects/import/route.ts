import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { projectImportSchema } from "@/lib/schemas/edges";
import { importProject } from "@/lib/services/projects/import";

/** Imports a project file as a new project: `{ file: <project file JSON>, jurisdictionId? }`. */
export const POST = defineRoute({
  access: "user",
  permission: "project:create",
  json: projectImportSchema,
  run: ({ ctx, body }) => NextResponse.json(importProject(ctx, body.file, body.jurisdictionId), { status: 201 }),
});
