/**
 * The one-line diagram as a self-contained SVG string (for the packet
 * preview, downloads and tests). The React view draws the same scene.
 */
import type { OneLineLayout } from "./layout";
import { PALETTE, buildScene, type Ink, type Prim, type SceneGroup } from "./scene";

export interface OneLineSvgOptions {
  /** Accessible title of the whole drawing. */
  title?: string;
  /** Rendered width attribute; the drawing keeps its viewBox and scales. Default: the layout width. */
  width?: number | string;
  fontFamily?: string;
}

export const DIAGRAM_FONT_FAMILY = "'IBM Plex Sans', 'DejaVu Sans', Arial, sans-serif";

export function escapeXml(text: string): string {
  return text
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&apos;");
}

const colour = (ink: Ink | undefined) => (ink ? PALETTE[ink] : "none");
const num = (n: number) => String(Math.round(n * 100) / 100);

function primSvg(p: Prim): string {
  switch (p.type) {
    case "rect":
      return `<rect x="${num(p.x)}" y="${num(p.y)}" width="${num(p.width)}" height="${num(p.height)}" fill="${colour(p.fill)}" stroke="${colour(p.stroke)}"${p.stroke ? ` stroke-width="${num(p.lineWidth ?? 1)}"` : ""}${p.dash ? ` stroke-dasharray="${p.dash.join(" ")}"` : ""}/>`;
    case "path":
      return `<path d="${p.d}" fill="${colour(p.fill)}" stroke="${colour(p.stroke)}"${p.stroke ? ` stroke-width="${num(p.lineWidth ?? 1)}"` : ""}${p.dash ? ` stroke-dasharray="${p.dash.join(" ")}"` : ""}/>`;
    case "text":
      // xml:space keeps the indents and gaps the callouts rely on.
      return `<text xml:space="preserve" x="${num(p.x)}" y="${num(p.y)}" font-size="${num(p.size)}"${p.weight === "bold" ? ' font-weight="700"' : ""}${p.anchor && p.anchor !== "start" ? ` text-anchor="${p.anchor}"` : ""} fill="${colour(p.colour)}">${escapeXml(p.text)}</text>`;
  }
}

function groupSvg(g: SceneGroup): string {
  const attrs = [
    `id="${escapeXml(`one-line-${g.id}`)}"`,
    `class="one-line-${g.role}${g.trouble ? " one-line-trouble" : ""}"`,
    g.tag ? `data-tag="${escapeXml(g.tag)}"` : "",
    g.role === "node" || g.role === "edge" ? 'role="group"' : "",
  ].filter(Boolean);
  return `<g ${attrs.join(" ")}><title>${escapeXml(g.label)}</title>${g.prims.map(primSvg).join("")}</g>`;
}

export function oneLineSvg(layout: OneLineLayout, options: OneLineSvgOptions = {}): string {
  const scene = buildScene(layout);
  const title = options.title ?? "One-line diagram";
  const width = options.width ?? scene.width;
  const font = options.fontFamily ?? DIAGRAM_FONT_FAMILY;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${scene.width} ${scene.height}" width="${escapeXml(String(width))}" role="img" aria-labelledby="one-line-title" font-family="${escapeXml(font)}" style="font-variant-numeric: tabular-nums" stroke-linecap="square" stroke-linejoin="miter">`,
    `<title id="one-line-title">${escapeXml(title)}</title>`,
    `<rect x="0" y="0" width="${scene.width}" height="${scene.height}" fill="${PALETTE.paper}"/>`,
    ...scene.groups.map(groupSvg),
    `</svg>`,
  ].join("");
}
