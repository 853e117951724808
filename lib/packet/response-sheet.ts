import { PDFDocument, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { embedPacketFonts } from "./fonts";
import { datedTime } from "./format";
import { wrapText } from "./text";

export interface ResponseSheetItem {
  number: number;
  letterOn: string;
  comment: string;
  citation: string;
  sheet: string;
  response: string;
  resolvedByName: string | null;
  resolvedAt: string | null;
}

export interface ResponseSheetInput {
  projectName: string;
  address: string;
  jurisdictionName: string;
  referenceNumber: string;
  /** The revision the resubmittal sends, when one is approved and waiting. */
  revisionNumber: number | null;
  preparedAt: string;
  items: readonly ResponseSheetItem[];
}

// US letter, portrait: a response sheet goes with the resubmittal letter, not in the 17 × 11 set.
const PAGE_W = 612;
const PAGE_H = 792;
const MARGIN = 54;
const BODY = 10;
const SMALL = 9;
const INK = rgb(0.1, 0.1, 0.12);
const SOFT = rgb(0.3, 0.3, 0.34);
export const RESPONSE_SHEET_CAUTION =
  "Prepared with Sundocket as an aid to the resubmittal. Not approval: the licensed professional who stamps the set and the Authority Having Jurisdiction decide.";

/**
 * The sheet that answers an AHJ's plan-review letter: each comment as the AHJ
 * wrote it, with its citation and sheet, and the response beside it. A comment
 * still open is printed as open, so the sheet never reads as complete when it
 * is not.
 */
export async function renderResponseSheet(input: ResponseSheetInput): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(`Response to plan-review comments — ${input.projectName}`);
  doc.setCreator("Sundocket");
  const fonts = await embedPacketFonts(doc);
  const width = PAGE_W - 2 * MARGIN;
  const pages: PDFPage[] = [];
  let page!: PDFPage;
  let y = 0;

  const newPage = () => {
    page = doc.addPage([PAGE_W, PAGE_H]);
    pages.push(page);
    y = PAGE_H - MARGIN;
  };
  const lines = (text: string, font: PDFFont, size: number, color = INK, indent = 0) => {
    for (const line of wrapText(font, size, text, width - indent)) {
      if (y < MARGIN + 40) newPage();
      page.drawText(line, { x: MARGIN + indent, y: y - size, size, font, color });
      y -= size * 1.35;
    }
  };

  newPage();
  lines("Response to plan-review comments", fonts.bold, 16);
  y -= 4;
  lines(input.projectName, fonts.bold, 12);
  if (input.address) lines(input.address, fonts.regular, BODY, SOFT);
  lines(`${input.jurisdictionName} · AHJ reference ${input.referenceNumber || "not yet given"}`, fonts.regular, BODY, SOFT);
  lines(input.revisionNumber !== null ? `Resubmitted with revision ${input.revisionNumber}` : "No approved revision waits to be resubmitted yet", fonts.regular, BODY, SOFT);
  lines(`Prepared ${datedTime(input.preparedAt)}`, fonts.regular, BODY, SOFT);
  const open = input.items.filter((i) => !i.resolvedAt).length;
  y -= 6;
  if (input.items.length === 0) lines("The AHJ has listed no comments on this submission.", fonts.regular, BODY);
  else if (open > 0) lines(`${open} of ${input.items.length} comments are still open: this sheet is not ready to go with a resubmittal.`, fonts.bold, BODY);
  else lines(`All ${input.items.length} comments are answered.`, fonts.regular, BODY);

  for (const item of input.items) {
    y -= 10;
    if (y < MARGIN + 100) newPage();
    page.drawLine({ start: { x: MARGIN, y }, end: { x: PAGE_W - MARGIN, y }, thickness: 0.5, color: SOFT });
    y -= 6;
    const where = [item.sheet && `Sheet ${item.sheet}`, item.citation].filter(Boolean).join(" · ");
    lines(`Comment ${item.number}${where ? ` — ${where}` : ""} (letter of ${item.letterOn})`, fonts.bold, BODY);
    lines(item.comment, fonts.regular, BODY, INK, 12);
    y -= 3;
    if (item.resolvedAt) {
      lines("Response", fonts.bold, SMALL, SOFT, 12);
      lines(item.response, fonts.regular, BODY, INK, 12);
      lines(`${item.resolvedByName ?? "—"}, ${datedTime(item.resolvedAt)}`, fonts.regular, SMALL, SOFT, 12);
    } else {
      lines("OPEN — not yet answered", fonts.bold, BODY, INK, 12);
    }
  }

  pages.forEach((p, i) => {
    for (const [n, line] of wrapText(fonts.regular, SMALL, RESPONSE_SHEET_CAUTION, width - 60).entries()) {
      p.drawText(line, { x: MARGIN, y: MARGIN - 14 - n * SMALL * 1.3, size: SMALL, font: fonts.regular, color: INK });
    }
    const label = `Page ${i + 1} of ${pages.length}`;
    p.drawText(label, { x: PAGE_W - MARGIN - fonts.regular.widthOfTextAtSize(label, SMALL), y: MARGIN - 14, size: SMALL, font: fonts.regular, color: INK });
  });
  return doc.save();
}
