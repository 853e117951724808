import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";

export const GET = defineRoute({ access: "public", run: () => NextResponse.json({ ok: true }) });
