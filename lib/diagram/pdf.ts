/**
 * The one-line diagram as vector graphics on a pdf-lib page, scaled to fit
 * a box with its aspect kept. Text stays text (searchable, sharp in print).
 */
import { rgb, type Color, type PDFFont, type PDFPage } from "pdf-lib";
import type { OneLineLayout } from "./layout";
import { PALETTE, buildScene, type Ink, type Prim } from "./scene";

/** Thinnest stroke the sheet will print: 0.5 pt still survives a half-size office copy. */
const MIN_LINE_PT = 0.5;
/**
 * Smallest lettering on a sheet (8 pt at full size). A diagram scaled down to
 * fit keeps its text at this size, and a too-long line runs long rather than
 * shrink below it.
 */
const MIN_TEXT_PT = 8;

function hexToRgb(hex: string): Color {
  const n = Number.parseInt(hex.slice(1), 16);
  return rgb(((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255);
}

const COLOURS: Record<Ink, Color> = Object.fromEntries(
  Object.entries(PALETTE).map(([k, v]) => [k, hexToRgb(v)]),
) as Record<Ink, Color>;

/** Characters outside a standard font's encoding, spelt in ones it has. */
const FALLBACK: Record<string, string> = { "°": " deg", "×": "x", "·": "-", "–": "-", "—": "-", "−": "-", "≥": ">=", "≤": "<=" };

function encodable(font: PDFFont, text: string): string {
  try {
    font.encodeText(text);
    return text;
  } catch {
    let out = "";
    for (const ch of text) {
      try {
        font.encodeText(ch);
        out += ch;
      } catch {
        out += FALLBACK[ch] ?? "?";
      }
    }
    return out;
  }
}

export function drawOneLine(
  page: PDFPage,
  layout: OneLineLayout,
  box: { x: number; y: number; width: number; height: number },
  fonts: { regular: PDFFont; bold: PDFFont },
): void {
  const scene = buildScene(layout);
  if (scene.width <= 0 || scene.height <= 0 || box.width <= 0 || box.height <= 0) return;
  const s = Math.min(box.width / scene.width, box.height / scene.height);
  const offX = box.x + (box.width - scene.width * s) / 2;
  const top = box.y + box.height - (box.height - scene.height * s) / 2;
  const X = (x: number) => offX + x * s;
  const Y = (y: number) => top - y * s;
  const lw = (w: number | undefined) => Math.max((w ?? 1) * s, MIN_LINE_PT) / s;

  const draw = (p: Prim) => {
    switch (p.type) {
      case "rect": {
        page.drawRectangle({
          x: X(p.x),
          y: Y(p.y + p.height),
          width: p.width * s,
          height: p.height * s,
          ...(p.fill ? { color: COLOURS[p.fill] } : {}),
          ...(p.stroke
            ? { borderColor: COLOURS[p.stroke], borderWidth: lw(p.lineWidth) * s, ...(p.dash ? { borderDashArray: p.dash.map((d) => d * s) } : {}) }
            : { borderWidth: 0 }),
        });
        break;
      }
      case "path": {
        page.drawSvgPath(p.d, {
          x: X(0),
          y: Y(0),
          scale: s,
          ...(p.fill ? { color: COLOURS[p.fill] } : {}),
          ...(p.stroke
            ? { borderColor: COLOURS[p.stroke], borderWidth: lw(p.lineWidth), ...(p.dash ? { borderDashArray: p.dash } : {}) }
            : {}),
        });
        break;
      }
      case "text": {
        const font = p.weight === "bold" ? fonts.bold : fonts.regular;
        const text = encodable(font, p.text);
        let size = Math.max(p.size * s, MIN_TEXT_PT);
        let width = font.widthOfTextAtSize(text, size);
        if (p.maxWidth !== undefined && width > p.maxWidth * s) {
          size = Math.max(size * ((p.maxWidth * s) / width), MIN_TEXT_PT);
          width = font.widthOfTextAtSize(text, size);
        }
        const anchored = p.anchor === "middle" ? X(p.x) - width / 2 : p.anchor === "end" ? X(p.x) - width : X(p.x);
        // Lettering held at the minimum in a drawing scaled below 1:1 can outgrow its place; keep it inside the box.
        const x = Math.max(box.x + 1, Math.min(anchored, box.x + box.width - width - 4));
        page.drawText(text, { x, y: Y(p.y), size, font, color: COLOURS[p.colour] });
        break;
      }
    }
  };
  for (const g of scene.groups) for (const p of g.prims) draw(p);
}
