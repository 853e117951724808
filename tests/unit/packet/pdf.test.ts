import fs from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { parseProjectFile, runChecks } from "@/lib/compliance/index";
import { formatNumber } from "@/lib/packet/format";
import { AHJ_FOOTER, REVIEW_MARKING, SHEET_PLAN } from "@/lib/packet/model";
import { renderPacketPdf } from "@/lib/packet/pdf";
import type { PacketInput, PacketPdf } from "@/lib/packet/types";
import { PDFDocument, StandardFonts, degrees } from "pdf-lib";
import {
  MAX_PV_VOLTAGE_V,
  PV_OUTPUT_ALLOWED_A,
  PV_OUTPUT_AMPACITY_A,
  fixtureInput,
  fixtureRecord,
  makeDatasheetPdf,
  makePng,
} from "./fixtures";
import { readPdfText, type PdfText } from "./pdf-text";

const normal = (s: string) => s.replace(/\s+/g, " ");

function pagesOf(pdf: PacketPdf, text: PdfText, sheet: string): string {
  const s = pdf.sheetPages.find((p) => p.sheet === sheet);
  if (!s) throw new Error(`no sheet ${sheet}`);
  return text.pages.slice(s.firstPage - 1, s.firstPage - 1 + s.pageCount).join(" ");
}

