import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { sendForReviewSchema } from "@/lib/schemas/edges";
import { sendForReview } from "@/lib/services/reviews";

/**
 * The designer sends a ready revision to the organisation's reviewers: { message? } (required when checks fail).
 * A body left out sends without a message (a revision without failing checks needs none).
 */
export const POST = defineRoute({
  access: "user",
  permission: "review:send",
  json: sendForReviewSchema,
  optional: true,
  run: async ({ ctx, params, body }) => NextResponse.json(await sendForReview(ctx, params.id ?? "", { message: body.message })),
});
