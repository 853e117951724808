import type { PDFFont } from "pdf-lib";

/** Width of a line; the packet fonts measure from cached glyph advances (see fonts.ts). */
export function textWidth(font: PDFFont, text: string, size: number): number {
  return font.widthOfTextAtSize(text, size);
}

/** Greedy word wrap; words longer than the width break by character. */
export function wrapText(font: PDFFont, size: number, text: string, width: number): string[] {
  const out: string[] = [];
  const space = textWidth(font, " ", size);
  for (const paragraph of text.split("\n")) {
    const words = paragraph.split(/\s+/).filter(Boolean);
    let line = "";
    let lineW = 0;
    for (const word of words) {
      const wordW = textWidth(font, word, size);
      if (line && lineW + space + wordW <= width) {
        line = `${line} ${word}`;
        lineW += space + wordW;
        continue;
      }
      if (!line && wordW <= width) {
        line = word;
        lineW = wordW;
        continue;
      }
      if (line) out.push(line);
      if (wordW <= width) {
        line = word;
        lineW = wordW;
        continue;
      }
      let piece = "";
      let pieceW = 0;
      for (const ch of word) {
        const cw = textWidth(font, ch, size);
        if (pieceW + cw > width && piece) {
          out.push(piece);
          piece = ch;
          pieceW = cw;
        } else {
          piece += ch;
          pieceW += cw;
        }
      }
      line = piece;
      lineW = pieceW;
    }
    out.push(line);
  }
  return out;
}

/** Shortens a line to the width with an ellipsis. */
export function fitText(font: PDFFont, size: number, text: string, width: number): string {
  if (textWidth(font, text, size) <= width) return text;
  let s = text;
  while (s.length > 1 && textWidth(font, s + "…", size) > width) s = s.slice(0, -1);
  return s + "…";
}
