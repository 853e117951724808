import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { archiveProject, restoreProject } from "@/lib/services/projects/archive";

/** Archives the project. */
export const POST = defineRoute({
  access: "user",
  run: ({ ctx, params }) => NextResponse.json(archiveProject(ctx, params.id ?? "")),
});

/** Brings it back from the archive. */
export const DELETE = defineRoute({
  access: "user",
  run: ({ ctx, params }) => {
    restoreProject(ctx, params.id ?? "");
    return NextResponse.json({ archivedAt: null });
  },
});
