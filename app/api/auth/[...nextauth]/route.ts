import type { NextRequest } from "next/server";
import { handlers } from "../../../../auth";
import { defineRoute } from "@/lib/http";

/** Sign-in and sign-out: public by nature; the framework reads its own body and keeps its own CSRF token, and the origin is checked here too. */
export const GET = defineRoute({ access: "public", run: ({ request }) => handlers.GET(request as NextRequest) });
export const POST = defineRoute({ access: "public", stream: true, maxBytes: 16 * 1024, run: ({ request }) => handlers.POST(request as NextRequest) });
