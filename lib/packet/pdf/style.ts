import { PDFDocument, rgb, type PDFEmbeddedPage, type PDFImage, type PDFPage } from "pdf-lib";
import type { PdfFonts } from "../fonts";
import type { PacketModel } from "../model";
import type { OneLineDrawer } from "../one-line";
import type { PacketInput } from "../types";

/** ANSI B (tabloid) landscape, 17 × 11 in, in points. */
export const PAGE_W = 17 * 72;
export const PAGE_H = 11 * 72;
/** Wider left margin for binding. */
export const OUTER = { left: 36, right: 18, top: 18, bottom: 18 };
/** Zone band: room for 8 pt zone numbers. */
export const ZONE = 12;
export const INNER = { x0: OUTER.left + ZONE, x1: PAGE_W - OUTER.right - ZONE, y0: OUTER.bottom + ZONE, y1: PAGE_H - OUTER.top - ZONE };
export const TITLE_W = 216;
export const TB = { x0: INNER.x1 - TITLE_W, x1: INNER.x1, y0: INNER.y0, y1: INNER.y1 };
export const BAND_H = 18;
export const PAD = 12;
export const CONTENT = { x0: INNER.x0 + PAD, x1: TB.x0 - PAD, top: INNER.y1 - PAD, bottom: INNER.y0 + BAND_H + 10 };
export const HEADING_H = 26;
export const FLOW_TOP = CONTENT.top - HEADING_H;
export const GUTTER = 18;

export const INK = rgb(0.08, 0.08, 0.1);
/** Secondary text: still near-black, so it survives a half-size copy. */
export const MUTED = rgb(0.2, 0.2, 0.24);
export const RULE = rgb(0.55, 0.55, 0.6);
export const HAIR = rgb(0.45, 0.45, 0.5);
export const FILL = rgb(0.91, 0.91, 0.93);
/** The one signal colour, reserved for what fails. */
export const SIGNAL = rgb(0.75, 0.07, 0.12);
export const WHITE = rgb(1, 1, 1);

/**
 * The smallest lettering a sheet carries: 8 pt at full size (17 × 11) stays
 * about 5.5 pt on a half-size counter copy; plan-review guides ask for 1/8 in.
 */
export const MIN_TEXT = 8;
/** Thinnest table rule that survives a half-size copy. */
export const RULE_PT = 0.5;
export const BODY = 9;
export const BODY_LH = 12;
export const SMALL = MIN_TEXT;
export const SMALL_LH = 10.2;

export interface Ctx {
  doc: PDFDocument;
  fonts: PdfFonts;
  model: PacketModel;
  input: PacketInput;
  sitePlan: { kind: "page"; page: PDFEmbeddedPage } | { kind: "image"; image: PDFImage } | null;
  oneLine: OneLineDrawer;
}

export interface Item {
  h: number;
  draw(page: PDFPage, x: number, top: number, w: number): void;
}

export interface Group {
  items: Item[];
  repeat?: Item;
  box?: boolean;
  keepTogether?: boolean;
  gapAfter: number;
  /** Start in a fresh column when less than this is left (keeps a heading with what follows). */
  minSpace?: number;
  /** Height of what must follow on the same column (a heading's first card or rows), so a heading never ends a page. */
  keepWithNext?: number;
}

export interface PageInfo {
  page: PDFPage;
  /** This page's sheet number: the sheet's code, then E-003.1, E-003.2 … for the sheets its content flowed onto. */
  sheet: string;
  /** The sheet's code in the plan. */
  baseSheet: string;
  title: string;
  index: number;
  count: number;
  datasheet: boolean;
}
