import fs from "node:fs";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { parseProjectFile, runChecks } from "@/lib/compliance/index";
import { imageSize, renderPacketDocx } from "@/lib/packet/docx";
import { formatNumber } from "@/lib/packet/format";
import { AHJ_FOOTER, REVIEW_MARKING, SHEET_PLAN } from "@/lib/packet/model";
import { PV_OUTPUT_ALLOWED_A, fixtureInput, fixtureRecord, makeDatasheetPdf, makePng } from "./fixtures";
import { readZip, wordTableRows, wordText } from "./zip";

function part(zip: Map<string, Buffer>, pattern: RegExp): string {
  return [...zip].filter(([name]) => pattern.test(name)).map(([, b]) => b.toString("utf8")).join("\n");
}

describe("permit packet DOCX", () => {
  let zip: Map<string, Buffer>;
  let documentXml: string;
  let rows: string[][];

  beforeAll(async () => {
    const bytes = await renderPacketDocx(
      fixtureInput({ datasheets: [{ title: "Battery datasheet", equipmentTag: "BAT-1", bytes: await makeDatasheetPdf("SW-51100", 2) }] }),
    );
    zip = readZip(bytes);
    documentXml = zip.get("word/document.xml")!.toString("utf8");
    rows = wordTableRows(documentXml);
    // The one-line is laid out and drawn as a picture: seconds on a loaded machine.
  }, 60_000);

  it("is a Word document with every sheet as a heading, in order", () => {
    expect(zip.has("[Content_Types].xml")).toBe(true);
    const text = wordText(documentXml);
    let at = -1;
    for (const s of SHEET_PLAN) {
      const i = text.indexOf(`${s.code}  ${s.title}`);
      expect(i, s.code).toBeGreaterThan(at);
      at = i;
    }
  });

  it("has a conductor schedule row for every circuit with its conductor, OCPD and the engine's ampacity", () => {
    for (const c of fixtureRecord.circuits) {
      const row = rows.find((r) => r[0] === c.tag && r[1] === `${c.fromTag} → ${c.toTag}`);
      expect(row, c.tag).toBeDefined();
      expect(row![3]).toBe(`${c.size} AWG Cu`);
      if (c.ocpdTag) expect(row![13]).toContain(c.ocpdTag);
    }
    const c1 = rows.find((r) => r[0] === "C1" && r[1] === "PV-MOD → DS-1")!;
    expect(c1[12]).toBe(`${formatNumber(PV_OUTPUT_ALLOWED_A)} A`);
    expect(c1[15]).toBe("▲ WARNING");
  });

  it("has an equipment schedule row for every item, naming a missing datasheet", () => {
    for (const e of fixtureRecord.equipment) {
      const row = rows.find((r) => r[0] === e.tag && r.length === 9);
      expect(row, e.tag).toBeDefined();
      expect(row![2]).toBe(e.manufacturer);
      expect(row![3]).toBe(e.model);
    }
    expect(rows.find((r) => r[0] === "BAT-1" && r.length === 9)![7]).toBe("D-001");
    expect(rows.find((r) => r[0] === "INV-1" && r.length === 9)![7]).toBe("MISSING");
  });

  it("tabulates each check's inputs and results", () => {
    expect(rows).toContainEqual(["Result", "Maximum PV system voltage", "167.2 V"]);
    expect(rows).toContainEqual(["Input", "Module Voc", "49.5 V"]);
  });

  it("carries the review marking in its header and footer", () => {
    const header = wordText(part(zip, /^word\/header\d*\.xml$/));
    const footer = wordText(part(zip, /^word\/footer\d*\.xml$/));
    expect(header).toContain(REVIEW_MARKING);
    expect(footer).toContain(REVIEW_MARKING);
    // The page header repeats on every page: the editable copy says the sealed PDF governs.
    expect(header).toContain("UNSEALED COPY — THE SEALED PDF GOVERNS");
  });

  it("carries the reviewer and the AHJ footer once approved, and no review marking", async () => {
    const bytes = await renderPacketDocx(
      fixtureInput({
        approval: {
          reviewerName: "Ines Calloway-Marsh",
          licenceNumber: "PE-E 40417",
          licenceState: "Quillon",
          licenceDiscipline: "Electrical engineering",
          approvedAt: "2026-12-01T09:30:00.000Z",
          recordSha256: "ab".repeat(32),
        },
      }),
    );
    const z = readZip(bytes);
    const header = wordText(part(z, /^word\/header\d*\.xml$/));
    const footer = wordText(part(z, /^word\/footer\d*\.xml$/));
    const body = wordText(z.get("word/document.xml")!.toString("utf8"));
    expect(header).toContain("Ines Calloway-Marsh");
    expect(header).toContain("PE-E 40417");
    expect(footer).toContain(AHJ_FOOTER);
    expect(header + footer + body).not.toContain(REVIEW_MARKING);
  }, 60_000);

  it("embeds a site photo at its own proportions", async () => {
    expect(imageSize(makePng(300, 120, [10, 20, 30]), "png")).toEqual({ width: 300, height: 120 });
    const bytes = await renderPacketDocx(fixtureInput({ sitePlan: { bytes: makePng(300, 120, [10, 20, 30]), type: "png", fileName: "site.png" } }));
    const z = readZip(bytes);
    expect([...z.keys()].some((k) => k.startsWith("word/media/"))).toBe(true);
    const extent = /<wp:extent cx="(\d+)" cy="(\d+)"/.exec(z.get("word/document.xml")!.toString("utf8"));
    expect(extent).not.toBeNull();
    expect(Number(extent![1]) / Number(extent![2])).toBeCloseTo(2.5, 2);
  }, 60_000);
});

