import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { getRevision } from "@/lib/services/revisions";

export const GET = defineRoute({
  access: "user",
  run: ({ ctx, params }) => NextResponse.json(getRevision(ctx, params.id ?? ""), { headers: { "cache-control": "no-store" } }),
});
