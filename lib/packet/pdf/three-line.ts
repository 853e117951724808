import type { PDFPage } from "pdf-lib";
import type { PdfFonts } from "../fonts";
import { drawText } from "../text-layer";
import { threeLineScene } from "../three-line-scene";
import { INK, WHITE, type Item } from "./style";

/** The three-line detail on a sheet: the shared scene, its y measured down from the item's top. */
export function threeLineItem(fonts: PdfFonts, caption: string, w: number): Item {
  const { h, prims } = threeLineScene(caption, w);
  return {
    h,
    draw(page: PDFPage, x: number, top: number) {
      for (const p of prims) {
        if (p.type === "line") {
          page.drawLine({ start: { x: x + p.x1, y: top - p.y1 }, end: { x: x + p.x2, y: top - p.y2 }, thickness: p.width, color: INK });
        } else if (p.type === "box") {
          page.drawRectangle({ x: x + p.x, y: top - p.y - p.h, width: p.w, height: p.h, borderColor: INK, borderWidth: p.border, ...(p.fill ? { color: WHITE } : {}) });
        } else {
          drawText(page, p.text, { x: x + p.x, y: top - p.y, size: p.size, font: p.bold ? fonts.bold : fonts.regular, color: INK });
        }
      }
    },
  };
}
