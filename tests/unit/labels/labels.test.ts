import { PDFDocument } from "pdf-lib";
import { describe, expect, it } from "vitest";
import { DEJAVU_CAP_HEIGHT, embedPacketFonts } from "@/lib/packet/fonts";
import { HEADER_STYLES, LABEL_STOCKS, SAFETY_COLOURS, drawLabel, labelArtwork, renderLabelSheet } from "@/lib/labels";
import { stocksThatFit } from "@/lib/labels/sheet";
import type { LabelRequirement } from "@/lib/labels/types";
import { fixtureLabels } from "../packet/fixtures";
import { readPdfText } from "../packet/pdf-text";

const rapidShutdown: LabelRequirement = {
  id: "rapid-shutdown",
  codeRef: "NEC 2020 690.56(C)(1)(a)",
  signalWord: "CAUTION",
  title: "Solar PV system equipped with rapid shutdown",
  lines: ["TURN RAPID SHUTDOWN SWITCH TO THE OFF POSITION TO SHUT DOWN PV SYSTEM AND REDUCE SHOCK HAZARD IN ARRAY"],
  location: "Within 3 ft of the service disconnect",
};

describe("labelArtwork", () => {
  it("uses the ANSI Z535.4 signal-word panels: red, orange, yellow, blue, with the alert symbol except on NOTICE", () => {
    expect(HEADER_STYLES.DANGER.background).toEqual(SAFETY_COLOURS.red);
    expect(HEADER_STYLES.DANGER.text).toEqual(SAFETY_COLOURS.white);
    expect(HEADER_STYLES.WARNING.background).toEqual(SAFETY_COLOURS.orange);
    expect(HEADER_STYLES.WARNING.text).toEqual(SAFETY_COLOURS.black);
    expect(HEADER_STYLES.CAUTION.background).toEqual(SAFETY_COLOURS.yellow);
    expect(HEADER_STYLES.CAUTION.text).toEqual(SAFETY_COLOURS.black);
    expect(HEADER_STYLES.NOTICE.background).toEqual(SAFETY_COLOURS.blue);
    for (const w of ["DANGER", "WARNING", "CAUTION"] as const) expect(HEADER_STYLES[w].alertSymbol).not.toBeNull();
    expect(HEADER_STYLES.NOTICE.alertSymbol).toBeNull();
  });

  it("carries the body lines with their computed values and a capitalised title", () => {
    const art = labelArtwork(fixtureLabels[0]!);
    expect(art.title).toBe("PHOTOVOLTAIC SYSTEM DC DISCONNECT");
    expect(art.lines).toEqual(["MAXIMUM VOLTAGE: 167.2 V", "MAXIMUM CIRCUIT CURRENT: 25.5 A"]);
  });

  it("sets the rapid-shutdown sign's letters to 3/8 in and 3/16 in (NEC 2020 690.56(C)(1)) and honours a stricter local rule", () => {
    expect(labelArtwork(rapidShutdown).minLetterHeightIn).toEqual({ signalWord: 0.375, text: 0.1875 });
    expect(labelArtwork(fixtureLabels[0]!).minLetterHeightIn).toEqual({ signalWord: 0.25, text: 0.125 });
    expect(labelArtwork(fixtureLabels[0]!, { minLetterHeights: { textIn: 0.1875 } }).minLetterHeightIn.text).toBe(0.1875);
  });
});

