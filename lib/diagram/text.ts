/**
 * Text sizes and a conservative width estimate shared by the layout and the
 * renderers. The layout cannot measure a real font (it runs without one), so
 * it reserves room for a wide sans face; the PDF renderer measures with the
 * embedded font and shrinks a line that still would not fit.
 */

export const TEXT = {
  tagSize: 10,
  titleSize: 7.5,
  bodySize: 8,
  calloutSize: 7.5,
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
