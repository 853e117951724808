/**
 * Image dimensions read from the file's header, without decoding a pixel.
 * pdf-lib decodes a PNG to RGBA before embedding it, so a small file that
 * declares 30000 × 30000 pixels would ask for 3.6 GB; the header tells us first.
 */

export interface ImageSize {
  width: number;
  height: number;
}

/**
 * The most pixels an embedded image may have. 40 megapixels holds a 13 × 19 in
 * site plan scanned at 300 dpi (about 22 MP) and a 48 MP phone photo's usual
 * 12 MP output with room to spare, while its RGBA decode stays near 160 MB.
 */
export const MAX_IMAGE_PIXELS = 40_000_000;

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function u16(bytes: Uint8Array, at: number): number {
  return (bytes[at]! << 8) | bytes[at + 1]!;
}

function u32(bytes: Uint8Array, at: number): number {
  return ((bytes[at]! << 24) >>> 0) + (bytes[at + 1]! << 16) + (bytes[at + 2]! << 8) + bytes[at + 3]!;
}

/** PNG (ISO/IEC 15948 §11.2.2): IHDR is the first chunk, width then height as 4-byte big-endian. */
export function pngSize(bytes: Uint8Array): ImageSize | null {
  if (bytes.length < 24 || !PNG_SIGNATURE.every((b, i) => bytes[i] === b)) return null;
  const type = String.fromCharCode(bytes[12]!, bytes[13]!, bytes[14]!, bytes[15]!);
  if (type !== "IHDR") return null;
  return { width: u32(bytes, 16), height: u32(bytes, 20) };
}

/**
 * JPEG (ITU-T T.81 §B.2.2): walk the marker segments to the first start-of-frame
 * (SOF0–SOF15 except DHT C4, JPG C8 and DAC CC), whose payload holds the
 * precision, then height and width as 2-byte big-endian.
 */
export function jpegSize(bytes: Uint8Array): ImageSize | null {
  if (bytes.length < 4 || bytes[0] !== 0xff || bytes[1] !== 0xd8) return null;
  let at = 2;
  while (at + 4 <= bytes.length) {
    if (bytes[at] !== 0xff) return null;
    const marker = bytes[at + 1]!;
    if (marker === 0xff) {
      at += 1; // fill byte (T.81 §B.1.1.2)
      continue;
    }
    // Standalone markers carry no length (TEM, RSTn).
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      at += 2;
      continue;
    }
    if (marker === 0xd9 || marker === 0xda) return null; // end of image or start of scan before any frame header
    const length = u16(bytes, at + 2);
    if (length < 2) return null;
    const isFrame = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isFrame) {
      if (at + 9 > bytes.length) return null;
      return { height: u16(bytes, at + 5), width: u16(bytes, at + 7) };
    }
    at += 2 + length;
  }
  return null;
}

export function imageSize(bytes: Uint8Array, type: "png" | "jpeg"): ImageSize | null {
  return type === "png" ? pngSize(bytes) : jpegSize(bytes);
}

export type PixelCheck = { ok: true; size: ImageSize } | { ok: false; size: ImageSize | null; reason: "unreadable" | "too-many-pixels" };

/** Whether an image may be decoded: its header is readable and it declares at most MAX_IMAGE_PIXELS. */
export function checkImagePixels(bytes: Uint8Array, type: "png" | "jpeg", maxPixels = MAX_IMAGE_PIXELS): PixelCheck {
  const size = imageSize(bytes, type);
  if (!size || size.width === 0 || size.height === 0) return { ok: false, size, reason: "unreadable" };
  if (size.width * size.height > maxPixels) return { ok: false, size, reason: "too-many-pixels" };
  return { ok: true, size };
}

/** For drawing code that receives stored images: refuses to decode one over the limit. */
export function assertDecodableImage(bytes: Uint8Array, type: "png" | "jpeg", what: string): void {
  const check = checkImagePixels(bytes, type);
  if (check.ok) return;
  const dims = check.size ? ` (${check.size.width} × ${check.size.height} px)` : "";
  throw new Error(`${what}${dims} ${check.reason === "unreadable" ? "has no readable image header" : `has more than ${MAX_IMAGE_PIXELS / 1e6} megapixels`}; it was not drawn`);
}
