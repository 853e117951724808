import { PDFName, PDFRef, type PDFFont } from "pdf-lib";
import { fitText } from "../text";
import { MIN_TEXT, type Ctx, type PageInfo } from "./style";

export interface MarginStreams {
  save: PDFRef;
  restore: PDFRef;
  fontNames: Map<PDFFont, PDFName>;
}

export const num = (n: number) => (Math.abs(n) < 1e-9 ? "0" : n.toFixed(3).replace(/\.?0+$/, ""));

/**
 * Stamps a datasheet page's bottom margin with the review marking (or the
 * approval) and the page's place in the packet. The page's own content is
 * wrapped in q … Q so a transform it leaves behind cannot move the stamp, and
 * the stamp is written as a small uncompressed stream: a packet can carry
 * hundreds of datasheet pages, and pdf-lib would otherwise start a compressor
 * for each one.
 */
export function drawDatasheetMargin(ctx: Ctx, info: PageInfo, pageNo: number, total: number, streams: MarginStreams) {
  const { page } = info;
  const { fonts, model, doc } = ctx;
  const box = page.getCropBox();
  const rotation = ((page.getRotation().angle % 360) + 360) % 360;
  const across = rotation === 90 || rotation === 270 ? box.height : box.width;
  // The stamp is Sundocket's own lettering, so it keeps the sheets' 8 pt minimum even on a letter-size datasheet.
  const size = MIN_TEXT;
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
