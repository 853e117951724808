import { PDFDocument, rgb, type PDFPage } from "pdf-lib";
import { embedPacketFonts, type PdfFonts } from "../packet/fonts";
import { wrapText } from "../packet/text";
import { labelArtwork, type ArtworkOptions } from "./artwork";
import { drawLabelLayout, fitLabel, type LabelFonts } from "./draw";
import type { LabelRequirement } from "./types";

/**
 * Label stock. Sheet geometry is the common US-letter layout for the size
 * (from memory; print a test sheet on plain paper first).
 */
export interface LabelStock {
  pageWidthIn: number;
  pageHeightIn: number;
  labelWidthIn: number;
  labelHeightIn: number;
  columns: number;
  rows: number;
  marginLeftIn: number;
  marginTopIn: number;
  gapXIn: number;
  gapYIn: number;
  description: string;
}

export const LABEL_STOCKS = {
  "sheet-letter": {
    pageWidthIn: 8.5, pageHeightIn: 11, labelWidthIn: 4, labelHeightIn: 2, columns: 2, rows: 5,
    marginLeftIn: 0.156, marginTopIn: 0.5, gapXIn: 0.188, gapYIn: 0, description: "US letter, 10 labels of 4 × 2 in",
  },
  "sheet-letter-6": {
    pageWidthIn: 8.5, pageHeightIn: 11, labelWidthIn: 4, labelHeightIn: 3.333, columns: 2, rows: 3,
    marginLeftIn: 0.156, marginTopIn: 0.5, gapXIn: 0.188, gapYIn: 0, description: "US letter, 6 labels of 4 × 3⅓ in",
  },
  "single-4x2": {
    pageWidthIn: 4, pageHeightIn: 2, labelWidthIn: 4, labelHeightIn: 2, columns: 1, rows: 1,
    marginLeftIn: 0, marginTopIn: 0, gapXIn: 0, gapYIn: 0, description: "label printer, 4 × 2 in",
  },
  "single-4x3": {
    pageWidthIn: 4, pageHeightIn: 3, labelWidthIn: 4, labelHeightIn: 3, columns: 1, rows: 1,
    marginLeftIn: 0, marginTopIn: 0, gapXIn: 0, gapYIn: 0, description: "label printer, 4 × 3 in",
  },
  "single-4x6": {
    pageWidthIn: 4, pageHeightIn: 6, labelWidthIn: 4, labelHeightIn: 6, columns: 1, rows: 1,
    marginLeftIn: 0, marginTopIn: 0, gapXIn: 0, gapYIn: 0, description: "label printer, 4 × 6 in",
  },
} as const satisfies Record<string, LabelStock>;

export type LabelStockName = keyof typeof LABEL_STOCKS;

export interface LabelSheetOptions extends ArtworkOptions {
  stock: LabelStockName;
}

export interface LabelSheetResult {
  bytes: Uint8Array;
  pageCount: number;
  /** Labels whose text had to shrink below the minimum letter height to fit the stock. */
  belowMinimum: string[];
}

const IN = 72;
/** Safe inner margin so a die-cut edge does not clip the border. */
const BLEED_IN = 0.06;
/** The note under a sheet of labels: the smallest lettering Sundocket prints, in black. */
const NOTE_PT = 8;
const NOTE_LH = 10;

/**
 * Names the labels on this page whose letters fell below the minimum, in the
 * sheet's bottom margin (below the last row of stock, where nothing is cut),
 * so whoever prints the sheet sees which ones need a larger label.
 */
