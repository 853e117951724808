import { type PDFFont, type PDFImage, type PDFPage } from "pdf-lib";
import type { PdfFonts } from "../fonts";
import { drawText } from "../text-layer";
import { fitText, textWidth, wrapText } from "../text";
import { BAND_H, INK, INNER, MUTED, OUTER, PAGE_H, PAGE_W, TB, TITLE_W, type Ctx, type PageInfo } from "./style";

export function drawZones(page: PDFPage, fonts: PdfFonts) {
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

export function drawTitleBlock(ctx: Ctx, info: PageInfo, pageNo: number, total: number, stamp: PDFImage | null) {
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

export function drawBand(ctx: Ctx, page: PDFPage) {
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
