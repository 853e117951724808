import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { restoreLibraryItem } from "@/lib/services/library/restore";
import { versionedBody } from "../../versioned-body";

/** POST /api/library/<id>/restore, optionally with { version } → the item, back in the picker. */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  // The body is optional ({ version }); a missing or malformed one means "whatever version is current".
  const body = await readJson(request, { maxBytes: 4 * 1024 });
  if (!body.ok && (body.response.status === 413 || request.headers.has("content-type"))) return body.response;
  const { version } = versionedBody(body.ok ? body.body : {});
  return NextResponse.json({ item: restoreLibraryItem(ctx, id, version) });
});
