import {
  AlignmentType,
  BorderStyle,
  Document,
  Footer,
  Header,
  HeadingLevel,
  ImageRun,
  Packer,
  PageNumber,
  PageOrientation,
  Paragraph,
  ShadingType,
  Table,
  TableCell,
  TableRow,
  TextRun,
  WidthType,
  type FileChild,
} from "docx";
import type { CheckResult, CheckStatus } from "../compliance/types";
import { labelArtwork, type Rgb } from "../labels/artwork";
import { docxFigures, type DocxFigures, type DocxImage } from "./docx-figures";
import { STATUS_SHAPE, STATUS_WORD, formatCheckValue } from "./format";
import type { Block, Cell } from "./markup";
import { buildPacketModel, type PacketModel } from "./model";
import type { PacketInput, SheetPages } from "./types";

const FONT = "DejaVu Sans";
/** Printed on every page of the editable copy. */
export const DOCX_UNSEALED = "UNSEALED COPY — THE SEALED PDF GOVERNS";
const SIGNAL_HEX = "BF121F";
const BORDER = { style: BorderStyle.SINGLE, size: 4, color: "777777" } as const;
const CELL_BORDERS = { top: BORDER, bottom: BORDER, left: BORDER, right: BORDER };

const hex = (c: Rgb) =>
  [c.r, c.g, c.b].map((v) => Math.round(v * 255).toString(16).padStart(2, "0")).join("").toUpperCase();

function run(text: string, opts: { bold?: boolean; size?: number; color?: string } = {}) {
  return new TextRun({ text, font: FONT, bold: opts.bold, size: opts.size ?? 18, color: opts.color });
}

function statusRuns(status: CheckStatus, size = 16): TextRun[] {
  const fail = status === "fail";
  return [run(`${STATUS_SHAPE[status]} ${STATUS_WORD[status]}`, { bold: true, size, color: fail ? SIGNAL_HEX : undefined })];
}

function cellParagraph(c: Cell, header: boolean): Paragraph {
  if (typeof c !== "string" && c.status) return new Paragraph({ children: statusRuns(c.status) });
  const text = typeof c === "string" ? c : c.text;
  const bold = header || (typeof c !== "string" && c.bold);
  return new Paragraph({ children: [run(text, { bold, size: 16 })] });
}

function table(columns: { header: string; weight: number }[], rows: Cell[][]): Table {
  const total = columns.reduce((t, c) => t + c.weight, 0) || 1;
  const widths = columns.map((c) => Math.round((c.weight / total) * 100));
  const headerRow = new TableRow({
    tableHeader: true,
    children: columns.map(
      (c, i) =>
        new TableCell({
          width: { size: widths[i] ?? 10, type: WidthType.PERCENTAGE },
          shading: { type: ShadingType.CLEAR, color: "auto", fill: "E6E6EA" },
          borders: CELL_BORDERS,
          children: [cellParagraph(c.header, true)],
        }),
    ),
  });
  const body = rows.map(
    (r) =>
      new TableRow({
        cantSplit: true,
        children: r.map(
          (c, i) =>
            new TableCell({
              width: { size: widths[i] ?? 10, type: WidthType.PERCENTAGE },
              borders: CELL_BORDERS,
              children: [cellParagraph(c, false)],
            }),
        ),
      }),
  );
  return new Table({ width: { size: 100, type: WidthType.PERCENTAGE }, rows: [headerRow, ...body] });
}

