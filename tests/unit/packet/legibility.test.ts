import fs from "node:fs";
import { getDocument, OPS } from "pdfjs-dist/legacy/build/pdf.mjs";
import { beforeAll, describe, expect, it } from "vitest";
import { parseProjectFile, runChecks } from "@/lib/compliance/index";
import { requiredLabels } from "@/lib/compliance/labels";
import { REVIEW_MARKING } from "@/lib/packet/model";
import { renderPacketPdf } from "@/lib/packet/pdf";
import type { PacketPdf } from "@/lib/packet/types";
import { PDFDocument, StandardFonts } from "pdf-lib";
import { fixtureInput } from "./fixtures";

/**
 * Every character Sundocket draws is at least 8 pt at full size (17 × 11):
 * printed at half size that is still about 4 pt, and plan-review guides ask
 * for 1/8 in (9 pt) lettering on the full-size set (common practice). Table
 * rules are at least 0.5 pt so they survive a half-size copy (common practice).
 * Text inside an uploaded datasheet is the manufacturer's and is exempt.
 */
const MIN_PT = 8;
const MIN_RULE_PT = 0.5;

interface Run {
  page: number;
  str: string;
  size: number;
}

async function textRuns(bytes: Uint8Array): Promise<{ runs: Run[]; lineWidths: { page: number; width: number }[] }> {
  const doc = await getDocument({ data: bytes.slice(), useSystemFonts: false, disableFontFace: true }).promise;
  const runs: Run[] = [];
  const lineWidths: { page: number; width: number }[] = [];
  for (let i = 1; i <= doc.numPages; i += 1) {
    const page = await doc.getPage(i);
    const content = await page.getTextContent();
    for (const it of content.items) {
      if (!("str" in it) || it.str.trim() === "") continue;
      const [a, b] = it.transform as number[];
      runs.push({ page: i, str: it.str, size: Math.hypot(a ?? 0, b ?? 0) });
    }
    const ops = await page.getOperatorList();
    ops.fnArray.forEach((fn, k) => {
      if (fn === OPS.setLineWidth) lineWidths.push({ page: i, width: (ops.argsArray[k] as number[])[0]! });
    });
  }
  await doc.destroy();
  return { runs, lineWidths };
}

/** A manufacturer's datasheet set in 6 pt, as many are. */
async function smallPrintDatasheet(): Promise<Uint8Array> {
  const src = await PDFDocument.create();
  const font = await src.embedFont(StandardFonts.Helvetica);
  const page = src.addPage([612, 792]);
  page.drawText("Manufacturer fine print at six points", { x: 60, y: 400, size: 6, font });
  return src.save();
}

