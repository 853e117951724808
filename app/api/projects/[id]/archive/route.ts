import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { archiveProject, restoreProject } from "@/lib/services/projects/archive";

type Params = { params: Promise<{ id: string }> };

/** Archives the project. */
export const POST = handle(async (_request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  return NextResponse.json(archiveProject(ctx, id));
});

/** Brings it back from the archive. */
export const DELETE = handle(async (_request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  restoreProject(ctx, id);
  return NextResponse.json({ archivedAt: null });
});
