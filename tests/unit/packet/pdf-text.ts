import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";

export interface PdfText {
  pages: string[];
  /** Page sizes in points. */
  sizes: { width: number; height: number }[];
  /** Text items with their font size (from the text matrix), per page. */
  items: { str: string; size: number; x: number; y: number }[][];
}

/** Reads every page's text back with pdfjs; whitespace collapsed so wrapped lines compare as one string. */
export async function readPdfText(bytes: Uint8Array): Promise<PdfText> {
  const doc = await getDocument({ data: bytes.slice(), useSystemFonts: false, disableFontFace: true }).promise;
  const pages: string[] = [];
  const sizes: { width: number; height: number }[] = [];
  const items: { str: string; size: number; x: number; y: number }[][] = [];
  for (let i = 1; i <= doc.numPages; i += 1) {
    const page = await doc.getPage(i);
    const [x0, y0, x1, y1] = page.view as [number, number, number, number];
    sizes.push({ width: x1 - x0, height: y1 - y0 });
    const content = await page.getTextContent();
    const pageItems: { str: string; size: number; x: number; y: number }[] = [];
    for (const it of content.items) {
      if (!("str" in it)) continue;
      const [a, b, , , e, f] = it.transform as number[];
      pageItems.push({ str: it.str, size: Math.hypot(a ?? 0, b ?? 0), x: e ?? 0, y: f ?? 0 });
    }
    items.push(pageItems);
    pages.push(pageItems.map((x) => x.str).join(" ").replace(/\s+/g, " "));
  }
  await doc.destroy();
  return { pages, sizes, items };
}
