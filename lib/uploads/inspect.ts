import { PDFDocument } from "pdf-lib";
import { describeAccepted, KIND_RULES, type AttachmentKind } from "./kinds";
import { formatBytes } from "./format-bytes";
import { checkImagePixels, MAX_IMAGE_PIXELS } from "./image-size";
import { measureInflatedPdf, PDF_MAX_INFLATED_BYTES } from "./pdf-inflate";
import { UploadRefusedError } from "./refusal";
import { findPdfHeader, sniffContent, type AcceptedContent } from "./sniff";

export interface InspectOptions {
  fileName: string;
  maxBytes: number;
  /** When given, the content must suit the kind (a datasheet must be a PDF). */
  kind?: AttachmentKind;
  /** Bounds on what the file may expand to when read; the defaults suit packets. */
  maxInflatedBytes?: number;
  maxPixels?: number;
}

export interface InspectedUpload {
  content: AcceptedContent;
  sizeBytes: number;
  /** Pages of a PDF; null for images, which are drawn onto a sheet. */
  pageCount: number | null;
}

/** Acrobat looks for %%EOF in the last 1024 bytes (ISO 32000-1 Annex H, implementation note); a missing one means a cut-short file. */
const PDF_EOF_WINDOW = 1024;
const ACCEPTED_EXTENSIONS = ["pdf", "png", "jpg", "jpeg", "jpe", "jfif"];

/**
 * Checks an upload by its content and answers what it is, or throws an
 * UploadRefusedError whose message can be shown to the uploader as is.
 */
export async function inspectUpload(bytes: Uint8Array, options: InspectOptions): Promise<InspectedUpload> {
  const name = quoteName(options.fileName);
  if (bytes.length === 0) throw new UploadRefusedError("empty", `${name} is empty (0 bytes). Choose the file again.`);
  if (bytes.length > options.maxBytes) {
    throw new UploadRefusedError(
      "too-large",
      `${name} is ${formatBytes(bytes.length)}; the largest file accepted is ${formatBytes(options.maxBytes)}. Reduce it (for a scan, a lower resolution) or split it.`,
    );
  }

  const sniffed = sniffContent(bytes);
  if (!sniffed.accepted) {
    const claimed = extensionOf(options.fileName);
    const named = claimed && ACCEPTED_EXTENSIONS.includes(claimed) ? ` It is named .${claimed}, but its content is ${sniffed.label}.` : ` Its content is ${sniffed.label}.`;
    throw new UploadRefusedError("unsupported-type", `${name} was not accepted: only PDF, PNG and JPEG files are.${named}${sniffed.hint ? " " + sniffed.hint : ""}`);
  }
  const { content } = sniffed;

  if (options.kind) {
    const rule = KIND_RULES[options.kind];
    if (!rule.accepts.includes(content.mimeType)) {
      const claimed = extensionOf(options.fileName);
      const renamed = claimed && !extensionsFor(content).includes(claimed) ? `, though it is named .${claimed}` : "";
      throw new UploadRefusedError(
        "wrong-kind",
        `${name} is a ${content.label}${renamed}; a ${rule.label.toLowerCase()} must be ${describeAccepted(options.kind)}.`,
      );
    }
  }

  if (content.mimeType === "application/pdf") {
    const pageCount = await inspectPdf(bytes, name, options.maxInflatedBytes ?? PDF_MAX_INFLATED_BYTES);
    return { content, sizeBytes: bytes.length, pageCount };
  }
  await inspectImage(bytes, content, name, options.maxPixels ?? MAX_IMAGE_PIXELS);
  return { content, sizeBytes: bytes.length, pageCount: null };
}

