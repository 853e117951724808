import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { preflightPacket } from "@/lib/services/revisions";

/** What a packet generated now would lack: missing documents, failing checks, incomplete labels. */
export const GET = defineRoute({
  access: "user",
  run: ({ ctx, params }) => NextResponse.json(preflightPacket(ctx, params.id ?? ""), { headers: { "cache-control": "no-store" } }),
});
