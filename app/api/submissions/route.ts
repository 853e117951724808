import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { pageRequestFrom } from "@/lib/services/page";
import { listSubmissions } from "@/lib/services/revisions/queues";

/**
 * One page: { submissions, nextCursor }; pass ?cursor=nextCursor for the next (and ?limit= up to 200).
 * Submissions and their events are written only by the office's forms (app/(app)/submissions/actions.ts).
 */
export const GET = defineRoute({
  access: "user",
  run: ({ ctx, request }) => {
    const page = listSubmissions(ctx, pageRequestFrom(request.url));
    return NextResponse.json({ submissions: page.rows, nextCursor: page.nextCursor });
  },
});