async function inspectPdf(bytes: Uint8Array, name: string, maxInflatedBytes: number): Promise<number> {
  const header = findPdfHeader(bytes);
  if (header < 0) throw new UploadRefusedError("corrupt", `${name} has no PDF header.`);
  if (!hasEofMarker(bytes)) {
    throw new UploadRefusedError("corrupt", `${name} is damaged: it ends before the PDF's end marker, so it was probably cut short. Download or export it again.`);
  }
  // Checked on the raw bytes first: an encrypted file may not parse far enough for the trailer to be read.
  if (hasEncryptEntry(bytes)) throw encryptedRefusal(name);
  // Measured before pdf-lib reads the file: loading inflates every object stream in memory.
  const inflated = await measureInflatedPdf(bytes, maxInflatedBytes);
  if (inflated.overCap) {
    throw new UploadRefusedError(
      "inflates-too-large",
      `${name} expands to more than ${formatBytes(maxInflatedBytes)} when read, far more than a datasheet or drawing needs. Print it to a new PDF (or export it with images compressed as JPEG) and upload that.`,
    );
  }

  let doc: PDFDocument;
  try {
    doc = await PDFDocument.load(bytes, { ignoreEncryption: true, throwOnInvalidObject: true, updateMetadata: false });
  } catch {
    throw new UploadRefusedError("corrupt", `${name} is damaged and could not be read as a PDF. Export or download it again.`);
  }
  if (doc.isEncrypted) throw encryptedRefusal(name);

  let pageCount: number;
  try {
    pageCount = doc.getPageCount();
    // The packet merges datasheets page by page; a file whose pages cannot be copied would fail there instead.
    const probe = await PDFDocument.create({ updateMetadata: false });
    await probe.copyPages(doc, doc.getPageIndices());
  } catch {
    throw new UploadRefusedError("corrupt", `${name} is damaged: its pages could not be read. Export or download it again.`);
  }
  if (pageCount === 0) throw new UploadRefusedError("corrupt", `${name} has no pages.`);
  return pageCount;
}

async function inspectImage(bytes: Uint8Array, content: AcceptedContent, name: string, maxPixels: number): Promise<void> {
  // From the header, before anything decodes it: pdf-lib turns a PNG into RGBA in memory.
  const pixels = checkImagePixels(bytes, content.mimeType === "image/png" ? "png" : "jpeg", maxPixels);
  if (!pixels.ok && pixels.reason === "too-many-pixels" && pixels.size) {
    throw new UploadRefusedError(
      "too-many-pixels",
      `${name} is ${pixels.size.width} × ${pixels.size.height} px; images are accepted up to ${Math.round(maxPixels / 1e6)} megapixels. Save it at a lower resolution (300 dpi is plenty for print) and upload that.`,
    );
  }
  if (!pixels.ok) throw new UploadRefusedError("corrupt", `${name} is a damaged ${content.label}: its size could not be read. Save it again and upload the new copy.`);
  // The packet draws images with pdf-lib; an image it cannot embed is refused now rather than at generation.
  try {
    const probe = await PDFDocument.create({ updateMetadata: false });
    if (content.mimeType === "image/png") await probe.embedPng(bytes);
    else await probe.embedJpg(bytes);
  } catch {
    throw new UploadRefusedError("corrupt", `${name} is a damaged ${content.label} and could not be read. Save it again and upload the new copy.`);
  }
}

export function hasEofMarker(bytes: Uint8Array): boolean {
  const tail = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).subarray(Math.max(0, bytes.length - PDF_EOF_WINDOW));
  return tail.includes("%%EOF", 0, "latin1");
}

/**
 * An /Encrypt entry in a trailer or cross-reference stream dictionary (ISO
 * 32000-1 §7.5.5, §7.6.1): a reference "n g R" or an inline dictionary.
 */
export function hasEncryptEntry(bytes: Uint8Array): boolean {
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let at = buf.indexOf("/Encrypt", 0, "latin1");
  while (at >= 0) {
    const after = buf.subarray(at + 8, at + 40).toString("latin1");
    if (/^\s*(\d+\s+\d+\s+R|<<)/.test(after)) return true;
    at = buf.indexOf("/Encrypt", at + 8, "latin1");
  }
  return false;
}

function encryptedRefusal(name: string): UploadRefusedError {
  return new UploadRefusedError(
    "encrypted",
    `${name} is password-protected or encrypted, so it cannot be merged into a packet. Save or print an unprotected copy to PDF and upload that.`,
  );
}

function extensionsFor(content: AcceptedContent): string[] {
  return content.extension === "jpg" ? ["jpg", "jpeg", "jpe", "jfif"] : [content.extension];
}

function extensionOf(fileName: string): string | null {
  const match = /\.([A-Za-z0-9]{1,8})$/.exec(fileName.trim());
  return match ? match[1]!.toLowerCase() : null;
}

function quoteName(fileName: string): string {
  return `“${fileName.trim() || "The file"}”`;
}
