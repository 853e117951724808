import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { getSubmission } from "@/lib/services/submissions";

export const GET = defineRoute({
  access: "user",
  run: ({ ctx, params }) => NextResponse.json({ submission: getSubmission(ctx, params.id ?? "") }),
});
