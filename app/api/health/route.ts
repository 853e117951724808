import { NextResponse } from "next/server";
import { withApiHeaders } from "@/lib/http";

export function GET() {
  return withApiHeaders(NextResponse.json({ ok: true }));
}
