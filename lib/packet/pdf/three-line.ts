import type { PDFPage } from "pdf-lib";
import type { PdfFonts } from "../fonts";
import { drawText } from "../text-layer";
import { INK, MIN_TEXT, RULE_PT, WHITE, type Item } from "./style";

/**
 * Three-line detail of a 120 V-only inverter feeding a 120/240 V panel: the
 * line conductor to L1, the L1–L2 jumper, the neutral and the EGC, and the
 * neutral-to-ground bond where the record puts it. Caption carries
 * "inverter|panel|circuit|bondTag".
 */
export function threeLineItem(fonts: PdfFonts, caption: string, w: number): Item {
  const [inverter = "", panel = "", circuit = "", bondTag = ""] = caption.split("|");
  const h = 250;
  return {
    h,
    draw(page: PDFPage, x: number, top: number) {
      const text = (t: string, tx: number, ty: number, bold = false, size = 9) => drawText(page, t, { x: tx, y: ty, size, font: bold ? fonts.bold : fonts.regular, color: INK });
      const line = (x1: number, y1: number, x2: number, y2: number, thickness = 1.2) => page.drawLine({ start: { x: x1, y: y1 }, end: { x: x2, y: y2 }, thickness, color: INK });
      const box = (bx: number, by: number, bw: number, bh: number) => page.drawRectangle({ x: bx, y: by, width: bw, height: bh, borderColor: INK, borderWidth: 1, color: WHITE });
      const inv = { x: x + 20, y: top - 200, w: 170, h: 170 };
      const pnl = { x: x + Math.min(w - 260, 560), y: top - 220, w: 240, h: 200 };
      box(inv.x, inv.y, inv.w, inv.h);
      box(pnl.x, pnl.y, pnl.w, pnl.h);
      text(inverter, inv.x + 8, inv.y + inv.h - 16, true, 10);
      text("120 V AC output", inv.x + 8, inv.y + inv.h - 30);
      text(panel, pnl.x + 8, pnl.y + pnl.h - 16, true, 10);
      text("120/240 V panel", pnl.x + 8, pnl.y + pnl.h - 30);
      // Terminal rows, top to bottom: line, neutral, ground.
      const rows = { L: top - 100, N: top - 145, G: top - 180 };
      const termX = inv.x + inv.w;
      const barX = pnl.x + 40;
      text("L", termX - 14, rows.L - 3, true);
      text("N", termX - 14, rows.N - 3, true);
      text("G", termX - 14, rows.G - 3, true);
      // Panel bus: L1 and L2 as vertical bars, N and G bars below.
      const l1 = { x: barX, y: rows.L };
      const l2 = { x: barX + 70, y: rows.L };
      line(l1.x, rows.L + 22, l1.x, rows.L - 18, 3);
      line(l2.x, rows.L + 22, l2.x, rows.L - 18, 3);
      text("L1", l1.x - 6, rows.L + 26, true);
      text("L2", l2.x - 6, rows.L + 26, true);
      line(barX - 10, rows.N, barX + 120, rows.N, 3);
      text("N BAR", barX + 126, rows.N - 3, true);
      line(barX - 10, rows.G, barX + 120, rows.G, 3);
      text("G BAR", barX + 126, rows.G - 3, true);
      // Conductors from the inverter.
      line(termX, rows.L, l1.x, rows.L);
      line(termX, rows.N, barX - 10, rows.N);
      line(termX, rows.G, barX - 10, rows.G, 0.9);
      text(`${circuit}: line`, termX + 12, rows.L + 4);
      text(`${circuit}: neutral`, termX + 12, rows.N + 4);
      text(`${circuit}: EGC`, termX + 12, rows.G + 4);
      // The jumper that puts both legs on the one 120 V line.
      line(l1.x, rows.L - 12, l2.x, rows.L - 12, 2.4);
      text("L1–L2 JUMPER", l1.x + 4, rows.L - 29, true);
      // Neutral-to-ground bond where the record puts it.
      const bondX = bondTag === panel ? barX + 100 : bondTag === inverter ? termX - 30 : null;
      if (bondX !== null) {
        line(bondX, rows.N, bondX, rows.G, 2.4);
        text("N–G BOND", bondX + 4, (rows.N + rows.G) / 2 - 3, true);
      } else {
        text(bondTag ? `N–G bond at ${bondTag}` : "N–G bond location not given", pnl.x + 8, pnl.y + 8, true);
      }
      page.drawRectangle({ x, y: top - h, width: w, height: h, borderColor: INK, borderWidth: RULE_PT });
      text("Not to scale. One neutral-to-ground bond in the system.", x + 8, top - h + 8, false, MIN_TEXT);
    },
  };
}