function drawBelowMinimumNote(page: PDFPage, fonts: PdfFonts, stock: LabelStock, titles: string[]) {
  const bottomMarginPt = (stock.pageHeightIn - stock.marginTopIn - stock.rows * (stock.labelHeightIn + stock.gapYIn) + stock.gapYIn) * IN;
  const x = Math.max(stock.marginLeftIn * IN, 18);
  const width = stock.pageWidthIn * IN - 2 * x;
  const lines = wrapText(fonts.bold, NOTE_PT, `Letters below the minimum height on this stock; print these on a larger label: ${titles.join("; ")}.`, width);
  // The margin holds three lines; anything further is summarised rather than printed over the labels.
  const room = Math.max(1, Math.floor((bottomMarginPt - 6) / NOTE_LH));
  const shown = lines.length > room ? [...lines.slice(0, room - 1), `… and more: ${titles.length} labels in all on this page.`] : lines;
  shown.forEach((line, i) => {
    page.drawText(line, { x, y: bottomMarginPt - 4 - NOTE_PT - i * NOTE_LH, size: NOTE_PT, font: fonts.bold, color: rgb(0, 0, 0) });
  });
}

/** The stocks a label prints on at its full minimum letter heights, smallest label first, as the label sheets lay it out. */
export function stocksThatFit(req: LabelRequirement, fonts: LabelFonts): { name: LabelStockName; stock: LabelStock }[] {
  return (Object.entries(LABEL_STOCKS) as [LabelStockName, LabelStock][])
    .filter(([, stock]) => {
      const art = labelArtwork(req, { widthIn: stock.labelWidthIn });
      return fitLabel(art, fonts, (stock.labelWidthIn - 2 * BLEED_IN) * IN, (stock.labelHeightIn - 2 * BLEED_IN) * IN).letterScale >= 1;
    })
    .sort(([, a], [, b]) => a.labelWidthIn * a.labelHeightIn - b.labelWidthIn * b.labelHeightIn)
    .map(([name, stock]) => ({ name, stock }));
}

export async function renderLabelSheet(labels: LabelRequirement[], options: LabelSheetOptions): Promise<LabelSheetResult> {
  const stock: LabelStock = LABEL_STOCKS[options.stock];
  const doc = await PDFDocument.create();
  doc.setTitle("Sundocket label sheet");
  doc.setCreator("Sundocket");
  const fonts = await embedPacketFonts(doc);
  const perPage = stock.columns * stock.rows;
  const belowMinimum: string[] = [];
  const w = (stock.labelWidthIn - 2 * BLEED_IN) * IN;
  const h = (stock.labelHeightIn - 2 * BLEED_IN) * IN;
  let page = null as ReturnType<typeof doc.addPage> | null;
  let pageBelow: string[] = [];
  const closePage = () => {
    if (page && pageBelow.length && perPage > 1) drawBelowMinimumNote(page, fonts, stock, pageBelow);
    pageBelow = [];
  };
  labels.forEach((req, i) => {
    const slot = i % perPage;
    if (slot === 0) {
      closePage();
      page = doc.addPage([stock.pageWidthIn * IN, stock.pageHeightIn * IN]);
    }
    if (!page) return;
    const col = slot % stock.columns;
    const row = Math.floor(slot / stock.columns);
    const x = (stock.marginLeftIn + col * (stock.labelWidthIn + stock.gapXIn) + BLEED_IN) * IN;
    const top = (stock.pageHeightIn - stock.marginTopIn - row * (stock.labelHeightIn + stock.gapYIn) - BLEED_IN) * IN;
    const art = labelArtwork(req, { ...options, widthIn: stock.labelWidthIn });
    const layout = fitLabel(art, fonts, w, h);
    if (layout.letterScale < 1) {
      belowMinimum.push(req.id);
      pageBelow.push(`${req.title} (${req.location})`);
    }
    drawLabelLayout(page, art, { ...layout, heightPt: h }, fonts, x, top, 1);
  });
  closePage();
  if (labels.length === 0) {
    const p = doc.addPage([stock.pageWidthIn * IN, stock.pageHeightIn * IN]);
    p.drawText("No labels required.", { x: 18, y: stock.pageHeightIn * IN - 30, size: 10, font: fonts.regular });
  }
  const bytes = await doc.save();
  return { bytes, pageCount: doc.getPageCount(), belowMinimum };
}

/** The label sheet PDF alone. */
export async function renderLabelSheetPdf(labels: LabelRequirement[], options: LabelSheetOptions): Promise<Uint8Array> {
  return (await renderLabelSheet(labels, options)).bytes;
}
