import { type Color, type PDFFont } from "pdf-lib";
import { drawLabel, layoutLabel } from "../../labels/draw";
import { labelArtwork } from "../../labels/artwork";
import { stocksThatFit, type LabelStock } from "../../labels/sheet";
import { drawText } from "../text-layer";
import { textWidth, wrapText } from "../text";
import type { PacketInput } from "../types";
import { GUTTER, HAIR, INK, MUTED, RULE_PT, SMALL, SMALL_LH, WHITE, type Ctx, type Item } from "./style";

export function sitePlanItem(ctx: Ctx, w: number, h: number, caption: string): Item {
  const { fonts, sitePlan } = ctx;
  return {
    h,
    draw(page, x, top) {
      const boxH = h - 14;
      page.drawRectangle({ x, y: top - boxH, width: w, height: boxH, borderColor: INK, borderWidth: 0.8 });
      drawText(page, caption, { x, y: top - h + 3, size: SMALL, font: fonts.condensed, color: MUTED });
      if (!sitePlan) {
        page.drawLine({ start: { x, y: top }, end: { x: x + w, y: top - boxH }, thickness: RULE_PT, color: HAIR });
        page.drawLine({ start: { x, y: top - boxH }, end: { x: x + w, y: top }, thickness: RULE_PT, color: HAIR });
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

export function labelRowItem(ctx: Ctx, labels: PacketInput["labels"], w: number): Item {
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
    // The smallest stock the label prints on at full letter height, so the installer orders the right labels.
    const fits = stocksThatFit(l, fonts);
    const size = (s: LabelStock) => `${s.labelWidthIn} × ${Math.round(s.labelHeightIn * 100) / 100} in`;
    push(
      fonts.condensedBold,
      fits[0]
        ? `Stock: ${size(fits[0].stock)} label (${fits.filter((f) => size(f.stock) === size(fits[0]!.stock)).map((f) => f.stock.description.split(",")[0]).join(" or ")})`
        : "Stock: larger than every listed stock: print on a custom label",
    );
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
      page.drawLine({ start: { x, y: top - h + 4 }, end: { x: x + w, y: top - h + 4 }, thickness: RULE_PT, color: HAIR });
    },
  };
}
