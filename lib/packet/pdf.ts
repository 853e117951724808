import { deflateSync } from "node:zlib";
import { PDFArray, PDFContentStream, PDFDocument, PDFName, PDFRawStream, PDFRef, rgb, type Color, type PDFEmbeddedPage, type PDFFont, type PDFImage, type PDFPage } from "pdf-lib";
import type { CheckResult, CheckStatus } from "../compliance/types";
import { drawLabel } from "../labels/draw";
import { labelArtwork } from "../labels/artwork";
import { layoutLabel } from "../labels/draw";
import { embedPacketFonts, type PdfFonts } from "./fonts";
import { STATUS_SHAPE, STATUS_WORD, formatCheckValue } from "./format";
import type { Block, Cell } from "./markup";
import { buildPacketModel, type PacketModel, type Sheet } from "./model";
import { prepareOneLine, type OneLineDrawer } from "./one-line";
import { beginTextLayer, drawText, endTextLayer } from "./text-layer";
import { fitText, textWidth, wrapText } from "./text";
import type { PacketInput, PacketPdf, SheetPages } from "./types";
import { assertDecodableImage } from "../uploads/image-size";

/** ANSI B (tabloid) landscape, 17 × 11 in, in points. */
const PAGE_W = 17 * 72;
const PAGE_H = 11 * 72;
/** Wider left margin for binding. */
const OUTER = { left: 36, right: 18, top: 18, bottom: 18 };
const ZONE = 10;
const INNER = { x0: OUTER.left + ZONE, x1: PAGE_W - OUTER.right - ZONE, y0: OUTER.bottom + ZONE, y1: PAGE_H - OUTER.top - ZONE };
const TITLE_W = 200;
const TB = { x0: INNER.x1 - TITLE_W, x1: INNER.x1, y0: INNER.y0, y1: INNER.y1 };
const BAND_H = 18;
const PAD = 12;
const CONTENT = { x0: INNER.x0 + PAD, x1: TB.x0 - PAD, top: INNER.y1 - PAD, bottom: INNER.y0 + BAND_H + 10 };
const HEADING_H = 26;
const FLOW_TOP = CONTENT.top - HEADING_H;
const GUTTER = 18;

const INK = rgb(0.08, 0.08, 0.1);
const MUTED = rgb(0.38, 0.38, 0.42);
const RULE = rgb(0.55, 0.55, 0.6);
const HAIR = rgb(0.78, 0.78, 0.8);
const FILL = rgb(0.91, 0.91, 0.93);
/** The one signal colour, reserved for what fails. */
const SIGNAL = rgb(0.75, 0.07, 0.12);
const WHITE = rgb(1, 1, 1);

const BODY = 8.5;
const BODY_LH = 11.5;
const SMALL = 7.2;
const SMALL_LH = 9.2;

interface Ctx {
  doc: PDFDocument;
  fonts: PdfFonts;
  model: PacketModel;
  input: PacketInput;
  sitePlan: { kind: "page"; page: PDFEmbeddedPage } | { kind: "image"; image: PDFImage } | null;
  oneLine: OneLineDrawer;
}

interface Item {
  h: number;
  draw(page: PDFPage, x: number, top: number, w: number): void;
}

interface Group {
  items: Item[];
  repeat?: Item;
  box?: boolean;
  keepTogether?: boolean;
  gapAfter: number;
  /** Start in a fresh column when less than this is left (keeps a heading with what follows). */
  minSpace?: number;
}

interface PageInfo {
  page: PDFPage;
  sheet: string;
  title: string;
  index: number;
  count: number;
  datasheet: boolean;
}

function textItem(font: PDFFont, size: number, lh: number, line: string, color: Color = INK, indent = 0, prefix?: string): Item {
  return {
    h: lh,
    draw(page, x, top) {
      const y = top - lh + (lh - size) / 2 + size * 0.22;
      if (prefix) drawText(page, prefix, { x, y, size, font, color });
      drawText(page, line, { x: x + indent, y, size, font, color });
    },
  };
}

function paragraphItems(font: PDFFont, size: number, lh: number, text: string, w: number, color: Color = INK, indent = 0, prefix?: string): Item[] {
  return wrapText(font, size, text, w - indent).map((line, i) =>
    textItem(font, size, lh, line, color, indent, i === 0 ? prefix : undefined),
  );
}

function statusBadge(page: PDFPage, fonts: PdfFonts, status: CheckStatus, x: number, top: number, h: number, size = 7) {
  const text = `${STATUS_SHAPE[status]} ${STATUS_WORD[status]}`;
  const font = fonts.condensedBold;
  const w = textWidth(font, text, size) + 6;
  const y = top - h;
  if (status === "fail") page.drawRectangle({ x, y, width: w, height: h, color: SIGNAL });
  else page.drawRectangle({ x, y, width: w, height: h, borderColor: INK, borderWidth: 0.6 });
  drawText(page, text, { x: x + 3, y: y + (h - size) / 2 + size * 0.18, size, font, color: status === "fail" ? WHITE : INK });
  return w;
}

function cellText(c: Cell): string {
  return typeof c === "string" ? c : c.text;
}

