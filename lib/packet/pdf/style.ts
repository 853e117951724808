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
export const ZONE = 10;
export const INNER = { x0: OUTER.left + ZONE, x1: PAGE_W - OUTER.right - ZONE, y0: OUTER.bottom + ZONE, y1: PAGE_H - OUTER.top - ZONE };
export const TITLE_W = 200;
export const TB = { x0: INNER.x1 - TITLE_W, x1: INNER.x1, y0: INNER.y0, y1: INNER.y1 };
export const BAND_H = 18;
export const PAD = 12;
export const CONTENT = { x0: INNER.x0 + PAD, x1: TB.x0 - PAD, top: INNER.y1 - PAD, bottom: INNER.y0 + BAND_H + 10 };
export const HEADING_H = 26;
export const FLOW_TOP = CONTENT.top - HEADING_H;
export const GUTTER = 18;

export const INK = rgb(0.08, 0.08, 0.1);
export const MUTED = rgb(0.38, 0.38, 0.42);
export const RULE = rgb(0.55, 0.55, 0.6);
export const HAIR = rgb(0.78, 0.78, 0.8);
export const FILL = rgb(0.91, 0.91, 0.93);
/** The one signal colour, reserved for what fails. */
export const SIGNAL = rgb(0.75, 0.07, 0.12);
export const WHITE = rgb(1, 1, 1);

export const BODY = 8.5;
export const BODY_LH = 11.5;
export const SMALL = 7.2;
export const SMALL_LH = 9.2;

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
}

export interface PageInfo {
  page: PDFPage;
  sheet: string;
  title: string;
  index: number;
  count: number;
  datasheet: boolean;
}
