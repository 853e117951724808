import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { assignCorrection, reopenCorrection, resolveCorrection } from "@/lib/services/corrections";
import { promoteCorrection } from "@/lib/services/jurisdictions/notes";

/**
 * Works one correction: { action: "resolve", response } | { action: "reopen" } | { action: "assign", assigneeId },
 * each with the version read; or { action: "promote", text? } to write it into the jurisdiction's notes log.
 */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ itemId: string }> }) => {
  const ctx = await requireContext();
  const { itemId } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const input = { ...(typeof body.body === "object" && body.body !== null ? body.body : {}), itemId } as Record<string, unknown>;
  if (input.action === "resolve") return NextResponse.json(resolveCorrection(ctx, input));
  if (input.action === "reopen") return NextResponse.json(reopenCorrection(ctx, input));
  if (input.action === "assign") return NextResponse.json(assignCorrection(ctx, input));
  // Learning from it: the comment goes into its jurisdiction's notes log, with the project it came from.
  if (input.action === "promote") return NextResponse.json(promoteCorrection(ctx, input), { status: 201 });
  return NextResponse.json(
    { error: "action must be resolve, reopen, assign or promote", code: "invalid", issues: [{ path: "action", message: "must be resolve, reopen, assign or promote" }] },
    { status: 400 },
  );
});