function checkChildren(r: CheckResult): FileChild[] {
  const title = r.subject && !r.title.includes(r.subject) ? `${r.title}: ${r.subject}` : r.title;
  const out: FileChild[] = [
    new Paragraph({ heading: HeadingLevel.HEADING_3, children: [...statusRuns(r.status, 20), run(`  ${title}`, { bold: true, size: 20 })] }),
    new Paragraph({ children: [run(r.codeRefs.join("; "), { bold: true, size: 16 })] }),
  ];
  if (r.message) out.push(new Paragraph({ children: [run(r.message, { size: 16 })] }));
  if (r.reason) out.push(new Paragraph({ children: [run("Reason: ", { bold: true, size: 16 }), run(r.reason, { size: 16 })] }));
  if (r.remedy) out.push(new Paragraph({ children: [run("Remedy: ", { bold: true, size: 16 }), run(r.remedy.text, { size: 16, color: r.status === "fail" ? SIGNAL_HEX : undefined })] }));
  if (r.formula) out.push(new Paragraph({ children: [run("Formula: ", { bold: true, size: 16 }), run(r.formula, { size: 16 })] }));
  const rows: Cell[][] = [
    ...r.inputs.map((i): Cell[] => ["Input", i.label, formatCheckValue(i)]),
    ...r.values.map((v): Cell[] => ["Result", v.label, { text: formatCheckValue(v), bold: true }]),
  ];
  if (rows.length) out.push(table([{ header: "", weight: 1 }, { header: "Item", weight: 4 }, { header: "Value", weight: 2 }], rows));
  if (r.missing.length) out.push(new Paragraph({ children: [run("Missing: ", { bold: true, size: 16 }), run(r.missing.join(", "), { size: 16 })] }));
  out.push(new Paragraph({ children: [] }));
  return out;
}

function labelTable(l: PacketInput["labels"][number]): FileChild[] {
  const art = labelArtwork(l);
  const symbol = art.header.alertSymbol ? "⚠ " : "";
  return [
    new Table({
      width: { size: 50, type: WidthType.PERCENTAGE },
      rows: [
        new TableRow({
          children: [
            new TableCell({
              shading: { type: ShadingType.CLEAR, color: "auto", fill: hex(art.header.background) },
              borders: CELL_BORDERS,
              children: [new Paragraph({ alignment: AlignmentType.CENTER, children: [run(`${symbol}${art.signalWord}`, { bold: true, size: 28, color: hex(art.header.text) })] })],
            }),
          ],
        }),
        new TableRow({
          children: [
            new TableCell({
              borders: CELL_BORDERS,
              children: [
                new Paragraph({ alignment: AlignmentType.CENTER, children: [run(art.title, { bold: true, size: 20 })] }),
                ...art.lines.map((line) => new Paragraph({ alignment: AlignmentType.CENTER, children: [run(line, { size: 18 })] })),
              ],
            }),
          ],
        }),
      ],
    }),
    new Paragraph({
      children: [
        run(`${l.id} · ${l.codeRef}`, { bold: true, size: 16 }),
        run(` · Location: ${l.location}${l.equipmentTag ? ` · Equipment: ${l.equipmentTag}` : ""}`, { size: 16 }),
      ],
    }),
    new Paragraph({
      children: [run(`Letters at least ${art.minLetterHeightIn.signalWord} in (signal word) and ${art.minLetterHeightIn.text} in (text).`, { size: 14 })],
    }),
    new Paragraph({ children: [] }),
  ];
}

/** Pixel size from a PNG header or a JPEG start-of-frame marker, so the picture keeps its proportions. */
export function imageSize(bytes: Uint8Array, type: "png" | "jpeg"): { width: number; height: number } | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (type === "png") return bytes.length >= 24 ? { width: view.getUint32(16), height: view.getUint32(20) } : null;
  let i = 2;
  while (i + 9 < bytes.length) {
    if (bytes[i] !== 0xff) return null;
    const marker = bytes[i + 1]!;
    const length = view.getUint16(i + 2);
    // SOF0…SOF15 except DHT (C4), JPG (C8) and DAC (CC) carry the frame size.
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      return { height: view.getUint16(i + 5), width: view.getUint16(i + 7) };
    }
    i += 2 + length;
  }
  return null;
}

