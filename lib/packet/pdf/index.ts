/** The permit packet as a PDF: sheets laid out by the sheet writer, title block and marking on each page, datasheets merged behind. */
import { deflateSync } from "node:zlib";
import { PDFArray, PDFContentStream, PDFDocument, PDFName, PDFRawStream, PDFRef, type PDFPage } from "pdf-lib";
import { embedPacketFonts } from "../fonts";
import { buildPacketModel, type Sheet } from "../model";
import { failuresOf } from "../../diagram/layout";
import { prepareOneLine, type OneLineDrawer } from "../one-line";
import { beginTextLayer, endTextLayer } from "../text-layer";
import type { PacketInput, PacketPdf, SheetPages } from "../types";
import { assertDecodableImage } from "../../uploads/image-size";
import { drawDatasheetMargin, type MarginStreams } from "./datasheet-margin";
import { CONTENT, FLOW_TOP, PAGE_H, PAGE_W, type Ctx, type PageInfo } from "./style";
import { drawBand, drawTitleBlock, drawZones } from "./title-block";
import { SheetWriter } from "./writer";

/**
 * Compression with the platform's zlib instead of pdf-lib's JavaScript
 * deflate: the same FlateDecode streams, several times faster, which is most
 * of what a packet costs beyond merging its datasheets.
 */
function useNativeDeflate(doc: PDFDocument) {
  const context = doc.context;
  context.flateStream = (contents, dict = {}) =>
    context.stream(deflateSync(typeof contents === "string" ? Buffer.from(contents, "latin1") : contents), { ...dict, Filter: "FlateDecode" });
}

function compressSheetContent(doc: PDFDocument, pages: PDFPage[]) {
  const context = doc.context;
  for (const page of pages) {
    const contents = page.node.Contents();
    const refs = contents instanceof PDFArray ? contents.asArray() : [];
    for (const ref of refs) {
      if (!(ref instanceof PDFRef)) continue;
      const stream = context.lookup(ref);
      if (!(stream instanceof PDFContentStream)) continue;
      const compressed = PDFRawStream.of(context.obj({ Filter: PDFName.of("FlateDecode") }), deflateSync(stream.getUnencodedContents()));
      context.assign(ref, compressed);
    }
  }
}

async function embedSitePlan(doc: PDFDocument, input: PacketInput): Promise<Ctx["sitePlan"]> {
  const sp = input.sitePlan;
  if (!sp) return null;
  if (sp.type === "pdf") {
    const src = await PDFDocument.load(sp.bytes, { updateMetadata: false });
    const [page] = await doc.embedPdf(src, [0]);
    return page ? { kind: "page", page } : null;
  }
  // Checked at upload too; a file stored before that check must not be decoded blind.
  assertDecodableImage(sp.bytes, sp.type === "png" ? "png" : "jpeg", "The site plan image");
  const image = sp.type === "png" ? await doc.embedPng(sp.bytes) : await doc.embedJpg(sp.bytes);
  return { kind: "image", image };
}

/** Content that does not fit flows onto added sheets numbered E-003.1, E-003.2 … rather than shrinking. */
function continuationCode(code: string, index: number): string {
  return index === 0 ? code : `${code}.${index}`;
}

function sheetRange(code: string, count: number): string {
  return count > 1 ? `${code} to ${continuationCode(code, count - 1)}` : code;
}

function pageRange(first: number, count: number): string {
  return count > 1 ? `${first}–${first + count - 1}` : String(first);
}

/** Renders the permit packet: sheets in order, title block and review marking on every page, datasheets merged at the end. */
export async function renderPacketPdf(input: PacketInput): Promise<PacketPdf> {
  const sources = await Promise.all(input.datasheets.map((d) => PDFDocument.load(d.bytes, { updateMetadata: false })));
  const oneLine = await prepareOneLine(input.record, (CONTENT.x1 - CONTENT.x0) / (FLOW_TOP - CONTENT.bottom - 40), failuresOf(input.run.results));
  let coverGuess = 1;
  for (let attempt = 0; attempt < 3; attempt += 1) {
    const result = await renderOnce(input, sources, oneLine, coverGuess);
    if (result.stable) return result.pdf;
    coverGuess = result.coverPages;
  }
  throw new Error("packet layout did not settle");
}

