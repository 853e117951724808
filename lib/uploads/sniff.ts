/**
 * What a file is, from its first bytes, never from its name or the browser's
 * claim: a PNG renamed .pdf is still a PNG.
 */
export type AcceptedContent = { mimeType: "application/pdf"; extension: "pdf"; label: "PDF" }
  | { mimeType: "image/png"; extension: "png"; label: "PNG image" }
  | { mimeType: "image/jpeg"; extension: "jpg"; label: "JPEG image" };

export type SniffResult = { accepted: true; content: AcceptedContent } | { accepted: false; label: string; hint?: string };

export const PDF_CONTENT: AcceptedContent = { mimeType: "application/pdf", extension: "pdf", label: "PDF" };
export const PNG_CONTENT: AcceptedContent = { mimeType: "image/png", extension: "png", label: "PNG image" };
export const JPEG_CONTENT: AcceptedContent = { mimeType: "image/jpeg", extension: "jpg", label: "JPEG image" };

// PNG spec (ISO/IEC 15948) §5.2: the eight-byte signature.
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
// JPEG (ITU-T T.81) starts with SOI FF D8, followed by the first marker's FF.
const JPEG_SIGNATURE = [0xff, 0xd8, 0xff];
/** Readers accept the %PDF- header anywhere in the first 1024 bytes (ISO 32000-1 Annex H, implementation note). */
export const PDF_HEADER_WINDOW = 1024;

function startsWith(bytes: Uint8Array, signature: readonly number[], offset = 0): boolean {
  if (bytes.length < offset + signature.length) return false;
  return signature.every((b, i) => bytes[offset + i] === b);
}

function ascii(bytes: Uint8Array, start: number, end: number): string {
  return String.fromCharCode(...bytes.subarray(start, Math.min(end, bytes.length)));
}

export function findPdfHeader(bytes: Uint8Array): number {
  return ascii(bytes, 0, PDF_HEADER_WINDOW).indexOf("%PDF-");
}

export function sniffContent(bytes: Uint8Array): SniffResult {
  if (findPdfHeader(bytes) >= 0) return { accepted: true, content: PDF_CONTENT };
  if (startsWith(bytes, PNG_SIGNATURE)) return { accepted: true, content: PNG_CONTENT };
  if (startsWith(bytes, JPEG_SIGNATURE)) return { accepted: true, content: JPEG_CONTENT };

  const head = ascii(bytes, 0, 16);
  const brand = ascii(bytes, 8, 12);
  if (ascii(bytes, 4, 8) === "ftyp" && /^(heic|heix|hevc|mif1|msf1|heif)$/.test(brand)) {
    return { accepted: false, label: "an HEIC/HEIF photo", hint: "Export it as JPEG (most phones can share a photo as JPEG) and upload that." };
  }
  if (head.startsWith("GIF8")) return { accepted: false, label: "a GIF image", hint: "Save it as PNG and upload that." };
  if (head.startsWith("RIFF") && ascii(bytes, 8, 12) === "WEBP") return { accepted: false, label: "a WebP image", hint: "Save it as PNG or JPEG and upload that." };
  if (head.startsWith("II*\0") || head.startsWith("MM\0*")) return { accepted: false, label: "a TIFF image", hint: "Save it as PDF or PNG and upload that." };
  if (head.startsWith("BM")) return { accepted: false, label: "a BMP image", hint: "Save it as PNG and upload that." };
  if (head.startsWith("PK\u0003\u0004")) {
    return { accepted: false, label: "a ZIP archive (Word and Excel files are ZIP archives too)", hint: "Print or export it to PDF and upload the PDF." };
  }
  if (head.startsWith("AC10")) return { accepted: false, label: "a CAD drawing", hint: "Plot it to PDF and upload the PDF." };
  if (/^[\x09\x0a\x0d\x20-\x7e]*$/.test(ascii(bytes, 0, 512)) && bytes.length > 0) {
    return { accepted: false, label: "a text file", hint: "Print or export it to PDF and upload the PDF." };
  }
  return { accepted: false, label: "not a PDF, PNG or JPEG file" };
}
