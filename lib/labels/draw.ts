import { rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { DEJAVU_CAP_HEIGHT } from "../packet/fonts";
import { drawText } from "../packet/text-layer";
import { textWidth, wrapText } from "../packet/text";
import { labelArtwork, type LabelArtwork, type Rgb } from "./artwork";
import type { LabelRequirement } from "./types";

export interface LabelFonts {
  regular: PDFFont;
  bold: PDFFont;
}

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

const PT_PER_IN = 72;
const colour = (c: Rgb) => rgb(c.r, c.g, c.b);

export interface LabelLayout {
  widthPt: number;
  heightPt: number;
  headerHeightPt: number;
  headerSize: number;
  textSize: number;
  lineHeightPt: number;
  paddingPt: number;
  lines: { text: string; bold: boolean }[];
  /** Letter heights scaled below the minimum to fit. */
  letterScale: number;
}

/** Lays a label out at full size (points = printed points) at its width, letters at `letterScale` × the minimum. */
export function layoutLabel(art: LabelArtwork, fonts: LabelFonts, widthPt = art.widthIn * PT_PER_IN, letterScale = 1): LabelLayout {
  const headerSize = (art.minLetterHeightIn.signalWord * PT_PER_IN * letterScale) / DEJAVU_CAP_HEIGHT;
  const textSize = (art.minLetterHeightIn.text * PT_PER_IN * letterScale) / DEJAVU_CAP_HEIGHT;
  const paddingPt = Math.max(4, textSize * 0.45);
  const headerHeightPt = headerSize * 1.45;
  const lineHeightPt = textSize * 1.22;
  const inner = widthPt - 2 * paddingPt;
  const lines: { text: string; bold: boolean }[] = [];
  for (const t of wrapText(fonts.bold, textSize, art.title, inner)) lines.push({ text: t, bold: true });
  for (const body of art.lines) for (const t of wrapText(fonts.regular, textSize, body, inner)) lines.push({ text: t, bold: false });
  const heightPt = headerHeightPt + paddingPt * 1.4 + lines.length * lineHeightPt;
  return { widthPt, heightPt, headerHeightPt, headerSize, textSize, lineHeightPt, paddingPt, lines, letterScale };
}

/** Finds the largest letter scale (≤ 1) at which the label fits a fixed stock size. */
export function fitLabel(art: LabelArtwork, fonts: LabelFonts, widthPt: number, heightPt: number): LabelLayout {
  let layout = layoutLabel(art, fonts, widthPt, 1);
  let scale = 1;
  while (layout.heightPt > heightPt && scale > 0.2) {
    scale *= 0.95;
    layout = layoutLabel(art, fonts, widthPt, scale);
  }
  return { ...layout, heightPt: Math.max(layout.heightPt, heightPt) };
}

function drawAlertSymbol(page: PDFPage, x: number, yBase: number, size: number, triangle: Rgb, mark: Rgb) {
  // Equilateral triangle with an exclamation mark (ANSI Z535.4 safety alert symbol).
  const h = size * 0.866;
  page.drawSvgPath(`M ${size / 2} 0 L ${size} ${h} L 0 ${h} Z`, { x, y: yBase + h, color: colour(triangle) });
  const barW = size * 0.12;
  page.drawRectangle({ x: x + size / 2 - barW / 2, y: yBase + h * 0.34, width: barW, height: h * 0.42, color: colour(mark) });
  page.drawRectangle({ x: x + size / 2 - barW / 2, y: yBase + h * 0.12, width: barW, height: barW, color: colour(mark) });
}

/** Draws a laid-out label with its top-left at (x, top), scaled by `scale`. */
export function drawLabelLayout(page: PDFPage, art: LabelArtwork, layout: LabelLayout, fonts: LabelFonts, x: number, top: number, scale = 1) {
  const w = layout.widthPt * scale;
  const h = layout.heightPt * scale;
  const hh = layout.headerHeightPt * scale;
  page.drawRectangle({ x, y: top - h, width: w, height: h, color: rgb(1, 1, 1) });
  page.drawRectangle({ x, y: top - hh, width: w, height: hh, color: colour(art.header.background) });
  const size = layout.headerSize * scale;
  const capH = size * DEJAVU_CAP_HEIGHT;
  const baseline = top - hh / 2 - capH / 2;
  const wordW = textWidth(fonts.bold, art.signalWord, size);
  const symbol = art.header.alertSymbol;
  const symbolSize = capH * 1.25;
  const gap = symbol ? size * 0.3 : 0;
  const totalW = wordW + (symbol ? symbolSize + gap : 0);
  let cx = x + (w - totalW) / 2;
  if (symbol) {
    drawAlertSymbol(page, cx, baseline - capH * 0.06, symbolSize, symbol.triangle, symbol.mark);
    cx += symbolSize + gap;
  }
  drawText(page, art.signalWord, { x: cx, y: baseline, size, font: fonts.bold, color: colour(art.header.text) });
  const textSize = layout.textSize * scale;
  const lh = layout.lineHeightPt * scale;
  let y = top - hh - layout.paddingPt * scale * 0.7 - textSize * DEJAVU_CAP_HEIGHT;
  for (const line of layout.lines) {
    const font = line.bold ? fonts.bold : fonts.regular;
    const lw = textWidth(font, line.text, textSize);
    drawText(page, line.text, { x: x + (w - lw) / 2, y, size: textSize, font, color: rgb(0, 0, 0) });
    y -= lh;
  }
  page.drawRectangle({ x, y: top - h, width: w, height: h, borderColor: rgb(0, 0, 0), borderWidth: Math.max(0.5, 1.2 * scale) });
}

/**
 * Draws a label into a box on a packet sheet: laid out at its print width
 * with the minimum letter heights, then scaled down (never up) to the box.
 * Returns the scale and the size drawn.
 */
export function drawLabel(page: PDFPage, label: LabelRequirement | LabelArtwork, box: Box, fonts: LabelFonts) {
  const art = "header" in label ? label : labelArtwork(label);
  const layout = layoutLabel(art, fonts);
  const scale = Math.min(1, box.width / layout.widthPt, box.height / layout.heightPt);
  drawLabelLayout(page, art, layout, fonts, box.x, box.y + box.height, scale);
  return { scale, widthPt: layout.widthPt * scale, heightPt: layout.heightPt * scale, printHeightIn: layout.heightPt / PT_PER_IN };
}
