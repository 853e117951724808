/**
 * Text sizes and a conservative width estimate shared by the layout and the
 * renderers. The layout cannot measure a real font (it runs without one), so
 * it reserves room for a wide sans face; the PDF renderer measures with the
 * embedded font and shrinks a line that still would not fit.
 */

/** No lettering below 8 pt at 1:1; the packet draws the diagram at least at that scale (1/8 in lettering at half size is the counter's ask). */
export const TEXT = {
  tagSize: 10,
  titleSize: 8,
  bodySize: 8,
  calloutSize: 8,
  markSize: 8,
  lineGap: 2.5,
} as const;

/** Average advance of a wide sans face (DejaVu Sans digits are 0.636 em), per em. */
const AVERAGE_EM = 0.62;
const BOLD_EM = 0.68;

export function estimateTextWidth(text: string, size: number, bold = false): number {
  return text.length * size * (bold ? BOLD_EM : AVERAGE_EM);
}

export function lineHeight(size: number): number {
  return size + TEXT.lineGap;
}

/**
 * Breaks a line at spaces so no piece is longer than maxChars (a word longer
 * than that stands alone); continuation pieces get `indent` in front.
 */
export function wrapLine(line: string, maxChars: number, indent = ""): string[] {
  if (line.length <= maxChars) return [line];
  const lead = /^\s*/.exec(line)?.[0] ?? "";
  const words = line.trim().split(/\s+/);
  const out: string[] = [];
  let current = lead;
  for (const w of words) {
    const prefix = out.length === 0 ? lead : lead + indent;
    if (current.trim() === "") current = prefix + w;
    else if (current.length + 1 + w.length <= maxChars) current += ` ${w}`;
    else {
      out.push(current);
      current = lead + indent + w;
    }
  }
  if (current.trim() !== "") out.push(current);
  return out;
}
