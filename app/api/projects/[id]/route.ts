import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { projectSaveSchema } from "@/lib/schemas/edges";
import { getProjectRecord } from "@/lib/services/projects/get-record";
import { saveProjectRecord } from "@/lib/services/projects/save-record";

export const GET = defineRoute({
  access: "user",
  run: ({ ctx, params }) => {
    const stored = getProjectRecord(ctx, params.id ?? "");
    return NextResponse.json({ projectId: stored.projectId, version: stored.version, status: stored.status, record: stored.record });
  },
});

/** Saves the whole record; a save from a stale version answers 409 and changes nothing. */
export const PUT = defineRoute({
  access: "user",
  permission: "project:edit",
  json: projectSaveSchema,
  run: ({ ctx, params, body }) => NextResponse.json(saveProjectRecord(ctx, params.id ?? "", body.record, body.version)),
});
