import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { getLibraryItem } from "@/lib/services/library/get";
import { updateLibraryItem } from "@/lib/services/library/update";
import { versionedBody } from "../versioned-body";

type Params = { params: Promise<{ id: string }> };

export const GET = handle(async (_request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  return NextResponse.json({ item: getLibraryItem(ctx, id) });
});

/** PATCH /api/library/<id> with { version, item } → the stored item; a stale version answers 409. */
export const PATCH = handle(async (request: Request, { params }: Params) => {
  const ctx = await requireContext();
  const { id } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const { version, item } = versionedBody(body.body);
  return NextResponse.json({ item: updateLibraryItem(ctx, id, item, version ?? Number.NaN) });
});
