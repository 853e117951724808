import fs from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { PDFHexString, type PDFDocument, type PDFFont } from "pdf-lib";

type Fontkit = Parameters<PDFDocument["registerFontkit"]>[0];
type Font = ReturnType<Fontkit["create"]>;

/** DejaVu (Bitstream Vera licence, see fonts/pdf/LICENSE-DejaVu.txt): covers °, ×, −, →, ✓ and the status shapes. */
export const PDF_FONT_DIR = path.join(process.cwd(), "fonts", "pdf");

const FILES = {
  regular: "DejaVuSans.ttf",
  bold: "DejaVuSans-Bold.ttf",
  condensed: "DejaVuSansCondensed.ttf",
  condensedBold: "DejaVuSansCondensed-Bold.ttf",
} as const;

/** Shipped for sheets that set code or hashes in a fixed pitch; embedded only by a writer that asks for it. */
export const MONO_FONT_FILE = "DejaVuSansMono.ttf";

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

/**
 * pdf-lib shapes every string through fontkit (GSUB/GPOS lookups) each time it
 * draws or measures it, which made text the bulk of packet generation. The
 * sheets carry plain left-to-right Latin text, so glyphs are resolved once per
 * character and reused: the same glyphs and ToUnicode entries, no ligatures.
 */
/** Advances per font file, shared by every document (they do not depend on the subset). */
const advancesByFile = new Map<string, Map<string, number>>();

function cachePerCharacter(font: PDFFont, file: string): PDFFont {
  const encodeOne = font.encodeText.bind(font);
  const measureOne = font.widthOfTextAtSize.bind(font);
  const hex = new Map<string, string>();
  let advance = advancesByFile.get(file);
  if (!advance) {
    advance = new Map<string, number>();
    advancesByFile.set(file, advance);
  }
  font.encodeText = (text: string) => {
    let out = "";
    for (const ch of text) {
      let h = hex.get(ch);
      if (h === undefined) {
        h = encodeOne(ch).asString();
        hex.set(ch, h);
      }
      out += h;
    }
    return PDFHexString.of(out);
  };
  font.widthOfTextAtSize = (text: string, size: number) => {
    let units = 0;
    for (const ch of text) {
      let w = advance!.get(ch);
      if (w === undefined) {
        w = measureOne(ch, 1000);
        advance!.set(ch, w);
      }
      units += w;
    }
    return (units * size) / 1000;
  };
  return font;
}

/**
 * Parsed fonts shared by every document: fontkit decodes glyph tables lazily
 * and keeps them on the font object, so a fresh parse per packet paid for the
 * same glyphs again. Each document still makes its own subset.
 */
const parsed = new Map<Uint8Array, Font>();
const sharedFontkit: Fontkit = {
  create(data: Uint8Array, postscriptName?: string) {
    let font = parsed.get(data);
    if (!font) {
      font = fontkit.create(data, postscriptName);
      parsed.set(data, font);
    }
    return font;
  },
};

/** Embeds the packet fonts as subsets, so a packet carries only the glyphs it prints. */
export async function embedPacketFonts(doc: PDFDocument, dir = PDF_FONT_DIR): Promise<PdfFonts> {
  doc.registerFontkit(sharedFontkit);
  const entries = await Promise.all(
    (Object.keys(FILES) as FontRole[]).map(
      async (role) => [role, cachePerCharacter(await doc.embedFont(fontBytes(FILES[role], dir), { subset: true }), `${dir}/${FILES[role]}`)] as const,
    ),
  );
  return Object.fromEntries(entries) as PdfFonts;
}

/** DejaVu Sans cap height over the em (1493 / 2048 units), to turn a letter height into a font size. */
export const DEJAVU_CAP_HEIGHT = 1493 / 2048;