describe("permit packet PDF, unapproved revision with datasheets", () => {
  let input: PacketInput;
  let pdf: PacketPdf;
  let text: PdfText;
  const DATASHEET_PAGES = [3, 2];

  beforeAll(async () => {
    input = fixtureInput({
      datasheets: [
        { title: "Charge controller datasheet", equipmentTag: "CC-1", bytes: await makeDatasheetPdf("MX-150/60", DATASHEET_PAGES[0]!) },
        { title: "Battery datasheet", equipmentTag: "BAT-1", bytes: await makeDatasheetPdf("SW-51100", DATASHEET_PAGES[1]!) },
      ],
    });
    pdf = await renderPacketPdf(input);
    text = await readPdfText(pdf.bytes);
  });

  it("counts its pages as the sheets' pages plus every attached datasheet page", () => {
    const sheetPageTotal = pdf.sheetPages.filter((s) => !s.sheet.startsWith("D-")).reduce((t, s) => t + s.pageCount, 0);
    expect(sheetPageTotal).toBeGreaterThanOrEqual(SHEET_PLAN.length);
    expect(pdf.pageCount).toBe(sheetPageTotal + DATASHEET_PAGES[0]! + DATASHEET_PAGES[1]!);
    expect(text.pages.length).toBe(pdf.pageCount);
  });

  it("carries the review marking on every page, datasheet pages included", () => {
    text.pages.forEach((page, i) => {
      expect(page, `page ${i + 1}`).toContain(REVIEW_MARKING);
      expect(page, `page ${i + 1}`).not.toContain(AHJ_FOOTER);
    });
  });

  it("merges the datasheets in order after the sheets, their own content intact", () => {
    const ds = pdf.sheetPages.filter((s) => s.sheet.startsWith("D-"));
    expect(ds.map((d) => [d.sheet, d.pageCount])).toEqual([["D-001", 3], ["D-002", 2]]);
    expect(text.pages[ds[0]!.firstPage - 1]).toContain("MX-150/60 datasheet page 1");
    expect(text.pages[ds[0]!.firstPage + 1]).toContain("MX-150/60 datasheet page 3");
    expect(text.pages[ds[1]!.firstPage - 1]).toContain("SW-51100 datasheet page 1");
    expect(text.pages[ds[1]!.firstPage - 1]).toContain("D-002 Battery datasheet (BAT-1) — page 1 of 2");
  });

  it("keeps the sheets in plan order, each page naming its sheet in the title block", () => {
    const order = pdf.sheetPages.map((s) => s.sheet);
    expect(order).toEqual([...SHEET_PLAN.map((s) => s.code), "D-001", "D-002"]);
    for (const s of pdf.sheetPages.filter((p) => !p.sheet.startsWith("D-"))) {
      for (let p = s.firstPage; p < s.firstPage + s.pageCount; p += 1) {
        expect(text.pages[p - 1]).toContain(s.sheet);
        expect(text.pages[p - 1]).toContain(`${p} / ${pdf.pageCount}`);
      }
    }
  });

  it("lists every sheet on the cover's index with the pages it actually occupies", () => {
    const cover = pagesOf(pdf, text, "G-001");
    for (const s of pdf.sheetPages) {
      const range = s.pageCount > 1 ? `${s.firstPage}–${s.firstPage + s.pageCount - 1}` : String(s.firstPage);
      expect(cover).toContain(normal(`${s.sheet} ${s.title} ${range}`));
    }
  });

  it("prints the maximum-voltage and ampacity figures exactly as the check results give them", () => {
    const calcs = pagesOf(pdf, text, "E-003");
    // 167.2 V: 3 × 49.5 V × 1.126 (NEC 2020 690.7(A)(1)); 36.4 A: 40 A × 0.91 (Table 310.16, 310.15(B)(1)).
    expect(calcs).toContain(`Maximum PV system voltage ${formatNumber(MAX_PV_VOLTAGE_V)} V`);
    expect(calcs).toContain(`Ampacity under conditions of use ${formatNumber(PV_OUTPUT_AMPACITY_A)} A`);
    expect(calcs).toContain(`Allowed ampacity ${formatNumber(PV_OUTPUT_ALLOWED_A)} A`);
    for (const r of input.run.results) {
      expect(calcs).toContain(r.codeRefs[0]!);
    }
  });

  it("shows each status as a word with its shape", () => {
    const calcs = pagesOf(pdf, text, "E-003");
    expect(calcs).toContain("■ FAIL");
    expect(calcs).toContain("✓ PASS");
    expect(calcs).toContain("▲ WARNING");
    expect(calcs).toContain("○ NEEDS INPUT");
    expect(calcs).toContain("◆ ATTEST");
  });

  it("says on the cover that a packet with a failing check is a draft, and why", () => {
    const cover = pagesOf(pdf, text, "G-001");
    expect(cover).toContain("DRAFT");
    expect(cover).toContain("1 check fail");
    expect(cover).toContain("no datasheet for INV-1");
    expect(cover).not.toContain("no datasheet for CC-1");
  });

  it("lists the required labels with where each goes", () => {
    const labels = pagesOf(pdf, text, "E-006");
    for (const l of input.labels) {
      expect(labels).toContain(l.title);
      expect(labels).toContain(normal(l.location));
    }
  });

  it("uses landscape ANSI B sheets and keeps the datasheets' own page size", () => {
    expect(text.sizes[0]).toEqual({ width: 1224, height: 792 });
    expect(text.sizes[text.sizes.length - 1]).toEqual({ width: 612, height: 792 });
  });
});

