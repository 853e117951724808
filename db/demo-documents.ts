/**
 * Stand-in documents for the demo projects: a datasheet per equipment item,
 * the storage listing and a site plan, drawn with pdf-lib so the demo packets
 * have something real to merge. Every page says the product is invented.
 */
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import type { AttachmentRef, ProjectRecord } from "../lib/schemas/project-record";

const LETTER: [number, number] = [612, 792];
const INK = rgb(0.11, 0.13, 0.19);
const RULE = rgb(0.6, 0.6, 0.6);

/** Helvetica speaks WinAnsi only; keep the demo text inside it. */
function ascii(text: string): string {
  return text.replace(/[−–—]/g, "-").replace(/[^\x20-\x7e°±µ×]/g, "");
}

function footer(page: PDFPage, font: PDFFont, n: number, total: number) {
  page.drawLine({ start: { x: 48, y: 52 }, end: { x: 564, y: 52 }, thickness: 0.5, color: RULE });
  page.drawText(ascii(`Invented document for the Sundocket demo - not a real product.   Page ${n} of ${total}`), { x: 48, y: 38, size: 8, font, color: INK });
}

function ratingLines(record: ProjectRecord, tag: string | undefined): string[] {
  const item = record.equipment.find((e) => e.tag === tag);
  if (!item) return [];
  return Object.entries(item)
    .filter(([key, value]) => !["tag", "quantity", "libraryItemId", "manufacturer", "model"].includes(key) && value !== "" && value !== undefined)
    .map(([key, value]) => `${key}: ${Array.isArray(value) ? JSON.stringify(value) : String(value)}`);
}

export async function makeDemoDocument(record: ProjectRecord, ref: AttachmentRef): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const item = record.equipment.find((e) => e.tag === ref.equipmentTag);
  const pages = Math.max(1, ref.pageCount ?? 1);
  const title =
    ref.kind === "site-plan"
      ? `Site plan - ${record.name}`
      : ref.kind === "storage-listing"
        ? `Certificate of listing - ${item?.manufacturer ?? ""} ${item?.model ?? ""}`
        : ref.kind === "structural-letter"
          ? `Structural letter - ${record.name}`
          : `${item?.manufacturer ?? ""} ${item?.model ?? ""} - product data sheet`;
  doc.setTitle(ascii(title));
  for (let n = 1; n <= pages; n++) {
    const page = doc.addPage(LETTER);
    page.drawText(ascii(title), { x: 48, y: 730, size: 16, font: bold, color: INK });
    page.drawLine({ start: { x: 48, y: 720 }, end: { x: 564, y: 720 }, thickness: 1.5, color: INK });
    let y = 695;
    const write = (text: string, size = 10, f = font) => {
      page.drawText(ascii(text), { x: 48, y, size, font: f, color: INK, maxWidth: 516 });
      y -= size + 6;
    };
    if (ref.kind === "site-plan") {
      write(record.site.address);
      write(`Mounting: ${record.site.mounting}. Battery location: ${record.site.batteryLocation ?? "not given"}. ${record.site.batteryLocationNote}`, 9);
      // A schematic plan: the building, the array and the storage, not to scale.
      page.drawRectangle({ x: 150, y: 300, width: 300, height: 200, borderColor: INK, borderWidth: 1.5 });
      page.drawText("BUILDING", { x: 270, y: 395, size: 10, font: bold, color: INK });
      page.drawRectangle({ x: 170, y: 520, width: 180, height: 60, borderColor: INK, borderWidth: 1, color: rgb(0.9, 0.92, 0.96) });
      page.drawText("PV ARRAY", { x: 230, y: 545, size: 10, font: bold, color: INK });
      page.drawRectangle({ x: 380, y: 320, width: 50, height: 40, borderColor: INK, borderWidth: 1, color: rgb(0.95, 0.93, 0.85) });
      page.drawText("ESS", { x: 395, y: 336, size: 9, font: bold, color: INK });
      page.drawText("N", { x: 520, y: 600, size: 14, font: bold, color: INK });
      page.drawLine({ start: { x: 525, y: 560 }, end: { x: 525, y: 595 }, thickness: 1.5, color: INK });
      page.drawText("Schematic, not to scale.", { x: 150, y: 280, size: 8, font, color: INK });
    } else if (ref.kind === "storage-listing") {
      write("Listed to UL 9540 (energy storage systems) and UL 1973 (stationary batteries) - demo certificate.");
      write(`Product: ${item?.manufacturer ?? ""} ${item?.model ?? ""}`);
      for (const line of ratingLines(record, ref.equipmentTag)) write(line, 9);
    } else if (n === 1) {
      write("Electrical ratings", 12, bold);
      for (const line of ratingLines(record, ref.equipmentTag)) write(line, 9);
    } else {
      write(n === pages ? "Installation notes" : "Mechanical data", 12, bold);
      write("Install per the manufacturer's instructions, the NEC as adopted and the requirements of the AHJ.", 9);
    }
    footer(page, font, n, pages);
  }
  return doc.save();
}
