import sharp from "sharp";
import { failuresOf, layoutOneLine } from "../diagram/layout";
import { DIAGRAM_FONT_FAMILY, escapeXml, oneLineSvg } from "../diagram/svg";
import { threeLineScene } from "./three-line-scene";
import type { PacketModel } from "./plan";
import type { PacketInput } from "./types";

export interface DocxImage {
  png: Uint8Array;
  /** Pixel size of the PNG. */
  width: number;
  height: number;
}

export interface DocxFigures {
  oneLine: DocxImage | null;
  /** Three-line details by their figure caption ("inverter|panel|circuit|bond"). */
  threeLine: Map<string, DocxImage>;
}

/** Wide enough that the detail lays out as on the sheet. */
const THREE_LINE_W = 840;

function threeLineSvg(caption: string): string {
  const { h, prims } = threeLineScene(caption, THREE_LINE_W);
  const n = (v: number) => String(Math.round(v * 100) / 100);
  const body = prims.map((p) => {
    if (p.type === "line") return `<line x1="${n(p.x1)}" y1="${n(p.y1)}" x2="${n(p.x2)}" y2="${n(p.y2)}" stroke="#14141a" stroke-width="${n(p.width)}"/>`;
    if (p.type === "box") return `<rect x="${n(p.x)}" y="${n(p.y)}" width="${n(p.w)}" height="${n(p.h)}" fill="${p.fill ? "#ffffff" : "none"}" stroke="#14141a" stroke-width="${n(p.border)}"/>`;
    return `<text x="${n(p.x)}" y="${n(p.y)}" font-size="${n(p.size)}"${p.bold ? ' font-weight="700"' : ""} fill="#14141a">${escapeXml(p.text)}</text>`;
  });
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${THREE_LINE_W}" height="${h}" viewBox="0 0 ${THREE_LINE_W} ${h}" font-family="${escapeXml(DIAGRAM_FONT_FAMILY)}"><rect width="100%" height="100%" fill="#ffffff"/>${body.join("")}</svg>`;
}

/**
 * 200 dpi keeps the one-line's 8 pt callouts crisp when the document is
 * printed at its 9 in width; higher only grows the file.
 */
const DENSITY_DPI = 200;

/** An SVG drawing as a PNG for the editable copy (a word processor cannot be relied on to draw SVG). */
async function svgToPng(svg: string): Promise<DocxImage> {
  const { data, info } = await sharp(Buffer.from(svg), { density: DENSITY_DPI }).flatten({ background: "#ffffff" }).png().toBuffer({ resolveWithObject: true });
  return { png: new Uint8Array(data), width: info.width, height: info.height };
}

/**
 * The drawings the editable copy carries as images: the same one-line the
 * PDF draws (same layout, same failure marks and fixes) and the same
 * three-line details, so a jurisdiction that asks for an editable set gets
 * the drawings, not a pointer to the PDF.
 */
export async function docxFigures(input: PacketInput, model: PacketModel): Promise<DocxFigures> {
  const layout = await layoutOneLine(input.record, { failures: failuresOf(input.run.results) });
  const oneLine = layout.nodes.length || layout.edges.length
    ? await svgToPng(oneLineSvg(layout, { title: `One-line diagram, ${input.record.name}`, fontFamily: DIAGRAM_FONT_FAMILY }))
    : null;
  const threeLine = new Map<string, DocxImage>();
  for (const sheet of model.sheets) {
    for (const block of sheet.blocks) {
      if (block.kind === "figure" && block.figure === "split-phase" && !threeLine.has(block.caption)) {
        threeLine.set(block.caption, await svgToPng(threeLineSvg(block.caption)));
      }
    }
  }
  return { oneLine, threeLine };
}
