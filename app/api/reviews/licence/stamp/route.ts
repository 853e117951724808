import { NextResponse } from "next/server";
import { requireContext } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { errorResponse } from "@/lib/http";
import { uploadStampImage, UploadRefusedError } from "@/lib/services/reviews";
import { formatBytes } from "@/lib/uploads/format-bytes";

function refusal(status: number, message: string, reason: string) {
  return NextResponse.json({ error: message, code: "upload-refused", reason, issues: [] }, { status });
}

/** The reviewer's stamp image, one PNG or JPEG under "file" as multipart/form-data. */
export async function POST(request: Request): Promise<Response> {
  try {
    const ctx = await requireContext();
    const maxBytes = env().UPLOAD_MAX_BYTES;
    if (!(request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data")) {
      return refusal(400, "Send the stamp image as multipart/form-data under “file”.", "missing-field");
    }
    let form: FormData;
    try {
      form = await request.formData();
    } catch {
      return refusal(400, "The upload arrived incomplete and could not be read. Try again.", "missing-field");
    }
    const file = form.get("file");
    if (!(file instanceof File)) return refusal(400, "No file was sent: choose your stamp image.", "missing-field");
    if (file.size > maxBytes) return refusal(413, `“${file.name}” is ${formatBytes(file.size)}; the largest file accepted is ${formatBytes(maxBytes)}.`, "too-large");
    const licence = await uploadStampImage(ctx, { fileName: file.name, bytes: new Uint8Array(await file.arrayBuffer()) }, { maxBytes });
    return NextResponse.json({ licence, message: `Stamp image “${licence.stamp?.fileName ?? file.name}” saved.` }, { status: 201 });
  } catch (error) {
    if (error instanceof UploadRefusedError) return refusal(error.httpStatus, error.message, error.reason);
    return errorResponse(error);
  }
}
