import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { pageRequestFrom } from "@/lib/services/page";
import { createProject } from "@/lib/services/projects/create";
import { listProjects } from "@/lib/services/projects/list";
import { projectListQueryFrom } from "@/lib/schemas/project-list";

/**
 * One page: { projects, nextCursor }; pass ?cursor=nextCursor for the next (and ?limit= up to 200).
 * Narrowed by ?q= (name, client, address, equipment tag), ?status=, ?jurisdiction=, ?kind=, ?archived=1; ?sort=name.
 */
export const GET = handle(async (request: Request) => {
  const ctx = await requireContext();
  const page = listProjects(ctx, pageRequestFrom(request.url), projectListQueryFrom(new URL(request.url).searchParams));
  return NextResponse.json({ projects: page.rows, nextCursor: page.nextCursor });
});

export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  return NextResponse.json(createProject(ctx, body.body), { status: 201 });
});
