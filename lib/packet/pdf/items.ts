import { rgb, type Color, type PDFFont, type PDFPage } from "pdf-lib";
import type { CheckResult, CheckStatus } from "../../compliance/types";
import type { PdfFonts } from "../fonts";
import { STATUS_SHAPE, STATUS_WORD, formatCheckValue } from "../format";
import type { Block, Cell } from "../markup";
import { drawText } from "../text-layer";
import { textWidth, wrapText } from "../text";
import { FILL, HAIR, INK, MIN_TEXT, MUTED, RULE, RULE_PT, SIGNAL, SMALL, SMALL_LH, WHITE, type Ctx, type Item } from "./style";

export function textItem(font: PDFFont, size: number, lh: number, line: string, color: Color = INK, indent = 0, prefix?: string): Item {
  return {
    h: lh,
    draw(page, x, top) {
      const y = top - lh + (lh - size) / 2 + size * 0.22;
      if (prefix) drawText(page, prefix, { x, y, size, font, color });
      drawText(page, line, { x: x + indent, y, size, font, color });
    },
  };
}

export function paragraphItems(font: PDFFont, size: number, lh: number, text: string, w: number, color: Color = INK, indent = 0, prefix?: string): Item[] {
  return wrapText(font, size, text, w - indent).map((line, i) =>
    textItem(font, size, lh, line, color, indent, i === 0 ? prefix : undefined),
  );
}

export function statusBadge(page: PDFPage, fonts: PdfFonts, status: CheckStatus, x: number, top: number, h: number, size = MIN_TEXT) {
  const text = `${STATUS_SHAPE[status]} ${STATUS_WORD[status]}`;
  const font = fonts.condensedBold;
  const w = textWidth(font, text, size) + 6;
  const y = top - h;
  if (status === "fail") page.drawRectangle({ x, y, width: w, height: h, color: SIGNAL });
  else page.drawRectangle({ x, y, width: w, height: h, borderColor: INK, borderWidth: 0.6 });
  drawText(page, text, { x: x + 3, y: y + (h - size) / 2 + size * 0.18, size, font, color: status === "fail" ? WHITE : INK });
  return w;
}

export function cellText(c: Cell): string {
  return typeof c === "string" ? c : c.text;
}

export function tableItems(ctx: Ctx, block: Extract<Block, { kind: "table" }>, w: number): { header: Item; rows: Item[]; caption: Item[] } {
  const { fonts } = ctx;
  const total = block.columns.reduce((t, c) => t + c.weight, 0) || 1;
  const widths = block.columns.map((c) => (c.weight / total) * w);
  const size = MIN_TEXT;
  const lh = 10;
  const padX = 3;
  const padY = 2.5;
  const rowItem = (cells: Cell[], header: boolean): Item => {
    const wrapped = cells.map((c, i) => {
      const font = header || (typeof c !== "string" && c.bold) ? fonts.condensedBold : fonts.condensed;
      if (typeof c !== "string" && c.status) return { font, lines: [""], status: c.status };
      return { font, lines: wrapText(font, size, cellText(c), Math.max(4, (widths[i] ?? 20) - 2 * padX)), status: undefined };
    });
    const h = Math.max(...wrapped.map((c) => c.lines.length)) * lh + 2 * padY;
    return {
      h,
      draw(page, x, top) {
        if (header) page.drawRectangle({ x, y: top - h, width: w, height: h, color: FILL });
        let cx = x;
        wrapped.forEach((cell, i) => {
          const cw = widths[i] ?? 0;
          const align = block.columns[i]?.align ?? "left";
          if (cell.status) {
            statusBadge(page, fonts, cell.status, cx + padX, top - padY, lh + 0.5, MIN_TEXT);
          } else {
            cell.lines.forEach((line, li) => {
              const tw = textWidth(cell.font, line, size);
              const tx = align === "right" ? cx + cw - padX - tw : align === "center" ? cx + (cw - tw) / 2 : cx + padX;
              drawText(page, line, { x: tx, y: top - padY - (li + 1) * lh + 2.2, size, font: cell.font, color: INK });
            });
          }
          if (i > 0) page.drawLine({ start: { x: cx, y: top }, end: { x: cx, y: top - h }, thickness: RULE_PT, color: HAIR });
          cx += cw;
        });
        page.drawLine({ start: { x, y: top - h }, end: { x: x + w, y: top - h }, thickness: header ? 0.8 : RULE_PT, color: header ? INK : HAIR });
      },
    };
  };
  const caption = block.caption ? paragraphItems(fonts.bold, 8.5, 13, block.caption.toUpperCase(), w) : [];
  return { header: rowItem(block.columns.map((c) => ({ text: c.header, bold: true })), true), rows: block.rows.map((r) => rowItem(r, false)), caption };
}

