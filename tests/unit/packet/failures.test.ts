import fs from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { parseProjectFile, runChecks } from "@/lib/compliance/index";
import type { CheckRun } from "@/lib/compliance/types";
import { layoutOneLine, failuresOf } from "@/lib/diagram/layout";
import { renderPacketPdf } from "@/lib/packet/pdf";
import type { PacketPdf } from "@/lib/packet/types";
import type { ProjectRecord } from "@/lib/schemas/project-record";
import { fixtureInput } from "./fixtures";
import { readPdfText, type PdfText } from "./pdf-text";

/**
 * The hut's battery circuit C-2 is 10 AWG copper on a 40 A breaker. 10 AWG Cu
 * may be protected at no more than 30 A (NEC 2017 240.4(D)(7)), and its 75 °C
 * terminal ampacity is 35 A (NEC 2017 Table 310.15(B)(16)), so both the
 * ampacity and the overcurrent checks fail on C-2 and on its breaker CB-1.
 */
const REMEDY = "Use 8 AWG Cu (50 A at 75 °C, NEC Table 310.15(B)(16)) or a 30 A breaker";

function pagesOf(pdf: PacketPdf, text: PdfText, sheet: string): string {
  const s = pdf.sheetPages.find((x) => x.sheet === sheet)!;
  return text.pages.slice(s.firstPage - 1, s.firstPage - 1 + s.pageCount).join(" ");
}

describe("failures where the reviewer looks, on the seeded hut packet", () => {
  let run: CheckRun;
  let record: ProjectRecord;
  let pdf: PacketPdf;
  let text: PdfText;

  beforeAll(async () => {
    const parsed = parseProjectFile(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    record = parsed.record;
    const engine = runChecks(parsed.record);
    // The packet prints the engine's remedy when it gives one; here one is set on the overcurrent failure.
    run = { ...engine, results: engine.results.map((r) => (r.id === "overcurrent-protection:C-2" ? { ...r, remedy: { text: REMEDY, changes: [] } } : r)) };
    pdf = await renderPacketPdf({ ...fixtureInput(), record: parsed.record, run, labels: [] });
    text = await readPdfText(pdf.bytes);
  }, 120_000);

  it("finds the 10 AWG / 40 A battery circuit failing in the engine", () => {
    const failing = run.results.filter((r) => r.status === "fail").map((r) => r.id);
    expect(failing).toContain("overcurrent-protection:C-2");
    expect(failing).toContain("conductor-ampacity:C-2");
  });

  it("marks the conductor and its breaker on the one-line with the checks' ids", async () => {
    const oneLine = pagesOf(pdf, text, "E-001");
    expect(oneLine).toContain("FAIL overcurrent-protection");
    expect(oneLine).toContain("FAIL conductor-ampacity");
    // The same layout draws the on-screen SVG.
    const layout = await layoutOneLine(record, { failures: failuresOf(run.results) });
    const c2 = layout.edges.find((e) => e.circuitTag === "C-2")!;
    expect(c2.trouble).toContain("FAIL overcurrent-protection");
    expect(c2.deviceMarks.find((m) => m.tag === "CB-1")?.trouble).toBe(true);
    const c5 = layout.edges.find((e) => e.circuitTag === "C-5")!;
    expect(c5.deviceMarks.every((m) => !m.trouble)).toBe(true);
  });

  it("prints the engine's remedy beside the FAIL marks on the one-line, on screen and in the PDF", async () => {
    const oneLine = pagesOf(pdf, text, "E-001");
    expect(oneLine).toContain(`FIX: ${REMEDY}`);
    // The engine's own remedy for the ampacity failure: 8 AWG Cu, 50 A at 75 °C (NEC 2017 Table 310.15(B)(16)) for 37.5 A required.
    const ampacity = run.results.find((r) => r.id === "conductor-ampacity:C-2")!;
    expect(ampacity.remedy?.text).toMatch(/8 AWG Cu/);
    expect(oneLine).toContain(`FIX: ${ampacity.remedy!.text}`);
    const layout = await layoutOneLine(record, { failures: failuresOf(run.results) });
    const c2 = layout.edges.find((e) => e.circuitTag === "C-2")!;
    expect(c2.remedies.join(" ").replace(/\s+/g, " ")).toContain(`FIX: ${REMEDY}`);
    expect(layout.edges.find((e) => e.circuitTag === "C-5")!.remedies).toEqual([]);
  });

  it("shows the failing state on the conductor and on its device in the schedules", () => {
    const schedule = pagesOf(pdf, text, "E-004");
    const c2Row = schedule.slice(schedule.indexOf("C-2 "), schedule.indexOf("C-3 "));
    expect(c2Row).toContain("■ FAIL");
    const devices = schedule.slice(schedule.indexOf("OVERCURRENT DEVICES AND DISCONNECTS"));
    const cb1Row = devices.slice(devices.indexOf("CB-1 "), devices.indexOf("CB-1 ") + 200);
    expect(cb1Row).toContain("■ FAIL");
  });

  it("prints the remedy beside the failure in the calculations and the review record", () => {
    const calcs = pagesOf(pdf, text, "E-003");
    const card = calcs.slice(calcs.indexOf("Overcurrent protection: C-2"));
    expect(card.slice(0, 1200)).toContain(`Remedy: ${REMEDY}`);
    expect(pagesOf(pdf, text, "G-004")).toContain(REMEDY);
  });
});
