import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { jsonObjectSchema } from "@/lib/schemas/edges";
import { pageRequestFrom } from "@/lib/services/page";
import { createProject } from "@/lib/services/projects/create";
import { listProjects } from "@/lib/services/projects/list";
import { projectListQueryFrom } from "@/lib/schemas/project-list";

/**
 * One page: { projects, nextCursor }; pass ?cursor=nextCursor for the next (and ?limit= up to 200).
 * Narrowed by ?q= (name, client, address, equipment tag), ?status=, ?jurisdiction=, ?kind=, ?archived=1; ?sort=name.
 */
export const GET = defineRoute({
  access: "user",
  run: ({ ctx, request }) => {
    const page = listProjects(ctx, pageRequestFrom(request.url), projectListQueryFrom(new URL(request.url).searchParams));
    return NextResponse.json({ projects: page.rows, nextCursor: page.nextCursor });
  },
});

export const POST = defineRoute({
  access: "user",
  permission: "project:create",
  json: jsonObjectSchema,
  run: ({ ctx, body }) => NextResponse.json(createProject(ctx, body), { status: 201 }),
});
