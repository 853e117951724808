import { beforeAll, describe, expect, it } from "vitest";
import { renderPacketPdf } from "@/lib/packet/pdf";
import type { PacketPdf } from "@/lib/packet/types";
import { projectRecordSchema } from "@/lib/schemas/project-record";
import { fixtureInput, fixtureRecord } from "./fixtures";
import { readPdfText, type PdfText } from "./pdf-text";

const normal = (s: string) => s.replace(/\s+/g, " ");

/** The text from `start` up to the next `end` after it. */
function between(text: string, start: string, end: string): string {
  const from = text.indexOf(start);
  expect(from, start).toBeGreaterThanOrEqual(0);
  const to = text.indexOf(end, from + start.length);
  return text.slice(from, to < 0 ? undefined : to);
}

function pagesOf(pdf: PacketPdf, text: PdfText, sheet: string): string {
  const s = pdf.sheetPages.find((p) => p.sheet === sheet)!;
  return normal(text.pages.slice(s.firstPage - 1, s.firstPage - 1 + s.pageCount).join(" "));
}

/**
 * The cabin with a well-pump branch circuit on its panel and its battery
 * conductors squeezed into 1 in EMT, read back from the PDF as a reviewer
 * reads the sheets.
 */
const record = projectRecordSchema.parse({
  ...fixtureRecord,
  equipment: [
    ...fixtureRecord.equipment,
    { kind: "breaker", tag: "CB-2", manufacturer: "Kestrel", model: "KB-20", ratingA: 20, voltageRatingV: 240, currentType: "ac", interruptingRatingA: 10000 },
    { kind: "disconnect", tag: "DS-P", manufacturer: "Kestrel", model: "KD-30", ratingA: 30, voltageRatingV: 240, currentType: "ac" },
  ],
  circuits: [
    ...fixtureRecord.circuits.map((c) => (c.tag === "C3" ? { ...c, racewaySize: "1" } : c)),
    {
      tag: "C5", fromTag: "LC-1", toTag: "DS-P", kind: "ac-branch", material: "cu", size: "12", insulation: "THWN-2",
      insulationTempRatingC: 90, currentCarryingConductors: 2, racewayType: "EMT", racewaySize: "1/2", lengthFt: 40,
      terminalTempRatingC: 75, ocpdTag: "CB-2", egcSize: "12", loadCurrentA: 8, nominalVoltageV: 240,
    },
  ],
});

describe("plan sheets a reviewer asks for", () => {
  let pdf: PacketPdf;
  let text: PdfText;

  beforeAll(async () => {
    pdf = await renderPacketPdf(fixtureInput({ record }));
    text = await readPdfText(pdf.bytes);
  }, 120_000);

  it("tabulates each raceway's fill against Chapter 9 and fails the overfilled one with the size that fits", () => {
    const e004 = pagesOf(pdf, text, "E-004");
    expect(e004).toContain("RACEWAY FILL, NEC CHAPTER 9 TABLES 1, 4 AND 5");
    // C2: 2 × #10 THWN-2 + #10 EGC = 3 × 0.0211 = 0.0633 in² in 3/4 in EMT (0.533 in², Table 4) = 11.9 % of 40 % (Table 1).
    const c2 = between(e004, "C2 3/4 in EMT", "C3 1 in EMT");
    expect(c2).toContain("0.533 in²");
    expect(c2).toContain("0.0633 in²");
    expect(c2).toContain("11.9 %");
    expect(c2).toContain("PASS");
    // C3: 2 × 2/0 THHN (0.2223) + #6 EGC (0.0507) = 0.4953 in² in 1 in EMT (0.864 in²) = 57.3 % > 40 %; 1-1/4 in (1.496 in²) takes it.
    const c3 = between(e004, "C3 1 in EMT", "C4 3/4 in EMT");
    expect(c3).toContain("0.4953 in²");
    expect(c3).toContain("57.3 %");
    expect(c3).toContain("FAIL");
    expect(c3).toContain("Fix: 1-1/4 in EMT");
    // PV wire is not in Table 5: the row asks for the cable's area rather than passing.
    const c1 = between(e004, "C1 3/4 in PVC", "C2 3/4 in EMT");
    expect(c1).toContain("NEEDS INPUT");
    expect(c1).toContain("not in Chapter 9 Table 5");
    expect(pagesOf(pdf, text, "G-001")).toContain("raceway fill over the Chapter 9 limit: C3");
  });

  it("schedules the panel's branch circuits with their breakers and loads", () => {
    const e005 = pagesOf(pdf, text, "E-005");
    expect(e005).toContain("PANEL SCHEDULE: LC-1 KESTREL KP-100");
    expect(e005).toContain("Fed by INV-1 over C4 (Inverter AC output)");
    const row = e005.slice(e005.indexOf("BRANCH CIRCUITS OF LC-1"));
    // 8 A at 240 V = 1920 VA; a 240 V two-wire circuit takes a two-pole breaker.
    expect(row).toContain("1 C5 DS-P CB-2 20 A 2 12 AWG Cu 240 V 8 A 1920 VA");
    expect(row).toContain("Sum of branch breakers 20 A");
  });

  it("prints the structural block with what is missing named", () => {
    const g003 = pagesOf(pdf, text, "G-003");
    expect(g003).toContain("STRUCTURAL AND ATTACHMENT");
    expect(g003).toContain("Racking product NOT GIVEN: Racking product (Site section of the design)");
    expect(g003).toContain("Footing detail NOT GIVEN: attach a footing or attachment detail");
  });
});

describe("structural block of a roof mount with its documents", () => {
  it("names the racking, its listing and the attached detail and letter", async () => {
    const roof = projectRecordSchema.parse({
      ...record,
      site: { ...record.site, mounting: "roof", rackingProduct: "Kestrel RR-4 rail", rackingListing: "UL 2703" },
      jurisdiction: { ...record.jurisdiction, requiredDocuments: ["structural-letter"] },
      attachments: [{ kind: "attachment-detail", fileName: "l-foot-detail.pdf" }],
    });
    const pdf = await renderPacketPdf(fixtureInput({ record: roof }));
    const text = await readPdfText(pdf.bytes);
    const g003 = pagesOf(pdf, text, "G-003");
    expect(g003).toContain("Mounting Roof mount");
    expect(g003).toContain("Racking product Kestrel RR-4 rail");
    expect(g003).toContain("Racking listing UL 2703");
    expect(g003).toContain("Roof attachment detail attached, merged after the sheets: l-foot-detail.pdf");
    expect(g003).toContain("Structural letter NOT GIVEN: Quillon County Building Division requires a structural letter for a roof mount");
  }, 60_000);
});