export function checkCardItems(ctx: Ctx, r: CheckResult, w: number): Item[] {
  const { fonts } = ctx;
  const inner = w - 10;
  const items: Item[] = [];
  const indent = (item: Item): Item => ({ h: item.h, draw: (p, x, top, ww) => item.draw(p, x + 5, top, ww - 10) });
  const title = r.subject && !r.title.includes(r.subject) ? `${r.title}: ${r.subject}` : r.title;
  const titleLines = wrapText(fonts.bold, 9, title, inner - 92);
  const headH = Math.max(18, titleLines.length * 11 + 7);
  items.push({
    h: headH,
    draw(page, x, top) {
      page.drawRectangle({ x, y: top - headH, width: w, height: headH, color: r.status === "fail" ? rgb(0.98, 0.92, 0.92) : rgb(0.96, 0.96, 0.97) });
      statusBadge(page, fonts, r.status, x + 4, top - 3.5, 11.5, MIN_TEXT);
      titleLines.forEach((line, i) => drawText(page, line, { x: x + 94, y: top - 12.5 - i * 11, size: 9, font: fonts.bold, color: INK }));
      page.drawLine({ start: { x, y: top - headH }, end: { x: x + w, y: top - headH }, thickness: RULE_PT, color: RULE });
    },
  });
  const add = (font: PDFFont, text: string, color: Color = INK, label?: string) => {
    const full = label ? `${label} ${text}` : text;
    for (const it of paragraphItems(font, SMALL, SMALL_LH, full, inner, color)) items.push(indent(it));
  };
  items.push({ h: 2, draw() {} });
  add(fonts.condensedBold, `Check ${r.checkId} · ${r.codeRefs.join("; ")}`, INK);
  if (r.message) add(fonts.condensed, r.message);
  if (r.reason) add(fonts.condensed, r.reason, r.status === "fail" ? SIGNAL : MUTED, "Reason:");
  if (r.remedy) add(fonts.condensedBold, r.remedy.text, r.status === "fail" ? SIGNAL : INK, "Remedy:");
  if (r.formula) add(fonts.condensed, r.formula, MUTED, "Formula:");
  const pairRows = (title: string, rows: { label: string; value: string }[], bold: boolean) => {
    if (!rows.length) return;
    items.push(indent({
      h: 13,
      draw(page, x, top, ww) {
        drawText(page, title.toUpperCase(), { x, y: top - 10, size: MIN_TEXT, font: fonts.condensedBold, color: INK });
        page.drawLine({ start: { x, y: top - 12.5 }, end: { x: x + ww, y: top - 12.5 }, thickness: RULE_PT, color: HAIR });
      },
    }));
    for (const row of rows) {
      const valueFont = bold ? fonts.condensedBold : fonts.condensed;
      const valueW = Math.min(inner * 0.45, textWidth(valueFont, row.value, SMALL) + 2);
      const labelLines = wrapText(fonts.condensed, SMALL, row.label, inner - valueW - 6);
      const valueLines = wrapText(valueFont, SMALL, row.value, inner * 0.45);
      const h = Math.max(labelLines.length, valueLines.length) * SMALL_LH;
      items.push(indent({
        h,
        draw(page, x, top, ww) {
          labelLines.forEach((l, i) => drawText(page, l, { x, y: top - (i + 1) * SMALL_LH + 2.3, size: SMALL, font: fonts.condensed, color: INK }));
          valueLines.forEach((l, i) => {
            const tw = textWidth(valueFont, l, SMALL);
            drawText(page, l, { x: x + ww - tw, y: top - (i + 1) * SMALL_LH + 2.3, size: SMALL, font: valueFont, color: INK });
          });
        },
      }));
    }
  };
  pairRows("Inputs", r.inputs.map((i) => ({ label: i.label, value: formatCheckValue(i) })), false);
  pairRows("Results", r.values.map((v) => ({ label: v.label, value: formatCheckValue(v) })), true);
  if (r.missing.length) add(fonts.condensedBold, r.missing.join(", "), INK, "Missing:");
  items.push({ h: 4, draw() {} });
  return items;
}
