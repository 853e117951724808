import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { PDFDocument, StandardFonts } from "pdf-lib";
import fontkit from "@pdf-lib/fontkit";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import { layoutOneLine } from "@/lib/diagram/layout";
import { drawOneLine } from "@/lib/diagram/pdf";
import { oneLineSvg } from "@/lib/diagram/svg";
import { PALETTE } from "@/lib/diagram/scene";
import { danglingRecord, emptyRecord, hybrid, standAlone } from "./fixtures";

const DEJAVU = path.resolve(__dirname, "../../../node_modules/dejavu-fonts-ttf/ttf");
// pdf.js reads the standard 14 fonts' metrics from here when a page uses them.
const STANDARD_FONTS = path.resolve(__dirname, "../../../node_modules/pdfjs-dist/standard_fonts") + "/";

async function pageText(bytes: Uint8Array): Promise<string[]> {
  const doc = await getDocument({ data: bytes, standardFontDataUrl: STANDARD_FONTS, isEvalSupported: false }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent();
    pages.push(content.items.map((it) => ("str" in it ? it.str : "")).join("\n"));
  }
  await doc.destroy();
  return pages;
}

async function diagramPdf(
  layout: Awaited<ReturnType<typeof layoutOneLine>>,
  fontKind: "standard" | "embedded",
  box = { x: 36, y: 36, width: 1152, height: 720 },
) {
  const doc = await PDFDocument.create();
  doc.registerFontkit(fontkit);
  const fonts =
    fontKind === "standard"
      ? { regular: await doc.embedFont(StandardFonts.Helvetica), bold: await doc.embedFont(StandardFonts.HelveticaBold) }
      : {
          regular: await doc.embedFont(readFileSync(path.join(DEJAVU, "DejaVuSans.ttf")), { subset: true }),
          bold: await doc.embedFont(readFileSync(path.join(DEJAVU, "DejaVuSans-Bold.ttf")), { subset: true }),
        };
  const page = doc.addPage([1224, 792]);
  drawOneLine(page, layout, box, fonts);
  return doc.save();
}

describe("one-line SVG", () => {
  it("is a self-contained drawing with a viewBox, a title per box and circuit, and the callouts", async () => {
    const layout = await layoutOneLine(standAlone());
    const svg = oneLineSvg(layout, { title: "One-line diagram, Ridgeback cabin" });
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg).toContain(`viewBox="0 0 ${layout.width} ${layout.height}"`);
    expect(svg).toContain("<title id=\"one-line-title\">One-line diagram, Ridgeback cabin</title>");
    expect(svg).not.toMatch(/<script|href=|<image/);
    for (const n of layout.nodes) expect(svg).toContain(`data-tag="${n.tag}"`);
    for (const e of layout.edges) expect(svg).toContain(`data-tag="${e.circuitTag}"`);
    expect((svg.match(/<title>/g) ?? []).length).toBeGreaterThanOrEqual(layout.nodes.length + layout.edges.length);
    expect(svg).toContain("2 #10 AWG Cu PV WIRE 90 °C");
    expect(svg).toContain("tabular-nums");
    expect(svg).toContain("LEGEND");
  });

  it("uses the signal colour only where something is wrong", async () => {
    const clean = oneLineSvg(await layoutOneLine(standAlone()));
    // The legend's own sample of the fault mark is the only use on a clean record.
    const cleanUses = (clean.match(new RegExp(PALETTE.trouble, "g")) ?? []).length;
    const faulty = oneLineSvg(await layoutOneLine(danglingRecord()));
    const faultyUses = (faulty.match(new RegExp(PALETTE.trouble, "g")) ?? []).length;
    expect(cleanUses).toBe(2);
    expect(faultyUses).toBeGreaterThan(cleanUses + 5);
    expect(faulty).toContain("one-line-trouble");
    expect(faulty).toContain("problem: conductor size not given");
  });

  it("escapes text taken from the record", async () => {
    const r = standAlone();
    r.equipment = r.equipment.map((e) => (e.tag === "INV-1" ? { ...e, model: "<AG & \"6048\">" } : e));
    const svg = oneLineSvg(await layoutOneLine(r));
    expect(svg).toContain("&lt;AG &amp; &quot;6048&quot;&gt;");
    expect(svg).not.toContain("<AG &");
  });
});

describe("one-line PDF drawing", () => {
  it("puts every box's tag and every circuit's tag on the page as text (embedded font)", async () => {
    const layout = await layoutOneLine(standAlone());
    const [text] = await pageText(await diagramPdf(layout, "embedded"));
    for (const tag of ["PV-1", "PV-M1", "CC-1", "BUS-1", "BAT-1", "INV-1", "GEN-1", "PNL-1", "RSD-1"]) {
      expect(text).toContain(tag);
    }
    for (const tag of ["C-1", "C-2", "C-3", "C-4", "C-5", "C-6", "DC-PV", "CB-CC", "F-BAT", "CB-INV", "DS-GEN"]) {
      expect(text).toContain(tag);
    }
    expect(text).toContain("2 #10 AWG Cu PV WIRE 90 °C");
    expect(text).toContain("1 #10 EGC");
  });

  it("draws with the standard fonts too, spelling out what they cannot encode", async () => {
    const layout = await layoutOneLine(hybrid());
    const [text] = await pageText(await diagramPdf(layout, "standard"));
    for (const tag of ["PV-A", "PV-B", "HINV-1", "BAT-1", "MSP", "SUBP-1", "S-A", "AC-2", "F-1", "CB-PV"]) {
      expect(text).toContain(tag);
    }
    // WinAnsi has the degree sign.
    expect(text).toContain("90 °C");
  });

  it("keeps the drawing inside the box it is given", async () => {
    const layout = await layoutOneLine(standAlone());
    const box = { x: 100, y: 80, width: 500, height: 300 };
    const bytes = await diagramPdf(layout, "standard", box);
    const doc = await getDocument({ data: bytes, standardFontDataUrl: STANDARD_FONTS, isEvalSupported: false }).promise;
    const page = await doc.getPage(1);
    const content = await page.getTextContent();
    for (const it of content.items) {
      if (!("transform" in it) || it.str.trim() === "") continue;
      const [a, b, , , x, y] = it.transform as number[];
      // Scaled down to fit, the lettering still stays at 8 pt or more (legible on a half-size copy, common practice).
      expect(Math.hypot(a!, b!)).toBeGreaterThanOrEqual(7.99);
      expect(x!).toBeGreaterThanOrEqual(box.x - 0.5);
      expect(x! + it.width).toBeLessThanOrEqual(box.x + box.width + 0.5);
      expect(y!).toBeGreaterThanOrEqual(box.y - 0.5);
      expect(y!).toBeLessThanOrEqual(box.y + box.height + 0.5);
    }
    await doc.destroy();
  });

  it("draws an empty record without throwing", async () => {
    const [text] = await pageText(await diagramPdf(await layoutOneLine(emptyRecord()), "standard"));
    expect(text).toContain("No equipment or circuits entered yet.");
  });
});