function tableItems(ctx: Ctx, block: Extract<Block, { kind: "table" }>, w: number): { header: Item; rows: Item[]; caption: Item[] } {
  const { fonts } = ctx;
  const total = block.columns.reduce((t, c) => t + c.weight, 0) || 1;
  const widths = block.columns.map((c) => (c.weight / total) * w);
  const size = 7;
  const lh = 8.6;
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
            statusBadge(page, fonts, cell.status, cx + padX, top - padY, lh + 0.5, 6.4);
          } else {
            cell.lines.forEach((line, li) => {
              const tw = textWidth(cell.font, line, size);
              const tx = align === "right" ? cx + cw - padX - tw : align === "center" ? cx + (cw - tw) / 2 : cx + padX;
              drawText(page, line, { x: tx, y: top - padY - (li + 1) * lh + 2.2, size, font: cell.font, color: INK });
            });
          }
          if (i > 0) page.drawLine({ start: { x: cx, y: top }, end: { x: cx, y: top - h }, thickness: 0.3, color: HAIR });
          cx += cw;
        });
        page.drawLine({ start: { x, y: top - h }, end: { x: x + w, y: top - h }, thickness: header ? 0.7 : 0.3, color: header ? INK : HAIR });
      },
    };
  };
  const caption = block.caption ? paragraphItems(fonts.bold, 8.5, 13, block.caption.toUpperCase(), w) : [];
  return { header: rowItem(block.columns.map((c) => ({ text: c.header, bold: true })), true), rows: block.rows.map((r) => rowItem(r, false)), caption };
}