describe("the DOCX carries the drawings", () => {
  it("embeds the hut's one-line as a picture, with its failing battery circuit marked in red", async () => {
    const parsed = parseProjectFile(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const bytes = await renderPacketDocx(fixtureInput({ record: parsed.record, run: runChecks(parsed.record), labels: [] }));
    const z = readZip(bytes);
    const xml = z.get("word/document.xml")!.toString("utf8");
    expect(xml).toContain('descr="One-line diagram of Tamarack backcountry hut');
    // The hut's 120 V inverter feeds a 120/240 V panel, so E-007 carries the three-line detail as a second picture.
    expect(xml).toContain('descr="Three-line detail: INV-1 (120 V) feeding P-1 (120/240 V)');
    const media = [...z].filter(([name]) => /^word\/media\/.+\.png$/.test(name)).map(([, b]) => b);
    expect(media.length).toBe(2);
    // The one-line is the taller picture; the three-line detail is a wide strip.
    const heights = await Promise.all(media.map(async (b) => (await sharp(b).metadata()).height!));
    const png = media[heights.indexOf(Math.max(...heights))]!;
    const meta = await sharp(png).metadata();
    // Drawn at 200 dpi: the layout is several hundred points wide, so well over 1,000 pixels.
    expect(meta.width).toBeGreaterThan(1000);
    // The drawing is there, not a blank page: dark linework and text, and the signal red of the FAIL marks on C-2.
    const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    let dark = 0;
    let red = 0;
    for (let i = 0; i < data.length; i += info.channels) {
      const [r, g, b] = [data[i]!, data[i + 1]!, data[i + 2]!];
      if (r < 80 && g < 80 && b < 80) dark += 1;
      if (r > 150 && g < 80 && b < 80) red += 1;
    }
    expect(dark).toBeGreaterThan(5000);
    expect(red).toBeGreaterThan(500);
    // The picture sits at the text width of the page: 9 in = 8,229,600 EMU.
    const extent = [...xml.matchAll(/<wp:extent cx="(\d+)" cy="(\d+)"/g)].map((m) => [Number(m[1]), Number(m[2])]);
    expect(extent.some(([cx, cy]) => cx! <= 9 * 914400 + 9525 && cy! <= 5.5 * 914400 + 9525 && (cx! > 8 * 914400 || cy! > 5 * 914400))).toBe(true);
  }, 60_000);
});