describe("permit packet PDF, approved revision", () => {
  let pdf: PacketPdf;
  let text: PdfText;

  beforeAll(async () => {
    pdf = await renderPacketPdf(
      fixtureInput({
        approval: {
          reviewerName: "Ines Calloway-Marsh",
          licenceNumber: "PE-E 40417",
          licenceState: "Quillon",
          licenceDiscipline: "Electrical engineering",
          approvedAt: "2026-12-01T09:30:00.000Z",
          stampImage: { bytes: makePng(40, 40, [180, 30, 40]), type: "png" },
          recordSha256: "9f2c".repeat(16),
        },
        datasheets: [{ title: "Module datasheet", equipmentTag: "PV-MOD", bytes: await makeDatasheetPdf("BF-400M", 2) }],
      }),
    );
    text = await readPdfText(pdf.bytes);
  });

  it("carries the licensee, licence number, issuing region and date and the AHJ footer on every page, and no review marking", () => {
    text.pages.forEach((page, i) => {
      expect(page, `page ${i + 1}`).toContain("Ines Calloway-Marsh");
      expect(page, `page ${i + 1}`).toContain("PE-E 40417");
      expect(page, `page ${i + 1}`).toContain("Quillon");
      expect(page, `page ${i + 1}`).toContain("2026-12-01");
      expect(page, `page ${i + 1}`).toContain(AHJ_FOOTER);
      expect(page, `page ${i + 1}`).not.toContain(REVIEW_MARKING);
      expect(page, `page ${i + 1}`).not.toContain("NOT FOR CONSTRUCTION");
    });
    const sheetPage = text.pages[0]!;
    expect(sheetPage).toContain("Approved 2026-12-01");
  });

  it("records the approval bound to the record hash on the review record", () => {
    const review = pagesOf(pdf, text, "G-004");
    expect(review).toContain("9f2c".repeat(16));
    expect(review).toContain("Approved");
  });
});

describe("permit packet PDF, site plan and overrides", () => {
  it("embeds the first page of a site plan PDF and a jurisdiction's cover override", async () => {
    const plan = await PDFDocument.create();
    const font = await plan.embedFont(StandardFonts.Helvetica);
    plan.addPage([792, 612]).drawText("PLAN VIEW NORTH ARROW", { x: 100, y: 300, size: 20, font });
    plan.addPage([792, 612]).drawText("SECOND PLAN PAGE", { x: 100, y: 300, size: 20, font });
    const pdf = await renderPacketPdf(
      fixtureInput({
        sitePlan: { bytes: await plan.save(), type: "pdf", fileName: "site-plan.pdf" },
        templateOverrides: { cover: "# {{project.name}}\nSubmitted to {{jurisdiction.name}} under the county's counter rules.\n~~~\n| Sheet | Title | Pages |\n|---|---|---|\n{{#each sheets}}\n| {{code}} | {{title}} | {{pages}} |\n{{/each}}\n" },
      }),
    );
    const text = await readPdfText(pdf.bytes);
    const site = pagesOf(pdf, text, "G-003");
    expect(site).toContain("PLAN VIEW NORTH ARROW");
    expect(site).not.toContain("SECOND PLAN PAGE");
    expect(site).toContain("Mechanical closet off the mud room");
    expect(text.pages[0]).toContain("Submitted to Quillon County Building Division under the county's counter rules.");
    expect(text.pages[0]).not.toContain("SCOPE OF WORK");
  });

  it("refuses an override naming a variable the packet does not supply", async () => {
    await expect(renderPacketPdf(fixtureInput({ templateOverrides: { "general-notes": "ok\n{{project.parcelNumber}}" } }))).rejects.toThrow(
      /general-notes, line 2: .*project\.parcelNumber/,
    );
  });
});

describe("permit packet PDF from the engine's own results", () => {
  const examples = fs.readdirSync("examples").filter((f) => f.endsWith(".json"));

  it.each(examples)("%s: the calculations and conductor schedule print the engine's voltage and ampacity", async (file) => {
    const parsed = parseProjectFile(JSON.parse(fs.readFileSync(`examples/${file}`, "utf8")));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const run = runChecks(parsed.record);
    const pdf = await renderPacketPdf({ ...fixtureInput(), record: parsed.record, run, labels: [] });
    const text = await readPdfText(pdf.bytes);
    const calcs = pagesOf(pdf, text, "E-003");
    const schedule = pagesOf(pdf, text, "E-004");
    let seen = 0;
    for (const r of run.results) {
      for (const v of r.values) {
        if (typeof v.value !== "number") continue;
        if ((r.checkId === "max-pv-voltage" && v.key === "maxVoltageV") || (r.checkId === "conductor-ampacity" && v.key === "allowedA")) {
          expect(calcs).toContain(normal(`${v.label} ${formatNumber(v.value)} ${v.unit}`));
          if (r.checkId === "conductor-ampacity") expect(schedule).toContain(`${formatNumber(v.value)} ${v.unit}`);
          seen += 1;
        }
      }
    }
    expect(seen).toBeGreaterThan(0);
    text.pages.forEach((p) => expect(p).toContain(REVIEW_MARKING));
  });
});