describe("the seeded hut packet is legible at print scale", () => {
  let pdf: PacketPdf;
  let runs: Run[];
  let lineWidths: { page: number; width: number }[];
  let datasheetPages: Set<number>;

  beforeAll(async () => {
    const parsed = parseProjectFile(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const run = runChecks(parsed.record);
    pdf = await renderPacketPdf({
      ...fixtureInput(),
      record: parsed.record,
      run,
      labels: requiredLabels(parsed.record, run.edition),
      datasheets: [{ title: "Battery datasheet", equipmentTag: "BAT-1", bytes: await smallPrintDatasheet() }],
    });
    ({ runs, lineWidths } = await textRuns(pdf.bytes));
    datasheetPages = new Set<number>();
    for (const s of pdf.sheetPages.filter((x) => x.sheet.startsWith("D-"))) {
      for (let p = s.firstPage; p < s.firstPage + s.pageCount; p += 1) datasheetPages.add(p);
    }
  }, 120_000);

  it("sets no generated text under 8 pt on any sheet", () => {
    const sheetRuns = runs.filter((r) => !datasheetPages.has(r.page));
    expect(sheetRuns.length).toBeGreaterThan(2000);
    const small = sheetRuns.filter((r) => r.size < MIN_PT - 0.01).map((r) => `page ${r.page}: ${r.size.toFixed(2)} pt "${r.str}"`);
    expect(small).toEqual([]);
  });

  it("stamps datasheet margins at 8 pt or more while the datasheet's own small print is left as it is", () => {
    expect(datasheetPages.size).toBe(1);
    const onDatasheet = runs.filter((r) => datasheetPages.has(r.page));
    const fine = onDatasheet.find((r) => r.str.includes("fine print"));
    expect(fine?.size).toBeCloseTo(6, 1);
    const stamp = onDatasheet.filter((r) => REVIEW_MARKING.includes(r.str.trim()) || r.str.includes("packet page"));
    expect(stamp.length).toBeGreaterThan(0);
    for (const r of stamp) expect(r.size, r.str).toBeGreaterThanOrEqual(MIN_PT - 0.01);
  });

  it("draws no rule on a sheet thinner than 0.5 pt", () => {
    const thin = lineWidths.filter((l) => !datasheetPages.has(l.page) && l.width > 0 && l.width < MIN_RULE_PT - 0.001);
    expect(thin.map((l) => `page ${l.page}: ${l.width} pt`).slice(0, 20)).toEqual([]);
  });

  it("has a grounding and bonding sheet with the three-line detail of the 120 V inverter on the 120/240 V panel", () => {
    const sheet = pdf.sheetPages.find((s) => s.sheet === "E-007")!;
    expect(sheet.title).toBe("Grounding and bonding");
    const text = runs.filter((r) => r.page >= sheet.firstPage && r.page < sheet.firstPage + sheet.pageCount).map((r) => r.str).join(" ");
    // The hut's record names its rod, a 6 AWG copper GEC and the one bond in P-1; the sheet prints them in words.
    expect(text).toContain("Ground rod");
    expect(text).toContain("6 AWG Cu");
    expect(text).toContain("at P-1");
    expect(text).toContain("BONDED TO GROUND HERE");
    expect(text).not.toMatch(/NOT GIVEN: (Grounding electrodes|Neutral-to-ground bond)|record field|grounding\.electrodes/);
    expect(text).toContain("THREE-LINE DETAIL: INV-1 (120 V) FEEDING P-1 (120/240 V)");
    expect(text).toContain("L1–L2 JUMPER");
    expect(text).toContain("EQUIPMENT GROUNDING CONDUCTORS");
  });

  it("keeps a heading on the page of what it heads", () => {
    const heading = runs.find((r) => r.str === "GROUNDING AND BONDING CHECKS")!;
    expect(heading).toBeDefined();
    const onPage = runs.filter((r) => r.page === heading.page).map((r) => r.str);
    // A check card begins "Check <id> · <code section>"; the first card sits under its heading.
    expect(onPage.slice(onPage.indexOf("GROUNDING AND BONDING CHECKS")).some((s) => s.startsWith("Check "))).toBe(true);
  });

  it("prints no record path on any sheet: a missing value is named by its field label", () => {
    const sheetText = runs.filter((r) => !datasheetPages.has(r.page)).map((r) => r.str).join(" ");
    const paths = sheetText.match(/\b(?:equipment|arrays|circuits|loads|site|grounding|jurisdiction)\.[A-Za-z0-9]+(?:\.[A-Za-z0-9]+)*/g) ?? [];
    expect(paths).toEqual([]);
  });

  it("keeps a blank AHJ approval stamp box on every sheet", () => {
    const sheetPageNumbers = new Set(runs.map((r) => r.page).filter((p) => !datasheetPages.has(p)));
    expect(sheetPageNumbers.size).toBeGreaterThan(10);
    for (const p of sheetPageNumbers) expect(runs.some((r) => r.page === p && r.str.includes("AHJ APPROVAL STAMP")), `page ${p}`).toBe(true);
  });

  it("flows long content onto added sheets rather than shrinking it", () => {
    const calcs = pdf.sheetPages.find((s) => s.sheet === "E-003")!;
    expect(calcs.pageCount).toBeGreaterThan(1);
    const onAdded = runs.filter((r) => r.page === calcs.firstPage + 1).map((r) => r.str).join(" ");
    expect(onAdded).toContain("E-003.1");
  });
});
