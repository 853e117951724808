import type { PDFPage } from "pdf-lib";
import type { Block } from "../markup";
import type { Sheet } from "../model";
import { drawText } from "../text-layer";
import { wrapText } from "../text";
import { labelRowItem, sitePlanItem } from "./figures";
import { checkCardItems, paragraphItems, tableItems } from "./items";
import { threeLineItem } from "./three-line";
import { BODY, BODY_LH, CONTENT, FLOW_TOP, GUTTER, HAIR, INK, MIN_TEXT, MUTED, RULE, RULE_PT, WHITE, type Ctx, type Group, type Item } from "./style";

/** Line height of a label :: value row. */
const FIELD_LH = 11;

export class SheetWriter {
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
    const n = this.pages.length - 1;
    const heading = `${n > 0 ? `${this.sheet.code}.${n}` : this.sheet.code}  ${this.sheet.title.toUpperCase()}${n > 0 ? "  (CONTINUED)" : ""}`;
    drawText(this.page, heading, { x: CONTENT.x0, y: CONTENT.top - 13, size: 12, font: fonts.bold, color: INK });
    this.page.drawLine({ start: { x: CONTENT.x0, y: CONTENT.top - 19 }, end: { x: CONTENT.x1, y: CONTENT.top - 19 }, thickness: 1.2, color: INK });
    if (this.sheet.columns > 1) {
      for (let c = 1; c < this.sheet.columns; c += 1) {
        const gx = CONTENT.x0 + c * (this.colW + GUTTER) - GUTTER / 2;
        this.page.drawLine({ start: { x: gx, y: FLOW_TOP }, end: { x: gx, y: CONTENT.bottom }, thickness: RULE_PT, color: HAIR });
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
    else if (!atTop && group.keepWithNext !== undefined && total + group.keepWithNext <= this.columnHeight && this.remaining < total + group.keepWithNext) this.nextColumn();
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

  /** What of a block must sit under the heading before it: a whole check card, a table's caption, header and first rows. */
  private leadHeight(block: Block | undefined): number {
    if (!block) return 0;
    const w = this.colW;
    const sum = (items: Item[]) => items.reduce((t, i) => t + i.h, 0);
    switch (block.kind) {
      case "check":
        return sum(checkCardItems(this.ctx, block.result, w));
      case "table": {
        const t = tableItems(this.ctx, block, w);
        return sum(t.caption) + t.header.h + sum(t.rows.slice(0, 2));
      }
      case "figure":
        return block.figure === "split-phase" ? threeLineItem(this.ctx.fonts, block.caption, w).h : 120;
      case "paragraph":
      case "list":
        return 2 * BODY_LH;
      default:
        return 40;
    }
  }

  writeBlocks(blocks: Block[]) {
    const { fonts } = this.ctx;
    const w = this.colW;
    blocks.forEach((block, index) => {
      switch (block.kind) {
        case "heading": {
          const size = block.level === 1 ? 12 : block.level === 2 ? 10 : 9;
          const text = block.level === 2 ? block.text.toUpperCase() : block.text;
          const items = paragraphItems(fonts.bold, size, size * 1.4, text, w);
          if (block.level === 2) {
            items.push({ h: 4, draw: (p, x, top, ww) => p.drawLine({ start: { x, y: top - 1 }, end: { x: x + ww, y: top - 1 }, thickness: 0.5, color: RULE }) });
          }
          this.place({ items, gapAfter: 3, keepWithNext: this.leadHeight(blocks[index + 1]) });
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
                const s = 13;
                p.drawSvgPath(`M ${s / 2} 0 L ${s} ${s * 0.87} L 0 ${s * 0.87} Z`, { x: x + 5, y: top - 0.5, borderColor: INK, borderWidth: 1, color: WHITE });
                drawText(p, "!", { x: x + 9.2, y: top - 10.2, size: MIN_TEXT, font: fonts.bold, color: INK });
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
            const keyLines = wrapText(fonts.condensedBold, MIN_TEXT, k, keyW - 6);
            const valLines = wrapText(fonts.regular, MIN_TEXT, v || "—", w - keyW);
            const h = Math.max(keyLines.length, valLines.length) * FIELD_LH + 2;
            return {
              h,
              draw(p, x, top, ww) {
                keyLines.forEach((l, i) => drawText(p, l, { x, y: top - (i + 1) * FIELD_LH + 2.6, size: MIN_TEXT, font: fonts.condensedBold, color: MUTED }));
                valLines.forEach((l, i) => drawText(p, l, { x: x + keyW, y: top - (i + 1) * FIELD_LH + 2.6, size: MIN_TEXT, font: fonts.regular, color: INK }));
                p.drawLine({ start: { x, y: top - h + 0.5 }, end: { x: x + ww, y: top - h + 0.5 }, thickness: RULE_PT, color: HAIR });
              },
            };
          });
          this.place({ items, gapAfter: 8 });
          break;
        }
        case "table": {
          const t = tableItems(this.ctx, block, w);
          if (t.caption.length) this.place({ items: t.caption, gapAfter: 1, keepWithNext: t.header.h + t.rows.slice(0, 2).reduce((sum, r) => sum + r.h, 0) });
          this.place({ items: t.rows, repeat: t.header, box: true, gapAfter: 14, minSpace: 60 });
          break;
        }
        case "check":
          this.place({ items: checkCardItems(this.ctx, block.result, w), box: true, keepTogether: true, gapAfter: 8 });
          break;
        case "figure": {
          if (block.figure === "split-phase") {
            this.place({ items: [threeLineItem(fonts, block.caption, w)], gapAfter: 10, keepTogether: true });
          } else if (block.figure === "site-plan") {
            // The drawing takes what the blocks below it leave (location list, structural block), so all stay on one sheet where they can.
            let listH = 0;
            for (const following of blocks.slice(index + 1)) {
              if (following.kind === "table") {
                const t = tableItems(this.ctx, following, w);
                listH += [...t.caption, t.header, ...t.rows].reduce((sum, it) => sum + it.h, 0) + 16;
              } else if (following.kind === "fields") listH += following.rows.length * (FIELD_LH + 2) + 8;
              else if (following.kind === "heading") listH += 22;
              else listH += 30;
            }
            listH += 14;
            const h = Math.max(260, Math.round(this.remaining - listH));
            this.place({ items: [sitePlanItem(this.ctx, w, h, block.caption)], gapAfter: 12 });
          } else {
            const h = Math.max(300, this.remaining - 40);
            const drawer = this.ctx.oneLine;
            this.place({
              items: [{
                h,
                draw(p, x, top, ww) {
                  p.drawRectangle({ x, y: top - h, width: ww, height: h, borderColor: HAIR, borderWidth: RULE_PT });
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