describe("schedules longer than a sheet", () => {
  it("continue on further pages of the same sheet with the column headings repeated", async () => {
    const base = fixtureRecord.circuits[3]!;
    const circuits = Array.from({ length: 90 }, (_, i) => ({ ...base, tag: `B${i + 1}`, kind: "ac-branch" as const, loadCurrentA: 10 }));
    const pdf = await renderPacketPdf(fixtureInput({ record: { ...fixtureRecord, circuits: [...fixtureRecord.circuits, ...circuits] } }));
    const text = await readPdfText(pdf.bytes);
    const sheet = pdf.sheetPages.find((s) => s.sheet === "E-004")!;
    expect(sheet.pageCount).toBeGreaterThan(1);
    const pages = text.pages.slice(sheet.firstPage - 1, sheet.firstPage - 1 + sheet.pageCount);
    pages.forEach((p, i) => {
      // Each page repeats the column headings of the table it continues: the conductor schedule, then the raceway fill.
      expect(p, `E-004 page ${i + 1}`).toMatch(/Circuit From → to Kind Conductor|Circuit Raceway Raceway area \(Table 4\)/);
      // Overflow flows onto added sheets numbered E-004.1, E-004.2 … (the sheet number in the heading and title block).
      const number = i === 0 ? "E-004" : `E-004.${i}`;
      expect(p).toContain(`${number} CONDUCTOR AND OVERCURRENT SCHEDULE`);
      expect(p).toContain(`sheet ${i + 1} of ${sheet.pageCount} of E-004`);
    });
    const all = pages.join(" ");
    for (const c of circuits) expect(all).toContain(` ${c.tag} INV-1 → LC-1 `);
    const cover = text.pages[0]!;
    expect(cover).toContain(`E-004 to E-004.${sheet.pageCount - 1} Conductor and overcurrent schedule ${sheet.firstPage}–${sheet.firstPage + sheet.pageCount - 1}`);
  });
});

describe("datasheet pages as they come", () => {
  it("stamps rotated pages and pages that leave a transform behind, with the band at the same size", async () => {
    const src = await PDFDocument.create();
    const font = await src.embedFont(StandardFonts.Helvetica);
    for (const angle of [0, 90, 180, 270]) {
      const page = src.addPage([612, 792]);
      page.setRotation(degrees(angle));
      page.drawText(`rotated ${angle}`, { x: 100, y: 400, size: 20, font });
    }
    const last = src.addPage([612, 792]);
    last.drawText("left scaled", { x: 100, y: 400, size: 20, font });
    // A content stream ending with an unbalanced transform, as some generators write.
    last.node.addContentStream(src.context.register(src.context.stream("2 0 0 2 300 300 cm\n")));
    const pdf = await renderPacketPdf(fixtureInput({ datasheets: [{ title: "Odd pages", bytes: await src.save() }] }));
    const text = await readPdfText(pdf.bytes);
    const first = pdf.sheetPages.find((s) => s.sheet === "D-001")!.firstPage;
    const sizes: number[] = [];
    for (let p = first; p < first + 5; p += 1) {
      expect(text.pages[p - 1]).toContain(REVIEW_MARKING);
      sizes.push(text.items[p - 1]!.find((i) => i.str === REVIEW_MARKING)!.size);
    }
    // The band is set at the sheets' 8 pt minimum on every page, upright or rotated; a leaked 2× transform would double it.
    for (const size of sizes) expect(size).toBeCloseTo(8, 2);
  });
});
