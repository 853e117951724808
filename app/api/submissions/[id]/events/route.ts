import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle, readJson } from "@/lib/http";
import { recordSubmissionEvent } from "@/lib/services/submissions";

/** Appends one event, in the order the event rules allow: { kind, occurredOn, note?, permitNumber?, expiresOn?, amountUsd?, inspectionKind?, revisionId? (resubmitted), version? }. */
export const POST = handle(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const ctx = await requireContext();
  const { id } = await params;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const input = typeof body.body === "object" && body.body !== null ? body.body : {};
  return NextResponse.json(await recordSubmissionEvent(ctx, { ...input, submissionId: id }), { status: 201 });
});
