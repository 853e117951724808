import sharp from "sharp";
import { failuresOf, layoutOneLine } from "../diagram/layout";
import { DIAGRAM_FONT_FAMILY, oneLineSvg } from "../diagram/svg";
import type { PacketInput } from "./types";

export interface DocxImage {
  png: Uint8Array;
  /** Pixel size of the PNG. */
  width: number;
  height: number;
}

export interface DocxFigures {
  oneLine: DocxImage | null;
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
 * PDF draws (same layout, same failure marks and fixes), so a jurisdiction
 * that asks for an editable set gets the drawing, not a pointer to the PDF.
 */
export async function docxFigures(input: PacketInput): Promise<DocxFigures> {
  const layout = await layoutOneLine(input.record, { failures: failuresOf(input.run.results) });
  const oneLine = layout.nodes.length || layout.edges.length
    ? await svgToPng(oneLineSvg(layout, { title: `One-line diagram, ${input.record.name}`, fontFamily: DIAGRAM_FONT_FAMILY }))
    : null;
  return { oneLine };
}