/** A drawing at the width of the page's text (9 in of a landscape letter page, at the 96 px per inch docx measures in), within 5.5 in of height. */
function imageRun(image: DocxImage, name: string, description: string): ImageRun {
  const scale = Math.min((9 * 96) / image.width, (5.5 * 96) / image.height);
  return new ImageRun({
    type: "png",
    data: image.png,
    transformation: { width: Math.round(image.width * scale), height: Math.round(image.height * scale) },
    altText: { name, description, title: name },
  });
}

function blockChildren(block: Block, input: PacketInput, figures: DocxFigures): FileChild[] {
  switch (block.kind) {
    case "heading":
      return [new Paragraph({ heading: block.level === 1 ? HeadingLevel.HEADING_2 : HeadingLevel.HEADING_3, children: [run(block.text, { bold: true, size: block.level === 1 ? 24 : 20 })] })];
    case "paragraph":
      return [new Paragraph({ spacing: { after: 80 }, children: [run(block.text)] })];
    case "list":
      return block.items.map(
        (item, i) =>
          new Paragraph({
            indent: { left: 360, hanging: 360 },
            spacing: { after: 40 },
            children: [run(`${block.ordered ? `${i + 1}.` : "•"}\t${item}`)],
          }),
      );
    case "caution":
      return [
        new Paragraph({
          border: { top: BORDER, bottom: BORDER, left: { ...BORDER, size: 18, color: "000000" }, right: BORDER },
          spacing: { before: 60, after: 120 },
          children: [run("▲ ", { bold: true }), run(block.text, { bold: true })],
        }),
      ];
    case "fields":
      return [table([{ header: "Item", weight: 1 }, { header: "Value", weight: 2.4 }], block.rows.map(([k, v]): Cell[] => [{ text: k, bold: true }, v])), new Paragraph({ children: [] })];
    case "table":
      return [
        ...(block.caption ? [new Paragraph({ heading: HeadingLevel.HEADING_3, children: [run(block.caption, { bold: true, size: 20 })] })] : []),
        table(block.columns, block.rows),
        new Paragraph({ children: [] }),
      ];
    case "check":
      return checkChildren(block.result);
    case "figure": {
      if (block.figure === "site-plan") {
        const sp = input.sitePlan;
        if (sp && sp.type !== "pdf") {
          const size = imageSize(sp.bytes, sp.type) ?? { width: 3, height: 2 };
          // 9 × 5.5 in of a landscape letter page, at the 96 px per inch docx measures in.
          const scale = Math.min((9 * 96) / size.width, (5.5 * 96) / size.height);
          return [
            new Paragraph({
              children: [new ImageRun({ type: sp.type === "png" ? "png" : "jpg", data: sp.bytes, transformation: { width: Math.round(size.width * scale), height: Math.round(size.height * scale) }, altText: { name: "Site plan", description: sp.fileName, title: "Site plan" } })],
            }),
          ];
        }
        return [new Paragraph({ children: [run(sp ? `Site plan ${sp.fileName}: see sheet G-003 of the PDF packet.` : "No site plan is attached to this revision.", { bold: !sp })] })];
      }
      if (block.figure === "split-phase") {
        const [inverter, panel] = block.caption.split("|");
        const image = figures.threeLine.get(block.caption);
        if (image) return [new Paragraph({ children: [imageRun(image, "Three-line detail", `Three-line detail: ${inverter} (120 V) feeding ${panel} (120/240 V), L1–L2 jumper, neutral and EGC`)] })];
        return [new Paragraph({ children: [run(`Three-line detail (${inverter} to ${panel}, L1–L2 jumper and neutral) is drawn on sheet E-007 of the PDF packet.`)] })];
      }
      if (figures.oneLine) {
        return [
          new Paragraph({ children: [imageRun(figures.oneLine, "One-line diagram", `One-line diagram of ${input.record.name}, drawn from the design record`)] }),
          new Paragraph({ children: [run("Circuit tags refer to the conductor schedule (E-004); equipment tags to the equipment schedule (E-005).", { size: 16 })] }),
        ];
      }
      return [new Paragraph({ children: [run("No circuits or equipment are entered, so there is no one-line diagram yet.")] })];
    }
    case "labels":
      return block.labels.length ? block.labels.flatMap(labelTable) : [new Paragraph({ children: [run("No labels are required for this system.")] })];
    case "column-break":
      return [];
  }
}

