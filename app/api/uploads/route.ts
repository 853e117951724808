import { NextResponse } from "next/server";
import { env } from "@/lib/env";
import { defineRoute } from "@/lib/http";
import { uploadAttachment } from "@/lib/services/attachments";
import { formatBytes } from "@/lib/uploads/format-bytes";
import { BodyTooLargeError, readFormDataLimited } from "@/lib/uploads/limited-body";

/** Room for the multipart boundaries and the text fields around the file. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;
/** Next.js's default proxyClientMaxBodySize (10 MB). */
const PROXY_BODY_BYTES = 10 * 1024 * 1024;

function refusal(status: number, message: string, reason: string) {
  return NextResponse.json({ error: message, code: "upload-refused", reason, issues: [] }, { status });
}

const tooLarge = () => refusal(413, `The file is larger than the largest accepted, ${formatBytes(env().UPLOAD_MAX_BYTES)}. Reduce it or split it.`, "too-large");

/**
 * One file per request, as multipart/form-data from the uploader: the file
 * under "file" (or "files[]"), and fields projectId, kind, equipmentTag.
 */
export const POST = defineRoute({
  access: "user",
  // Who may upload is known before a byte of the body is read.
  permission: "attachment:upload",
  stream: true,
  get maxBytes() {
    return env().UPLOAD_MAX_BYTES + MULTIPART_OVERHEAD_BYTES;
  },
  run: async ({ ctx, request, maxBytes: bodyLimit }) => {
    const maxBytes = env().UPLOAD_MAX_BYTES;
    if (!(request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data")) {
      return refusal(400, "Send the file as multipart/form-data, with fields projectId, kind and equipmentTag.", "missing-field");
    }
    let form: FormData;
    try {
      form = await readFormDataLimited(request, bodyLimit);
    } catch (error) {
      if (error instanceof BodyTooLargeError) return tooLarge();
      // The proxy buffers at most PROXY_BODY_BYTES of a request body by default (next.config proxyClientMaxBodySize).
      const declared = Number(request.headers.get("content-length"));
      const hint = Number.isFinite(declared) && declared > PROXY_BODY_BYTES ? " If it fails again for files over 10 MB, tell your administrator: the server reads less of a request than the upload limit allows." : "";
      return refusal(400, `The upload arrived incomplete and could not be read. Try again.${hint}`, "missing-field");
    }
    const file = form.get("file") ?? form.get("files[]");
    if (!(file instanceof File)) return refusal(400, "No file was sent: choose a file to upload.", "missing-field");
    if (file.size > maxBytes) {
      return refusal(413, `“${file.name}” is ${formatBytes(file.size)}; the largest file accepted is ${formatBytes(maxBytes)}. Reduce it or split it.`, "too-large");
    }
    const text = (name: string) => {
      const v = form.get(name);
      return typeof v === "string" ? v : undefined;
    };
    const result = await uploadAttachment(
      ctx,
      { projectId: text("projectId"), kind: text("kind"), equipmentTag: text("equipmentTag"), fileName: file.name, bytes: new Uint8Array(await file.arrayBuffer()) },
      { maxBytes },
    );
    return NextResponse.json({ ...result, url: result.attachment.downloadUrl }, { status: result.duplicate ? 200 : 201 });
  },
});
