import type { PDFFont, PDFImage, PDFPage } from "pdf-lib";
import type { PdfFonts } from "../fonts";
import { drawText } from "../text-layer";
import { fitText, textWidth, wrapText } from "../text";
import { BAND_H, INK, INNER, MIN_TEXT, MUTED, RULE_PT, OUTER, PAGE_H, PAGE_W, TB, TITLE_W, type Ctx, type PageInfo } from "./style";

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
    page.drawLine({ start: { x, y: outer.y1 }, end: { x, y: INNER.y1 }, thickness: RULE_PT, color: INK });
    page.drawLine({ start: { x, y: outer.y0 }, end: { x, y: INNER.y0 }, thickness: RULE_PT, color: INK });
    if (i < cols) {
      const n = String(cols - i);
      drawText(page, n, { x: x + cw / 2 - 2.2, y: INNER.y1 + 2.6, size: MIN_TEXT, font: fonts.condensed, color: INK });
      drawText(page, n, { x: x + cw / 2 - 2.2, y: outer.y0 + 2.6, size: MIN_TEXT, font: fonts.condensed, color: INK });
    }
  }
  for (let j = 0; j <= rows; j += 1) {
    const y = INNER.y0 + j * rh;
    page.drawLine({ start: { x: outer.x0, y }, end: { x: INNER.x0, y }, thickness: RULE_PT, color: INK });
    page.drawLine({ start: { x: INNER.x1, y }, end: { x: outer.x1, y }, thickness: RULE_PT, color: INK });
    if (j < rows) {
      const letter = "ABCDEF"[j] ?? "";
      drawText(page, letter, { x: outer.x0 + 3, y: y + rh / 2 - 3, size: MIN_TEXT, font: fonts.condensed, color: INK });
      drawText(page, letter, { x: INNER.x1 + 3, y: y + rh / 2 - 3, size: MIN_TEXT, font: fonts.condensed, color: INK });
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
  let y = TB.y1 - 6;
  const rule = () => {
    y -= 4;
    page.drawLine({ start: { x: TB.x0, y }, end: { x: TB.x1, y }, thickness: 0.6, color: INK });
    y -= 4;
  };
  const label = (t: string) => {
    drawText(page, t, { x, y: y - MIN_TEXT, size: MIN_TEXT, font: fonts.condensedBold, color: MUTED });
    y -= MIN_TEXT + 2.5;
  };
  const lines = (t: string, font: PDFFont, size: number, max = 3) => {
    for (const l of wrapText(font, size, t, w).slice(0, max)) {
      drawText(page, l, { x, y: y - size, size, font, color: INK });
      y -= size * 1.22;
    }
  };
  lines(tb.firm, fonts.bold, 10.5, 2);
  if (tb.firmLicence) lines(tb.firmLicence, fonts.condensed, MIN_TEXT, 2);
  if (tb.firmContact) lines(tb.firmContact, fonts.condensed, MIN_TEXT, 2);
  lines(`Prepared by ${tb.preparedBy}`, fonts.condensed, MIN_TEXT, 1);
  rule();
  label("PROJECT");
  lines(tb.project, fonts.bold, 9.5, 2);
  if (tb.client) lines(tb.client, fonts.condensed, MIN_TEXT, 1);
  lines(tb.address || "Address not given", fonts.condensed, MIN_TEXT, 2);
  rule();
  label("AUTHORITY HAVING JURISDICTION");
  lines(tb.jurisdiction, fonts.condensed, MIN_TEXT, 2);
  lines(`${tb.edition}`, fonts.condensedBold, MIN_TEXT, 1);
  rule();
  label("REVISION");
  drawText(page, `Rev ${tb.revision}`, { x, y: y - 9, size: 9, font: fonts.bold, color: INK });
  drawText(page, tb.date, { x: x + 44, y: y - 9, size: 9, font: fonts.condensed, color: INK });
  drawText(page, model.marking.approved ? "Approved" : model.draft.isDraft ? "Draft for review" : "Issued for review", { x: x + 106, y: y - 9, size: MIN_TEXT, font: fonts.condensed, color: INK });
  y -= 12;
  rule();
  label(model.marking.approved ? "PROFESSIONAL REVIEW" : "REVIEW STATUS");
  const boxH = 140;
  const boxTop = y;
  page.drawRectangle({ x, y: boxTop - boxH, width: w, height: boxH, borderColor: INK, borderWidth: 0.8 });
  if (model.marking.approved) {
    const a = ctx.input.approval!;
    let ty = boxTop - 6;
    if (stamp) {
      const s = Math.min((w - 16) / stamp.width, 80 / stamp.height);
      page.drawImage(stamp, { x: x + (w - stamp.width * s) / 2, y: ty - stamp.height * s, width: stamp.width * s, height: stamp.height * s });
      ty -= stamp.height * s + 6;
    } else {
      ty -= 4;
    }
    for (const [t, font, size] of [
      [a.reviewerName, fonts.bold, 9],
      [`Licence ${a.licenceNumber} · ${a.licenceState}`, fonts.condensed, MIN_TEXT],
      [a.licenceDiscipline, fonts.condensed, MIN_TEXT],
      [`Approved ${a.approvedAt.slice(0, 10)}`, fonts.condensed, MIN_TEXT],
    ] as const) {
      drawText(page, fitText(font, size, t, w - 8), { x: x + 4, y: ty - size, size, font, color: INK });
      ty -= size * 1.25;
    }
  } else {
    const msg = ["PREPARED FOR REVIEW BY A", "LICENSED PROFESSIONAL", "", "NOT FOR CONSTRUCTION", "UNTIL STAMPED"];
    let ty = boxTop - 40;
    for (const m of msg) {
      const tw = textWidth(fonts.bold, m, 9);
      if (m) drawText(page, m, { x: x + (w - tw) / 2, y: ty, size: 9, font: fonts.bold, color: INK });
      ty -= 12;
    }
    drawText(page, "Professional stamp", { x: x + 4, y: boxTop - boxH + 4, size: MIN_TEXT, font: fonts.condensed, color: MUTED });
  }
  y = boxTop - boxH - 2;
  rule();
  // Kept blank for the jurisdiction's approval stamp, on every sheet: the counter stamps each one.
  label("AHJ APPROVAL STAMP");
  const ahjH = 104;
  page.drawRectangle({ x, y: y - ahjH, width: w, height: ahjH, borderColor: INK, borderWidth: 0.8, borderDashArray: [4, 3] });
  y -= ahjH + 2;
  rule();
  label("SHEET TITLE");
  lines(info.title, fonts.bold, 9, 2);
  // The sheet number sits in the bottom corner, where a reader flipping the set looks.
  const numSize = 22;
  page.drawLine({ start: { x: TB.x0, y: TB.y0 + 58 }, end: { x: TB.x1, y: TB.y0 + 58 }, thickness: 0.6, color: INK });
  drawText(page, "SHEET", { x, y: TB.y0 + 47, size: MIN_TEXT, font: fonts.condensedBold, color: MUTED });
  drawText(page, info.sheet, { x, y: TB.y0 + 22, size: numSize, font: fonts.bold, color: INK });
  const sub = info.count > 1 ? `sheet ${info.index} of ${info.count} of ${info.baseSheet}` : "";
  if (sub) drawText(page, sub, { x, y: TB.y0 + 9, size: MIN_TEXT, font: fonts.condensed, color: INK });
  const pn = `page ${pageNo} / ${total}`;
  drawText(page, pn, { x: TB.x1 - 8 - textWidth(fonts.condensed, pn, MIN_TEXT), y: TB.y0 + 47, size: MIN_TEXT, font: fonts.condensed, color: INK });
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
