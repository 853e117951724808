import { NextResponse } from "next/server";
import { z } from "zod";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson, zodErrorResponse } from "@/lib/http";
import { getProjectRecord } from "@/lib/services/projects/get-record";
import { saveProjectRecord } from "@/lib/services/projects/save-record";

type Params = { params: Promise<{ id: string }> };

export const GET = handle(async (_request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  const stored = getProjectRecord(ctx, id);
  return NextResponse.json({ projectId: stored.projectId, version: stored.version, status: stored.status, record: stored.record });
});

const saveBody = z.object({
  version: z.number({ error: "the version you opened is required" }).int(),
  record: z.unknown(),
});

/** Saves the whole record; a save from a stale version answers 409 and changes nothing. */
export const PUT = handle(async (request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = saveBody.safeParse(body.body);
  if (!parsed.success) return zodErrorResponse(parsed.error);
  return NextResponse.json(saveProjectRecord(ctx, id, parsed.data.record, parsed.data.version));
});