function marking(model: PacketModel): string {
  return model.marking.approved ? model.marking.approvalLines[0] ?? "" : model.marking.reviewText;
}

export interface DocxOptions {
  /** Page ranges from the PDF render, so the index in the document matches the PDF. */
  sheetPages?: SheetPages[];
}

/** The packet as an editable document: the same sheets as headings, paragraphs and tables. */
export async function renderPacketDocx(input: PacketInput, options: DocxOptions = {}): Promise<Uint8Array> {
  const pages = new Map(
    (options.sheetPages ?? []).map((s) => [s.sheet, s.pageCount > 1 ? `${s.firstPage}–${s.firstPage + s.pageCount - 1}` : String(s.firstPage)]),
  );
  const model = buildPacketModel(input, { sheetPages: pages });
  const figures = await docxFigures(input, model);
  const t = model.titleBlock;
  const children: FileChild[] = [];
  model.sheets.forEach((sheet, i) => {
    children.push(
      new Paragraph({
        heading: HeadingLevel.HEADING_1,
        pageBreakBefore: i > 0,
        children: [run(`${sheet.code}  ${sheet.title}`, { bold: true, size: 30 })],
      }),
    );
    for (const block of sheet.blocks) children.push(...blockChildren(block, input, figures));
  });
  if (model.datasheets.length) {
    children.push(new Paragraph({ heading: HeadingLevel.HEADING_1, pageBreakBefore: true, children: [run("Attached datasheets", { bold: true, size: 30 })] }));
    children.push(
      table(
        [{ header: "Sheet", weight: 1 }, { header: "Title", weight: 4 }, { header: "Equipment", weight: 1.2 }, { header: "Pages in the PDF packet", weight: 1.5 }],
        model.datasheets.map((d): Cell[] => [d.code, d.title, d.equipmentTag ?? "—", pages.get(d.code) ?? "see the PDF packet"]),
      ),
    );
  }
  const headerText = marking(model);
  const doc = new Document({
    creator: "Sundocket",
    title: `${t.project} — permit packet, revision ${t.revision}`,
    description: model.marking.approved ? "Approved permit packet" : "Permit packet prepared for review",
    styles: { default: { document: { run: { font: FONT, size: 18 } } } },
    sections: [
      {
        properties: {
          page: {
            size: { width: 12240, height: 15840, orientation: PageOrientation.LANDSCAPE },
            margin: { top: 1000, bottom: 1000, left: 1080, right: 900, header: 400, footer: 400 },
          },
        },
        headers: {
          default: new Header({
            children: [
              new Paragraph({ alignment: AlignmentType.CENTER, children: [run(headerText, { bold: true, size: 16 })] }),
              // An editable copy can be changed after sealing; every page says which document governs.
              new Paragraph({ alignment: AlignmentType.CENTER, children: [run(DOCX_UNSEALED, { bold: true, size: 16 })] }),
              new Paragraph({
                alignment: AlignmentType.CENTER,
                children: [run(`${t.project} · ${t.address} · ${t.firm} · Rev ${t.revision} · ${t.date}`, { size: 16 })],
              }),
            ],
          }),
        },
        footers: {
          default: new Footer({
            children: [
              new Paragraph({
                alignment: AlignmentType.CENTER,
                children: [
                  run(model.marking.approved ? model.marking.footer : model.marking.reviewText, { bold: true, size: 16 }),
                  new TextRun({ font: FONT, size: 16, children: ["   Page ", PageNumber.CURRENT, " of ", PageNumber.TOTAL_PAGES] }),
                ],
              }),
            ],
          }),
        },
        children,
      },
    ],
  });
  const buffer = await Packer.toBuffer(doc);
  return new Uint8Array(buffer);
}