function checkCardItems(ctx: Ctx, r: CheckResult, w: number): Item[] {
  const { fonts } = ctx;
  const inner = w - 10;
  const items: Item[] = [];
  const indent = (item: Item): Item => ({ h: item.h, draw: (p, x, top, ww) => item.draw(p, x + 5, top, ww - 10) });
  const title = r.subject && !r.title.includes(r.subject) ? `${r.title}: ${r.subject}` : r.title;
  const titleLines = wrapText(fonts.bold, 8, title, inner - 78);
  const headH = Math.max(16, titleLines.length * 10 + 6);
  items.push({
    h: headH,
    draw(page, x, top) {
      page.drawRectangle({ x, y: top - headH, width: w, height: headH, color: r.status === "fail" ? rgb(0.98, 0.92, 0.92) : rgb(0.96, 0.96, 0.97) });
      statusBadge(page, fonts, r.status, x + 4, top - 3.5, 10.5, 6.8);
      titleLines.forEach((line, i) => drawText(page, line, { x: x + 80, y: top - 11.5 - i * 10, size: 8, font: fonts.bold, color: INK }));
      page.drawLine({ start: { x, y: top - headH }, end: { x: x + w, y: top - headH }, thickness: 0.4, color: RULE });
    },
  });
  const add = (font: PDFFont, text: string, color: Color = INK, label?: string) => {
    const full = label ? `${label} ${text}` : text;
    for (const it of paragraphItems(font, SMALL, SMALL_LH, full, inner, color)) items.push(indent(it));
  };
  items.push({ h: 2, draw() {} });
  add(fonts.condensedBold, r.codeRefs.join("; "), INK);
  if (r.message) add(fonts.condensed, r.message);
  if (r.reason) add(fonts.condensed, r.reason, r.status === "fail" ? SIGNAL : MUTED, "Reason:");
  if (r.formula) add(fonts.condensed, r.formula, MUTED, "Formula:");
  const pairRows = (title: string, rows: { label: string; value: string }[], bold: boolean) => {
    if (!rows.length) return;
    items.push(indent({
      h: 11,
      draw(page, x, top, ww) {
        drawText(page, title.toUpperCase(), { x, y: top - 8.5, size: 6.2, font: fonts.condensedBold, color: MUTED });
        page.drawLine({ start: { x, y: top - 10.5 }, end: { x: x + ww, y: top - 10.5 }, thickness: 0.3, color: HAIR });
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

function sitePlanItem(ctx: Ctx, w: number, h: number, caption: string): Item {
  const { fonts, sitePlan } = ctx;
  return {
    h,
    draw(page, x, top) {
      const boxH = h - 14;
      page.drawRectangle({ x, y: top - boxH, width: w, height: boxH, borderColor: INK, borderWidth: 0.8 });
      drawText(page, caption, { x, y: top - h + 3, size: SMALL, font: fonts.condensed, color: MUTED });
      if (!sitePlan) {
        page.drawLine({ start: { x, y: top }, end: { x: x + w, y: top - boxH }, thickness: 0.3, color: HAIR });
        page.drawLine({ start: { x, y: top - boxH }, end: { x: x + w, y: top }, thickness: 0.3, color: HAIR });
        const msg = "SITE PLAN NOT ATTACHED";
        const tw = textWidth(fonts.bold, msg, 16);
        page.drawRectangle({ x: x + w / 2 - tw / 2 - 8, y: top - boxH / 2 - 12, width: tw + 16, height: 28, color: WHITE });
        drawText(page, msg, { x: x + w / 2 - tw / 2, y: top - boxH / 2 - 4, size: 16, font: fonts.bold, color: INK });
        return;
      }
      const srcW = sitePlan.kind === "page" ? sitePlan.page.width : sitePlan.image.width;
      const srcH = sitePlan.kind === "page" ? sitePlan.page.height : sitePlan.image.height;
      const s = Math.min((w - 8) / srcW, (boxH - 8) / srcH);
      const dw = srcW * s;
      const dh = srcH * s;
      const dx = x + (w - dw) / 2;
      const dy = top - boxH + (boxH - dh) / 2;
      if (sitePlan.kind === "page") page.drawPage(sitePlan.page, { x: dx, y: dy, xScale: s, yScale: s });
      else page.drawImage(sitePlan.image, { x: dx, y: dy, width: dw, height: dh });
    },
  };
}

function labelRowItem(ctx: Ctx, labels: PacketInput["labels"], w: number): Item {
  const { fonts } = ctx;
  const cellW = (w - GUTTER) / 2;
  const artW = Math.min(288, cellW * 0.66);
  const textW = cellW - artW - 10;
  const cells = labels.map((l) => {
    const art = labelArtwork(l);
    const layout = layoutLabel(art, fonts);
    const scale = Math.min(1, artW / layout.widthPt);
    const artH = layout.heightPt * scale;
    const text: { font: PDFFont; text: string; color: Color }[] = [];
    const push = (font: PDFFont, t: string, color: Color = INK) => {
      for (const line of wrapText(font, SMALL, t, textW)) text.push({ font, text: line, color });
    };
    push(fonts.condensedBold, l.id);
    push(fonts.condensed, l.codeRef, MUTED);
    push(fonts.condensedBold, "Location:");
    push(fonts.condensed, l.location);
    if (l.equipmentTag) push(fonts.condensed, `Equipment: ${l.equipmentTag}`);
    push(fonts.condensed, `Print ${art.widthIn} × ${(layout.heightPt / 72).toFixed(2)} in; letters ≥ ${art.minLetterHeightIn.signalWord} in / ${art.minLetterHeightIn.text} in`, MUTED);
    push(fonts.condensed, scale < 1 ? `Shown at ${Math.round(scale * 100)} %` : "Shown full size", MUTED);
    return { label: l, artH, text };
  });
  const h = Math.max(...cells.map((c) => Math.max(c.artH, c.text.length * SMALL_LH))) + 14;
  return {
    h,
    draw(page, x, top) {
      cells.forEach((c, i) => {
        const cx = x + i * (cellW + GUTTER);
        drawLabel(page, c.label, { x: cx, y: top - 4 - c.artH, width: artW, height: c.artH }, fonts);
        c.text.forEach((t, li) => drawText(page, t.text, { x: cx + artW + 10, y: top - 4 - (li + 1) * SMALL_LH + 2, size: SMALL, font: t.font, color: t.color }));
      });
      page.drawLine({ start: { x, y: top - h + 4 }, end: { x: x + w, y: top - h + 4 }, thickness: 0.3, color: HAIR });
    },
  };
}

class SheetWriter {
  pages: PDFPage[] = [];
  private page!: PDFPage;
  private col = 0;
  private y = FLOW_TOP;
  readonly colW: number;

  constructor(
    private ctx: Ctx,
    private sheet: Sheet,
    private newPage: () => PDFPage,
  ) {
    this.colW = (CONTENT.x1 - CONTENT.x0 - GUTTER * (sheet.columns - 1)) / sheet.columns;
    this.startPage();
  }

  private startPage() {
    this.page = this.newPage();
    this.pages.push(this.page);
    this.col = 0;
    this.y = FLOW_TOP;
    const { fonts } = this.ctx;
    const heading = `${this.sheet.code}  ${this.sheet.title.toUpperCase()}${this.pages.length > 1 ? "  (CONTINUED)" : ""}`;
    drawText(this.page, heading, { x: CONTENT.x0, y: CONTENT.top - 13, size: 12, font: fonts.bold, color: INK });
    this.page.drawLine({ start: { x: CONTENT.x0, y: CONTENT.top - 19 }, end: { x: CONTENT.x1, y: CONTENT.top - 19 }, thickness: 1.2, color: INK });
    if (this.sheet.columns > 1) {
      for (let c = 1; c < this.sheet.columns; c += 1) {
        const gx = CONTENT.x0 + c * (this.colW + GUTTER) - GUTTER / 2;
        this.page.drawLine({ start: { x: gx, y: FLOW_TOP }, end: { x: gx, y: CONTENT.bottom }, thickness: 0.25, color: HAIR });
      }
    }
  }

  get x() {
    return CONTENT.x0 + this.col * (this.colW + GUTTER);
  }

  get columnHeight() {
    return FLOW_TOP - CONTENT.bottom;
  }

  get remaining() {
    return this.y - CONTENT.bottom;
  }

  nextColumn() {
    if (this.col + 1 < this.sheet.columns) {
      this.col += 1;
      this.y = FLOW_TOP;
    } else this.startPage();
  }

  place(group: Group) {
    const total = group.items.reduce((t, i) => t + i.h, 0) + (group.repeat?.h ?? 0);
    const atTop = this.y === FLOW_TOP;
    if (!atTop && group.keepTogether && total <= this.columnHeight && total > this.remaining) this.nextColumn();
    if (!atTop && group.minSpace !== undefined && this.remaining < Math.min(group.minSpace, total)) this.nextColumn();
    let boxTop = this.y;
    const closeBox = () => {
      if (group.box && boxTop > this.y) {
        this.page.drawRectangle({ x: this.x, y: this.y, width: this.colW, height: boxTop - this.y, borderColor: INK, borderWidth: 0.7 });
      }
    };
    if (group.repeat) this.drawItem(group.repeat);
    let placed = 0;
    for (const item of group.items) {
      if (item.h > this.remaining && this.y !== FLOW_TOP - (group.repeat && placed === 0 ? group.repeat.h : 0)) {
        closeBox();
        this.nextColumn();
        boxTop = this.y;
        if (group.repeat) this.drawItem(group.repeat);
      }
      this.drawItem(item);
      placed += 1;
    }
    closeBox();
    this.y -= group.gapAfter;
  }

  private drawItem(item: Item) {
    item.draw(this.page, this.x, this.y, this.colW);
    this.y -= item.h;
  }

  writeBlocks(blocks: Block[]) {
    const { fonts } = this.ctx;
    const w = this.colW;
    blocks.forEach((block, index) => {
      switch (block.kind) {
        case "heading": {
          const size = block.level === 1 ? 12 : block.level === 2 ? 9.5 : 8.5;
          const text = block.level === 2 ? block.text.toUpperCase() : block.text;
          const items = paragraphItems(fonts.bold, size, size * 1.4, text, w);
          if (block.level === 2) {
            items.push({ h: 4, draw: (p, x, top, ww) => p.drawLine({ start: { x, y: top - 1 }, end: { x: x + ww, y: top - 1 }, thickness: 0.5, color: RULE }) });
          }
          this.place({ items, gapAfter: 3, minSpace: 60 });
          break;
        }
        case "paragraph":
          this.place({ items: paragraphItems(fonts.regular, BODY, BODY_LH, block.text, w), gapAfter: 5 });
          break;
        case "list":
          block.items.forEach((item, i) => {
            const prefix = block.ordered ? `${i + 1}.` : "•";
            this.place({ items: paragraphItems(fonts.regular, BODY, BODY_LH, item, w, INK, block.ordered ? 16 : 10, prefix), gapAfter: 2.5 });
          });
          this.y -= 3;
          break;
        case "caution": {
          const items = paragraphItems(fonts.bold, BODY, BODY_LH, block.text, w - 26, INK).map((it, i): Item => ({
            h: it.h,
            draw(p, x, top, ww) {
              if (i === 0) {
                const s = 10;
                p.drawSvgPath(`M ${s / 2} 0 L ${s} ${s * 0.87} L 0 ${s * 0.87} Z`, { x: x + 7, y: top - 1.5, borderColor: INK, borderWidth: 1, color: WHITE });
                drawText(p, "!", { x: x + 10.6, y: top - 8.6, size: 6.5, font: fonts.bold, color: INK });
              }
              it.draw(p, x + 22, top, ww - 26);
            },
          }));
          items.unshift({ h: 3, draw() {} });
          items.push({ h: 3, draw() {} });
          this.place({ items, box: true, keepTogether: true, gapAfter: 6 });
          break;
        }
        case "fields": {
          const keyW = Math.min(150, w * 0.34);
          const items = block.rows.map(([k, v]): Item => {
            const keyLines = wrapText(fonts.condensedBold, BODY - 0.5, k, keyW - 6);
            const valLines = wrapText(fonts.regular, BODY - 0.5, v || "—", w - keyW);
            const h = Math.max(keyLines.length, valLines.length) * (BODY_LH - 0.5) + 2;
            return {
              h,
              draw(p, x, top, ww) {
                keyLines.forEach((l, i) => drawText(p, l, { x, y: top - (i + 1) * (BODY_LH - 0.5) + 2.5, size: BODY - 0.5, font: fonts.condensedBold, color: MUTED }));
                valLines.forEach((l, i) => drawText(p, l, { x: x + keyW, y: top - (i + 1) * (BODY_LH - 0.5) + 2.5, size: BODY - 0.5, font: fonts.regular, color: INK }));
                p.drawLine({ start: { x, y: top - h + 0.5 }, end: { x: x + ww, y: top - h + 0.5 }, thickness: 0.25, color: HAIR });
              },
            };
          });
          this.place({ items, gapAfter: 8 });
          break;
        }
        case "table": {
          const t = tableItems(this.ctx, block, w);
          if (t.caption.length) this.place({ items: t.caption, gapAfter: 1, minSpace: 80 });
          this.place({ items: t.rows, repeat: t.header, box: true, gapAfter: 14, minSpace: 60 });
          break;
        }
        case "check":
          this.place({ items: checkCardItems(this.ctx, block.result, w), box: true, keepTogether: true, gapAfter: 8 });
          break;
        case "figure": {
          if (block.figure === "site-plan") {
            // The drawing takes what the location list below it leaves, so both stay on one sheet where they can.
            const following = blocks[index + 1];
            let listH = 0;
            if (following?.kind === "table") {
              const t = tableItems(this.ctx, following, w);
              listH = [...t.caption, t.header, ...t.rows].reduce((sum, it) => sum + it.h, 0) + 30;
            }
            const h = Math.max(260, Math.round(this.remaining - listH));
            this.place({ items: [sitePlanItem(this.ctx, w, h, block.caption)], gapAfter: 12 });
          } else {
            const h = Math.max(300, this.remaining - 40);
            const drawer = this.ctx.oneLine;
            this.place({
              items: [{
                h,
                draw(p, x, top, ww) {
                  p.drawRectangle({ x, y: top - h, width: ww, height: h, borderColor: HAIR, borderWidth: 0.5 });
                  drawer(p, { x: x + 6, y: top - h + 6, width: ww - 12, height: h - 12 }, { regular: fonts.regular, bold: fonts.bold });
                },
              }],
              gapAfter: 8,
            });
          }
          break;
        }
        case "labels": {
          if (block.labels.length === 0) {
            this.place({ items: paragraphItems(fonts.regular, BODY, BODY_LH, "No labels are required for this system.", w), gapAfter: 6 });
            break;
          }
          const rows: Item[] = [];
          for (let i = 0; i < block.labels.length; i += 2) rows.push(labelRowItem(this.ctx, block.labels.slice(i, i + 2), w));
          this.place({ items: rows, gapAfter: 6 });
          break;
        }
        case "column-break":
          if (this.y !== FLOW_TOP) this.nextColumn();
          break;
      }
    });
  }
}

function drawZones(page: PDFPage, fonts: PdfFonts) {
  const outer = { x0: OUTER.left, y0: OUTER.bottom, x1: PAGE_W - OUTER.right, y1: PAGE_H - OUTER.top };
  page.drawRectangle({ x: outer.x0, y: outer.y0, width: outer.x1 - outer.x0, height: outer.y1 - outer.y0, borderColor: INK, borderWidth: 0.5 });
  page.drawRectangle({ x: INNER.x0, y: INNER.y0, width: INNER.x1 - INNER.x0, height: INNER.y1 - INNER.y0, borderColor: INK, borderWidth: 1.4 });
  const cols = 8;
  const rows = 6;
  const cw = (INNER.x1 - INNER.x0) / cols;
  const rh = (INNER.y1 - INNER.y0) / rows;
  for (let i = 0; i <= cols; i += 1) {
    const x = INNER.x0 + i * cw;
    page.drawLine({ start: { x, y: outer.y1 }, end: { x, y: INNER.y1 }, thickness: 0.4, color: INK });
    page.drawLine({ start: { x, y: outer.y0 }, end: { x, y: INNER.y0 }, thickness: 0.4, color: INK });
    if (i < cols) {
      const n = String(cols - i);
      drawText(page, n, { x: x + cw / 2 - 2, y: INNER.y1 + 2.2, size: 6, font: fonts.condensed, color: MUTED });
      drawText(page, n, { x: x + cw / 2 - 2, y: outer.y0 + 2.2, size: 6, font: fonts.condensed, color: MUTED });
    }
  }
  for (let j = 0; j <= rows; j += 1) {
    const y = INNER.y0 + j * rh;
    page.drawLine({ start: { x: outer.x0, y }, end: { x: INNER.x0, y }, thickness: 0.4, color: INK });
    page.drawLine({ start: { x: INNER.x1, y }, end: { x: outer.x1, y }, thickness: 0.4, color: INK });
    if (j < rows) {
      const letter = "ABCDEF"[j] ?? "";
      drawText(page, letter, { x: outer.x0 + 2.5, y: y + rh / 2 - 2, size: 6, font: fonts.condensed, color: MUTED });
      drawText(page, letter, { x: INNER.x1 + 2.5, y: y + rh / 2 - 2, size: 6, font: fonts.condensed, color: MUTED });
    }
  }
}

function drawTitleBlock(ctx: Ctx, info: PageInfo, pageNo: number, total: number, stamp: PDFImage | null) {
  const { page } = info;
  const { fonts, model } = ctx;
  const tb = model.titleBlock;
  const x = TB.x0 + 8;
  const w = TITLE_W - 16;
  page.drawLine({ start: { x: TB.x0, y: TB.y0 }, end: { x: TB.x0, y: TB.y1 }, thickness: 1.4, color: INK });
  let y = TB.y1 - 8;
  const rule = () => {
    y -= 5;
    page.drawLine({ start: { x: TB.x0, y }, end: { x: TB.x1, y }, thickness: 0.6, color: INK });
    y -= 8;
  };
  const label = (t: string) => {
    drawText(page, t, { x, y: y - 6, size: 5.8, font: fonts.condensedBold, color: MUTED });
    y -= 9;
  };
  const lines = (t: string, font: PDFFont, size: number, max = 3) => {
    for (const l of wrapText(font, size, t, w).slice(0, max)) {
      drawText(page, l, { x, y: y - size, size, font, color: INK });
      y -= size * 1.25;
    }
  };
  lines(tb.firm, fonts.bold, 10.5, 2);
  lines(`Prepared by ${tb.preparedBy}`, fonts.condensed, 7);
  rule();
  label("PROJECT");
  lines(tb.project, fonts.bold, 9.5, 2);
  if (tb.client) lines(tb.client, fonts.condensed, 7.2, 1);
  lines(tb.address || "Address not given", fonts.condensed, 7.2, 2);
  rule();
  label("AUTHORITY HAVING JURISDICTION");
  lines(tb.jurisdiction, fonts.condensed, 7.2, 2);
  lines(`${tb.edition}`, fonts.condensedBold, 7.2, 1);
  rule();
  label("REVISION");
  drawText(page, `Rev ${tb.revision}`, { x, y: y - 8, size: 8, font: fonts.bold, color: INK });
  drawText(page, tb.date, { x: x + 44, y: y - 8, size: 8, font: fonts.condensed, color: INK });
  drawText(page, model.marking.approved ? "Approved" : model.draft.isDraft ? "Draft for review" : "Issued for review", { x: x + 100, y: y - 8, size: 7, font: fonts.condensed, color: INK });
  y -= 12;
  rule();
  label(model.marking.approved ? "PROFESSIONAL REVIEW" : "REVIEW STATUS");
  const boxH = 168;
  const boxTop = y;
  page.drawRectangle({ x, y: boxTop - boxH, width: w, height: boxH, borderColor: INK, borderWidth: 0.8 });
  if (model.marking.approved) {
    const a = ctx.input.approval!;
    let ty = boxTop - 6;
    if (stamp) {
      const s = Math.min((w - 16) / stamp.width, 108 / stamp.height);
      page.drawImage(stamp, { x: x + (w - stamp.width * s) / 2, y: ty - stamp.height * s, width: stamp.width * s, height: stamp.height * s });
      ty -= stamp.height * s + 6;
    } else {
      ty -= 4;
    }
    for (const [t, font, size] of [
      [a.reviewerName, fonts.bold, 8],
      [`Licence ${a.licenceNumber} · ${a.licenceState}`, fonts.condensed, 7],
      [a.licenceDiscipline, fonts.condensed, 7],
      [`Approved ${a.approvedAt.slice(0, 10)}`, fonts.condensed, 7],
    ] as const) {
      drawText(page, fitText(font, size, t, w - 8), { x: x + 4, y: ty - size, size, font, color: INK });
      ty -= size * 1.3;
    }
  } else {
    const msg = ["PREPARED FOR REVIEW BY A", "LICENSED PROFESSIONAL", "", "NOT FOR CONSTRUCTION", "UNTIL STAMPED"];
    let ty = boxTop - 50;
    for (const m of msg) {
      const tw = textWidth(fonts.bold, m, 8.5);
      if (m) drawText(page, m, { x: x + (w - tw) / 2, y: ty, size: 8.5, font: fonts.bold, color: INK });
      ty -= 11;
    }
    drawText(page, "Stamp", { x: x + 4, y: boxTop - boxH + 4, size: 5.8, font: fonts.condensed, color: MUTED });
  }
  y = boxTop - boxH - 2;
  rule();
  label("SHEET TITLE");
  lines(info.title, fonts.bold, 9, 3);
  // The sheet number sits in the bottom corner, where a reader flipping the set looks.
  const numSize = 24;
  page.drawLine({ start: { x: TB.x0, y: TB.y0 + 58 }, end: { x: TB.x1, y: TB.y0 + 58 }, thickness: 0.6, color: INK });
  drawText(page, "SHEET", { x, y: TB.y0 + 49, size: 5.8, font: fonts.condensedBold, color: MUTED });
  drawText(page, info.sheet, { x, y: TB.y0 + 22, size: numSize, font: fonts.bold, color: INK });
  const sub = info.count > 1 ? `page ${info.index} of ${info.count} of this sheet` : "";
  if (sub) drawText(page, sub, { x, y: TB.y0 + 11, size: 6.5, font: fonts.condensed, color: INK });
  const pn = `${pageNo} / ${total}`;
  drawText(page, pn, { x: TB.x1 - 8 - textWidth(fonts.condensed, pn, 7), y: TB.y0 + 49, size: 7, font: fonts.condensed, color: INK });
}

function drawBand(ctx: Ctx, page: PDFPage) {
  const { fonts, model } = ctx;
  const y0 = INNER.y0;
  page.drawLine({ start: { x: INNER.x0, y: y0 + BAND_H }, end: { x: TB.x0, y: y0 + BAND_H }, thickness: 0.6, color: INK });
  if (!model.marking.approved) {
    const t = model.marking.reviewText;
    const tw = textWidth(fonts.bold, t, 8.5);
    drawText(page, t, { x: INNER.x0 + (TB.x0 - INNER.x0 - tw) / 2, y: y0 + 5.5, size: 8.5, font: fonts.bold, color: INK });
  } else {
    const t = `${model.marking.approvalLines[0] ?? ""} · ${model.marking.footer}`;
    drawText(page, fitText(fonts.condensedBold, 8, t, TB.x0 - INNER.x0 - 12), { x: INNER.x0 + 6, y: y0 + 5.5, size: 8, font: fonts.condensedBold, color: INK });
  }
}

interface MarginStreams {
  save: PDFRef;
  restore: PDFRef;
  fontNames: Map<PDFFont, PDFName>;
}

const num = (n: number) => (Math.abs(n) < 1e-9 ? "0" : n.toFixed(3).replace(/\.?0+$/, ""));

/**
 * Stamps a datasheet page's bottom margin with the review marking (or the
 * approval) and the page's place in the packet. The page's own content is
 * wrapped in q … Q so a transform it leaves behind cannot move the stamp, and
 * the stamp is written as a small uncompressed stream: a packet can carry
 * hundreds of datasheet pages, and pdf-lib would otherwise start a compressor
 * for each one.
 */
function drawDatasheetMargin(ctx: Ctx, info: PageInfo, pageNo: number, total: number, streams: MarginStreams) {
  const { page } = info;
  const { fonts, model, doc } = ctx;
  const box = page.getCropBox();
  const rotation = ((page.getRotation().angle % 360) + 360) % 360;
  const across = rotation === 90 || rotation === 270 ? box.height : box.width;
  const size = Math.max(4.5, Math.min(7, across / 88));
  const lines: { text: string; font: PDFFont }[] = model.marking.approved
    ? [
        { text: model.marking.approvalLines[0] ?? "", font: fonts.bold },
        { text: model.marking.footer, font: fonts.bold },
      ]
    : [{ text: model.marking.reviewText, font: fonts.bold }];
  lines.push({
    text: `${info.sheet} ${info.title} — page ${info.index} of ${info.count} · ${model.titleBlock.project} · Rev ${model.titleBlock.revision} ${model.titleBlock.date} · packet page ${pageNo} of ${total}`,
    font: fonts.condensed,
  });
  const lh = size * 1.3;
  const bandH = lines.length * lh + 4;
  // The page's upright frame: origin at the visual bottom-left, x along the visual bottom edge.
  const frame = (() => {
    switch (rotation) {
      case 90:
        return [0, 1, -1, 0, box.x + box.width, box.y];
      case 180:
        return [-1, 0, 0, -1, box.x + box.width, box.y + box.height];
      case 270:
        return [0, -1, 1, 0, box.x, box.y + box.height];
      default:
        return [1, 0, 0, 1, box.x, box.y];
    }
  })();
  const key = (font: PDFFont) => {
    const name = streams.fontNames.get(font)!;
    // Fixed resource names are cheaper than pdf-lib's unique keys over hundreds of pages; fall back on a clash.
    const fontDict = page.node.normalizedEntries().Font;
    const existing = fontDict.get(name);
    if (existing === undefined) fontDict.set(name, font.ref);
    else if (existing !== font.ref) return page.node.newFontDictionary(font.name, font.ref).asString();
    return name.asString();
  };
  const ops: string[] = ["q", `${frame.map(num).join(" ")} cm`, "1 1 1 rg", `0 0 ${num(across)} ${num(bandH)} re f`, "0.08 0.08 0.1 rg", "BT"];
  lines.forEach((l, i) => {
    const text = fitText(l.font, size, l.text, across - 12);
    ops.push(`${key(l.font)} ${num(size)} Tf`, `1 0 0 1 6 ${num(bandH - (i + 1) * lh + 1)} Tm`, `${l.font.encodeText(text).toString()} Tj`);
  });
  ops.push("ET", "Q");
  page.node.wrapContentStreams(streams.save, streams.restore);
  page.node.addContentStream(doc.context.register(doc.context.stream(ops.join("\n"))));
}

/**
 * Compression with the platform's zlib instead of pdf-lib's JavaScript
 * deflate: the same FlateDecode streams, several times faster, which is most
 * of what a packet costs beyond merging its datasheets.
 */
function useNativeDeflate(doc: PDFDocument) {
  const context = doc.context;
  context.flateStream = (contents, dict = {}) =>
    context.stream(deflateSync(typeof contents === "string" ? Buffer.from(contents, "latin1") : contents), { ...dict, Filter: "FlateDecode" });
}

function compressSheetContent(doc: PDFDocument, pages: PDFPage[]) {
  const context = doc.context;
  for (const page of pages) {
    const contents = page.node.Contents();
    const refs = contents instanceof PDFArray ? contents.asArray() : [];
    for (const ref of refs) {
      if (!(ref instanceof PDFRef)) continue;
      const stream = context.lookup(ref);
      if (!(stream instanceof PDFContentStream)) continue;
      const compressed = PDFRawStream.of(context.obj({ Filter: PDFName.of("FlateDecode") }), deflateSync(stream.getUnencodedContents()));
      context.assign(ref, compressed);
    }
  }
}

async function embedSitePlan(doc: PDFDocument, input: PacketInput): Promise<Ctx["sitePlan"]> {
  const sp = input.sitePlan;
  if (!sp) return null;
  if (sp.type === "pdf") {
    const src = await PDFDocument.load(sp.bytes, { updateMetadata: false });
    const [page] = await doc.embedPdf(src, [0]);
    return page ? { kind: "page", page } : null;
  }
  // Checked at upload too; a file stored before that check must not be decoded blind.
  assertDecodableImage(sp.bytes, sp.type === "png" ? "png" : "jpeg", "The site plan image");
  const image = sp.type === "png" ? await doc.embedPng(sp.bytes) : await doc.embedJpg(sp.bytes);
  return { kind: "image", image };
}

function pageRange(first: number, count: number): string {
  return count > 1 ? `${first}–${first + count - 1}` : String(first);
}

/** Renders the permit packet: sheets in order, title block and review marking on every page, datasheets merged at the end. */
export async function renderPacketPdf(input: PacketInput): Promise<PacketPdf> {
  const sources = await Promise.all(input.datasheets.map((d) => PDFDocument.load(d.bytes, { updateMetadata: false })));
  const oneLine = await prepareOneLine(input.record, (CONTENT.x1 - CONTENT.x0) / (FLOW_TOP - CONTENT.bottom - 40));
  let coverGuess = 1;
  for (let attempt = 0; attempt < 3; attempt += 1) {
    const result = await renderOnce(input, sources, oneLine, coverGuess);
    if (result.stable) return result.pdf;
    coverGuess = result.coverPages;
  }
  throw new Error("packet layout did not settle");
}

async function renderOnce(
  input: PacketInput,
  sources: PDFDocument[],
  oneLine: OneLineDrawer,
  coverGuess: number,
): Promise<{ stable: boolean; pdf: PacketPdf; coverPages: number }> {
  const doc = await PDFDocument.create();
  useNativeDeflate(doc);
  beginTextLayer(doc);
  const fonts = await embedPacketFonts(doc);
  const sitePlan = await embedSitePlan(doc, input);
  if (input.approval?.stampImage) assertDecodableImage(input.approval.stampImage.bytes, input.approval.stampImage.type === "png" ? "png" : "jpeg", "The stamp image");
  const stamp = input.approval?.stampImage
    ? input.approval.stampImage.type === "png"
      ? await doc.embedPng(input.approval.stampImage.bytes)
      : await doc.embedJpg(input.approval.stampImage.bytes)
    : null;

  // Pass over the sheets after the cover to learn their page ranges for the index.
  const draftModel = buildPacketModel(input);
  const ctx: Ctx = { doc, fonts, model: draftModel, input, sitePlan, oneLine };
  const infos: PageInfo[] = [];
  const sheetPages: SheetPages[] = [];
  let next = coverGuess + 1;
  const text = new Map<string, string>();
  const bodyPages: { sheet: Sheet; pages: PDFPage[] }[] = [];
  for (const sheet of draftModel.sheets.slice(1)) {
    const writer = new SheetWriter(ctx, sheet, () => doc.addPage([PAGE_W, PAGE_H]));
    writer.writeBlocks(sheet.blocks);
    bodyPages.push({ sheet, pages: writer.pages });
    text.set(sheet.code, pageRange(next, writer.pages.length));
    next += writer.pages.length;
  }
  draftModel.datasheets.forEach((d, i) => {
    const n = sources[i]!.getPageCount();
    text.set(d.code, pageRange(next, n));
    next += n;
  });
  text.set(draftModel.sheets[0]!.code, pageRange(1, coverGuess));

  // The cover, with the index filled in, goes in front.
  const model = buildPacketModel(input, { sheetPages: text });
  ctx.model = model;
  const coverSheet = model.sheets[0]!;
  let inserted = 0;
  const coverWriter = new SheetWriter(ctx, coverSheet, () => doc.insertPage(inserted++, [PAGE_W, PAGE_H]));
  coverWriter.writeBlocks(coverSheet.blocks);
  const coverPages = coverWriter.pages.length;
  if (coverPages !== coverGuess) {
    endTextLayer(doc);
    return { stable: false, pdf: { bytes: new Uint8Array(), pageCount: 0, sheetPages: [] }, coverPages };
  }

  const push = (sheet: { code: string; title: string }, pages: PDFPage[], datasheet: boolean) => {
    const first = infos.length + 1;
    pages.forEach((page, i) => infos.push({ page, sheet: sheet.code, title: sheet.title, index: i + 1, count: pages.length, datasheet }));
    sheetPages.push({ sheet: sheet.code, title: sheet.title, firstPage: first, pageCount: pages.length });
  };
  push(coverSheet, coverWriter.pages, false);
  for (const b of bodyPages) push(b.sheet, b.pages, false);
  for (let i = 0; i < sources.length; i += 1) {
    const src = sources[i]!;
    const copied = await doc.copyPages(src, src.getPageIndices());
    for (const p of copied) doc.addPage(p);
    push(model.datasheets[i]!, copied, true);
  }

  const total = infos.length;
  const streams: MarginStreams = {
    save: doc.context.register(doc.context.stream("q\n")),
    restore: doc.context.register(doc.context.stream("\nQ\n")),
    fontNames: new Map([
      [fonts.bold, PDFName.of("SundocketMarginBold")],
      [fonts.condensed, PDFName.of("SundocketMarginText")],
    ]),
  };
  infos.forEach((info, i) => {
    if (info.datasheet) drawDatasheetMargin(ctx, info, i + 1, total, streams);
    else {
      drawZones(info.page, fonts);
      drawTitleBlock(ctx, info, i + 1, total, stamp);
      drawBand(ctx, info.page);
    }
  });

  endTextLayer(doc);
  compressSheetContent(doc, infos.filter((i) => !i.datasheet).map((i) => i.page));
  const t = model.titleBlock;
  doc.setTitle(`${t.project} — permit packet, revision ${t.revision}`);
  doc.setSubject(model.marking.approved ? "Approved permit packet" : "Permit packet prepared for review");
  doc.setAuthor(t.firm);
  doc.setCreator("Sundocket");
  doc.setProducer("Sundocket (pdf-lib)");
  const when = new Date(input.revision.createdAt);
  doc.setCreationDate(when);
  doc.setModificationDate(when);
  const bytes = await doc.save();
  return { stable: true, pdf: { bytes, pageCount: total, sheetPages }, coverPages };
}
