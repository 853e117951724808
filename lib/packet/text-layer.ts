import { deflateSync } from "node:zlib";
import { PDFName, type Color, type PDFDocument, type PDFFont, type PDFPage } from "pdf-lib";

/**
 * Sheet text written straight as content-stream operators, one stream per
 * page appended after its drawing. pdf-lib builds an operator object graph
 * for every drawText call; a packet sets thousands of short lines, and this
 * was the largest cost left after font shaping. Text always lands on top of
 * the page's rules and fills, which is what every sheet wants.
 */
export interface TextOptions {
  x: number;
  y: number;
  size: number;
  font: PDFFont;
  color?: Color;
}

const num = (n: number) => {
  const r = Math.round(n * 1000) / 1000;
  return Object.is(r, -0) ? "0" : String(r);
};

function colourOps(c: Color | undefined): string {
  if (!c) return "0 0 0 rg";
  if (c.type === "RGB") return `${num(c.red)} ${num(c.green)} ${num(c.blue)} rg`;
  if (c.type === "Grayscale") return `${num(c.gray)} g`;
  return `${num(c.cyan)} ${num(c.magenta)} ${num(c.yellow)} ${num(c.key)} k`;
}

class TextLayer {
  private pages = new Map<PDFPage, string[]>();
  private names = new Map<PDFFont, PDFName>();

  constructor(private doc: PDFDocument) {}

  text(page: PDFPage, text: string, o: TextOptions) {
    let ops = this.pages.get(page);
    if (!ops) {
      ops = [];
      this.pages.set(page, ops);
    }
    let name = this.names.get(o.font);
    if (!name) {
      name = PDFName.of(`SdkText${this.names.size + 1}`);
      this.names.set(o.font, name);
    }
    ops.push(`${colourOps(o.color)} ${name.asString()} ${num(o.size)} Tf 1 0 0 1 ${num(o.x)} ${num(o.y)} Tm ${o.font.encodeText(text).toString()} Tj`);
  }

  flush() {
    const context = this.doc.context;
    for (const [page, ops] of this.pages) {
      const fontDict = page.node.normalizedEntries().Font;
      for (const [font, name] of this.names) fontDict.set(name, font.ref);
      const body = `q\nBT\n${ops.join("\n")}\nET\nQ\n`;
      page.node.addContentStream(context.register(context.stream(deflateSync(Buffer.from(body, "latin1")), { Filter: "FlateDecode" })));
    }
    this.pages.clear();
  }
}

const layers = new WeakMap<PDFDocument, TextLayer>();

/** Starts collecting the text drawn with `drawText` on this document's pages. */
export function beginTextLayer(doc: PDFDocument) {
  layers.set(doc, new TextLayer(doc));
}

/** Writes the collected text into the pages; call before saving. */
export function endTextLayer(doc: PDFDocument) {
  layers.get(doc)?.flush();
  layers.delete(doc);
}

/** Sets a line of text: through the document's text layer when one is open, else with pdf-lib. */
export function drawText(page: PDFPage, text: string, o: TextOptions) {
  if (text === "") return;
  const layer = layers.get(page.doc);
  if (layer) layer.text(page, text, o);
  else page.drawText(text, o);
}
