import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { createProject } from "@/lib/services/projects/create";
import { listProjects } from "@/lib/services/projects/list";

export const GET = handle(async () => {
  const ctx = await requireContext();
  return NextResponse.json({ projects: listProjects(ctx) });
});

export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const body = await readJson(request);
  if (!body.ok) return body.response;
  return NextResponse.json(createProject(ctx, body.body), { status: 201 });
});
