import { NextResponse } from "next/server";
import { defineRoute } from "@/lib/http";
import { importLibraryCsv, MAX_CSV_BYTES } from "@/lib/services/library/import-csv";
import { invalid, tooLarge as bodyTooLarge } from "@/lib/services/errors";
import { BodyTooLargeError, readFormDataLimited, readTextLimited } from "@/lib/uploads/limited-body";

/** Multipart framing around the file. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

/**
 * POST /api/library/import with the CSV as the body (text/csv) or as the
 * `file` field of a multipart form → the row-by-row report.
 */
export const POST = defineRoute({
  access: "user",
  // Who may import is known before the body is read; the size is counted as it arrives.
  permission: "library:edit",
  stream: true,
  maxBytes: MAX_CSV_BYTES + MULTIPART_OVERHEAD_BYTES,
  run: async ({ ctx, request }) => {
    const tooLarge = () => bodyTooLarge(`The file is larger than ${MAX_CSV_BYTES / 1024 / 1024} MB; split it and import the parts. Nothing was added.`);
    const type = request.headers.get("content-type") ?? "";
    let text: string;
    try {
      if (type.startsWith("multipart/form-data")) {
        const form = await readFormDataLimited(request, MAX_CSV_BYTES + MULTIPART_OVERHEAD_BYTES);
        const file = form.get("file");
        if (!(file instanceof File)) throw invalid("Choose a CSV file to import.", [{ path: "file", message: "is required" }]);
        text = await file.text();
      } else {
        text = await readTextLimited(request, MAX_CSV_BYTES);
      }
    } catch (error) {
      if (error instanceof BodyTooLargeError) throw tooLarge();
      if (error instanceof TypeError) throw invalid("The upload arrived incomplete and could not be read. Try again.");
      throw error;
    }
    if (text.trim() === "") throw invalid("The file is empty: the first row must name the columns.", [{ path: "file", message: "is empty" }]);
    return NextResponse.json(importLibraryCsv(ctx, text));
  },
});
