import fs from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import type { PDFDocument, PDFFont } from "pdf-lib";

/** DejaVu (Bitstream Vera licence, see fonts/pdf/LICENSE-DejaVu.txt): covers °, ×, −, →, ✓ and the status shapes. */
export const PDF_FONT_DIR = path.join(process.cwd(), "fonts", "pdf");

const FILES = {
  regular: "DejaVuSans.ttf",
  bold: "DejaVuSans-Bold.ttf",
  condensed: "DejaVuSansCondensed.ttf",
  condensedBold: "DejaVuSansCondensed-Bold.ttf",
  mono: "DejaVuSansMono.ttf",
} as const;

export type FontRole = keyof typeof FILES;
export type PdfFonts = Record<FontRole, PDFFont>;

const bytesCache = new Map<string, Uint8Array>();

function fontBytes(file: string, dir: string): Uint8Array {
  const full = path.join(dir, file);
  let bytes = bytesCache.get(full);
  if (!bytes) {
    bytes = new Uint8Array(fs.readFileSync(full));
    bytesCache.set(full, bytes);
  }
  return bytes;
}

/** Embeds the packet fonts as subsets, so a packet carries only the glyphs it prints. */
export async function embedPacketFonts(doc: PDFDocument, dir = PDF_FONT_DIR): Promise<PdfFonts> {
  doc.registerFontkit(fontkit);
  const entries = await Promise.all(
    (Object.keys(FILES) as FontRole[]).map(async (role) => [role, await doc.embedFont(fontBytes(FILES[role], dir), { subset: true })] as const),
  );
  return Object.fromEntries(entries) as PdfFonts;
}

/** DejaVu Sans cap height over the em (1493 / 2048 units), to turn a letter height into a font size. */
export const DEJAVU_CAP_HEIGHT = 1493 / 2048;