describe("renderLabelSheet", () => {
  const many = Array.from({ length: 12 }, (_, i) => ({ ...fixtureLabels[i % fixtureLabels.length]!, id: `L-${i + 1}` }));

  it("lays ten 4 × 2 in labels on a US letter sheet", async () => {
    const out = await renderLabelSheet(many, { stock: "sheet-letter" });
    const text = await readPdfText(out.bytes);
    expect(out.pageCount).toBe(2);
    expect(text.sizes[0]).toEqual({ width: 612, height: 792 });
    expect(text.pages[0]!.split("PHOTOVOLTAIC SYSTEM DC DISCONNECT").length - 1).toBe(2);
    expect(text.pages[1]).toContain("ELECTRIC SHOCK HAZARD");
    expect(text.pages[1]).not.toContain("SINGLE 120-VOLT SUPPLY");
  });

  it("prints one label per page for a label printer, at the stock's size", async () => {
    const out = await renderLabelSheet(fixtureLabels, { stock: "single-4x2" });
    const text = await readPdfText(out.bytes);
    expect(out.pageCount).toBe(fixtureLabels.length);
    text.sizes.forEach((s) => expect(s).toEqual({ width: LABEL_STOCKS["single-4x2"].pageWidthIn * 72, height: 144 }));
    fixtureLabels.forEach((l, i) => {
      expect(text.pages[i]).toContain(l.signalWord);
      expect(text.pages[i]).toContain(l.title);
      for (const line of l.lines) expect(text.pages[i]).toContain(line);
    });
  });

  it("prints the letters at least at the minimum height where the label fits, and reports the ones that do not", async () => {
    const out = await renderLabelSheet([fixtureLabels[0]!, rapidShutdown], { stock: "single-4x2" });
    expect(out.belowMinimum).toEqual(["rapid-shutdown"]);
    const text = await readPdfText(out.bytes);
    const word = text.items[0]!.find((i) => i.str === "WARNING")!;
    const body = text.items[0]!.find((i) => i.str === "MAXIMUM VOLTAGE: 167.2 V")!;
    // Cap height = font size × 1493/2048 for DejaVu Sans; 1/4 in = 18 pt, 1/8 in = 9 pt.
    expect(word.size * DEJAVU_CAP_HEIGHT).toBeGreaterThanOrEqual(18 - 0.01);
    expect(body.size * DEJAVU_CAP_HEIGHT).toBeGreaterThanOrEqual(9 - 0.01);
    const roomy = await renderLabelSheet([rapidShutdown], { stock: "single-4x6" });
    expect(roomy.belowMinimum).toEqual([]);
  });

  it("names the smallest stock each label prints on at full letter height, agreeing with the sheets it renders", async () => {
    const doc = await PDFDocument.create();
    const fonts = await embedPacketFonts(doc);
    const small = stocksThatFit(fixtureLabels[0]!, fonts);
    expect(small[0]!.stock.labelHeightIn).toBe(2);
    // The rapid-shutdown sign's 3/8 in title and 3/16 in text (NEC 2020 690.56(C)(1)) do not fit 4 × 2 in.
    const big = stocksThatFit(rapidShutdown, fonts);
    expect(big.every((f) => f.stock.labelHeightIn > 2)).toBe(true);
    const first = big[0]!.name;
    expect((await renderLabelSheet([rapidShutdown], { stock: first })).belowMinimum).toEqual([]);
  });

  it("names a label set below the minimum in the sheet's bottom margin, at 8 pt, below the stock", async () => {
    // A 4 × 2 in sheet: 5 rows from 0.5 in below the top leave 0.5 in (36 pt) under the last row.
    const out = await renderLabelSheet([fixtureLabels[0]!, rapidShutdown], { stock: "sheet-letter" });
    expect(out.belowMinimum).toEqual(["rapid-shutdown"]);
    const text = await readPdfText(out.bytes);
    const note = text.items[0]!.filter((i) => i.y < 36);
    const joined = note.map((i) => i.str).join(" ");
    expect(joined).toContain("Letters below the minimum height on this stock");
    expect(joined).toContain(rapidShutdown.title);
    expect(joined).not.toContain("PHOTOVOLTAIC SYSTEM DC DISCONNECT");
    // Lettering under 8 pt does not survive a copy (common practice; the packet keeps the same floor).
    for (const i of note) expect(i.size, i.str).toBeGreaterThanOrEqual(8 - 0.01);
  });
});

describe("drawLabel", () => {
  it("scales a label down to fit a box on a sheet, never up", async () => {
    const doc = await PDFDocument.create();
    const fonts = await embedPacketFonts(doc);
    const page = doc.addPage([600, 400]);
    const small = drawLabel(page, fixtureLabels[3]!, { x: 10, y: 10, width: 144, height: 200 }, fonts);
    expect(small.scale).toBeCloseTo(0.5, 5);
    const big = drawLabel(page, fixtureLabels[3]!, { x: 10, y: 10, width: 500, height: 380 }, fonts);
    expect(big.scale).toBe(1);
    expect(big.widthPt).toBe(288);
  });
});