async function renderOnce(
  input: PacketInput,
  sources: PDFDocument[],
  oneLine: OneLineDrawer,
  coverGuess: number,
): Promise<{ stable: boolean; pdf: PacketPdf; coverPages: number }> {
  const doc = await PDFDocument.create();
  useNativeDeflate(doc);
  beginTextLayer(doc);
  const fonts = await embedPacketFonts(doc);
  const sitePlan = await embedSitePlan(doc, input);
  if (input.approval?.stampImage) assertDecodableImage(input.approval.stampImage.bytes, input.approval.stampImage.type === "png" ? "png" : "jpeg", "The stamp image");
  const stamp = input.approval?.stampImage
    ? input.approval.stampImage.type === "png"
      ? await doc.embedPng(input.approval.stampImage.bytes)
      : await doc.embedJpg(input.approval.stampImage.bytes)
    : null;

  // Pass over the sheets after the cover to learn their page ranges for the index.
  const draftModel = buildPacketModel(input);
  const ctx: Ctx = { doc, fonts, model: draftModel, input, sitePlan, oneLine };
  const infos: PageInfo[] = [];
  const sheetPages: SheetPages[] = [];
  let next = coverGuess + 1;
  const text = new Map<string, string>();
  const numbers = new Map<string, string>();
  const bodyPages: { sheet: Sheet; pages: PDFPage[] }[] = [];
  for (const sheet of draftModel.sheets.slice(1)) {
    const writer = new SheetWriter(ctx, sheet, () => doc.addPage([PAGE_W, PAGE_H]));
    writer.writeBlocks(sheet.blocks);
    bodyPages.push({ sheet, pages: writer.pages });
    text.set(sheet.code, pageRange(next, writer.pages.length));
    numbers.set(sheet.code, sheetRange(sheet.code, writer.pages.length));
    next += writer.pages.length;
  }
  draftModel.datasheets.forEach((d, i) => {
    const n = sources[i]!.getPageCount();
    text.set(d.code, pageRange(next, n));
    next += n;
  });
  text.set(draftModel.sheets[0]!.code, pageRange(1, coverGuess));
  numbers.set(draftModel.sheets[0]!.code, sheetRange(draftModel.sheets[0]!.code, coverGuess));

  // The cover, with the index filled in, goes in front.
  const model = buildPacketModel(input, { sheetPages: text, sheetNumbers: numbers });
  ctx.model = model;
  const coverSheet = model.sheets[0]!;
  let inserted = 0;
  const coverWriter = new SheetWriter(ctx, coverSheet, () => doc.insertPage(inserted++, [PAGE_W, PAGE_H]));
  coverWriter.writeBlocks(coverSheet.blocks);
  const coverPages = coverWriter.pages.length;
  if (coverPages !== coverGuess) {
    endTextLayer(doc);
    return { stable: false, pdf: { bytes: new Uint8Array(), pageCount: 0, sheetPages: [] }, coverPages };
  }

  const push = (sheet: { code: string; title: string }, pages: PDFPage[], datasheet: boolean) => {
    const first = infos.length + 1;
    pages.forEach((page, i) =>
      infos.push({ page, sheet: datasheet ? sheet.code : continuationCode(sheet.code, i), baseSheet: sheet.code, title: sheet.title, index: i + 1, count: pages.length, datasheet }),
    );
    sheetPages.push({ sheet: sheet.code, title: sheet.title, firstPage: first, pageCount: pages.length });
  };
  push(coverSheet, coverWriter.pages, false);
  for (const b of bodyPages) push(b.sheet, b.pages, false);
  for (let i = 0; i < sources.length; i += 1) {
    const src = sources[i]!;
    const copied = await doc.copyPages(src, src.getPageIndices());
    for (const p of copied) doc.addPage(p);
    push(model.datasheets[i]!, copied, true);
  }

  const total = infos.length;
  const streams: MarginStreams = {
    save: doc.context.register(doc.context.stream("q\n")),
    restore: doc.context.register(doc.context.stream("\nQ\n")),
    fontNames: new Map([
      [fonts.bold, PDFName.of("SundocketMarginBold")],
      [fonts.condensed, PDFName.of("SundocketMarginText")],
    ]),
  };
  infos.forEach((info, i) => {
    if (info.datasheet) drawDatasheetMargin(ctx, info, i + 1, total, streams);
    else {
      drawZones(info.page, fonts);
      drawTitleBlock(ctx, info, i + 1, total, stamp);
      drawBand(ctx, info.page);
    }
  });

  endTextLayer(doc);
  compressSheetContent(doc, infos.filter((i) => !i.datasheet).map((i) => i.page));
  const t = model.titleBlock;
  doc.setTitle(`${t.project} — permit packet, revision ${t.revision}`);
  doc.setSubject(model.marking.approved ? "Approved permit packet" : "Permit packet prepared for review");
  doc.setAuthor(t.firm);
  doc.setCreator("Sundocket");
  doc.setProducer("Sundocket (pdf-lib)");
  const when = new Date(input.revision.createdAt);
  doc.setCreationDate(when);
  doc.setModificationDate(when);
  const bytes = await doc.save();
  return { stable: true, pdf: { bytes, pageCount: total, sheetPages }, coverPages };
}
