import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { importLibraryCsv, MAX_CSV_BYTES } from "@/lib/services/library/import-csv";
import { invalid } from "@/lib/services/errors";

/**
 * POST /api/library/import with the CSV as the body (text/csv) or as the
 * `file` field of a multipart form → the row-by-row report.
 */
export const POST = handle(async (request: Request) => {
  const ctx = await requireContext();
  const declared = Number(request.headers.get("content-length") ?? 0);
  // Multipart framing adds a little; refuse clearly oversized bodies before reading them.
  if (declared > MAX_CSV_BYTES + 64 * 1024) throw invalid(`The file is larger than ${MAX_CSV_BYTES / 1024 / 1024} MB; split it and import the parts. Nothing was added.`);
  const type = request.headers.get("content-type") ?? "";
  let text: string;
  if (type.startsWith("multipart/form-data")) {
    const form = await request.formData();
    const file = form.get("file");
    if (!(file instanceof File)) throw invalid("Choose a CSV file to import.", [{ path: "file", message: "is required" }]);
    text = await file.text();
  } else {
    text = await request.text();
  }
  if (text.trim() === "") throw invalid("The file is empty: the first row must name the columns.", [{ path: "file", message: "is empty" }]);
  return NextResponse.json(importLibraryCsv(ctx, text));
});
