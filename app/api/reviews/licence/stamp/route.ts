import { NextResponse } from "next/server";
import { env } from "@/lib/env";
import { defineRoute } from "@/lib/http";
import { uploadStampImage } from "@/lib/services/reviews";
import { requirePermission } from "@/lib/services/context";
import { formatBytes } from "@/lib/uploads/format-bytes";
import { BodyTooLargeError, readFormDataLimited } from "@/lib/uploads/limited-body";

/** Room for the multipart boundaries around the image. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

function refusal(status: number, message: string, reason: string) {
  return NextResponse.json({ error: message, code: "upload-refused", reason, issues: [] }, { status });
}

/** The reviewer's stamp image, one PNG or JPEG under "file" as multipart/form-data. */
export const POST = defineRoute({
  access: "user",
  // Who may keep a stamp is known before a byte of the body is read.
  permission: "licence:edit-own",
  stream: true,
  get maxBytes() {
    return env().UPLOAD_MAX_BYTES + MULTIPART_OVERHEAD_BYTES;
  },
  run: async ({ ctx, request, maxBytes: bodyLimit }) => {
    requirePermission(ctx, "attachment:upload", "attach files");
    const maxBytes = env().UPLOAD_MAX_BYTES;
    if (!(request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data")) {
      return refusal(400, "Send the stamp image as multipart/form-data under “file”.", "missing-field");
    }
    let form: FormData;
    try {
      form = await readFormDataLimited(request, bodyLimit);
    } catch (error) {
      if (error instanceof BodyTooLargeError) return refusal(413, `The image is larger than the largest file accepted, ${formatBytes(maxBytes)}.`, "too-large");
      return refusal(400, "The upload arrived incomplete and could not be read. Try again.", "missing-field");
    }
    const file = form.get("file");
    if (!(file instanceof File)) return refusal(400, "No file was sent: choose your stamp image.", "missing-field");
    if (file.size > maxBytes) return refusal(413, `“${file.name}” is ${formatBytes(file.size)}; the largest file accepted is ${formatBytes(maxBytes)}.`, "too-large");
    const licence = await uploadStampImage(ctx, { fileName: file.name, bytes: new Uint8Array(await file.arrayBuffer()) }, { maxBytes });
    return NextResponse.json({ licence, message: `Stamp image “${licence.stamp?.fileName ?? file.name}” saved.` }, { status: 201 });
  },
});
