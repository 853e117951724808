import { describe, expect, it } from "vitest";
import { existsSync, readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { PDFDocument } from "pdf-lib";
import fontkit from "@pdf-lib/fontkit";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import { layoutOneLine } from "@/lib/diagram/layout";
import { drawOneLine } from "@/lib/diagram/pdf";
import { projectRecordSchema } from "@/lib/schemas/project-record";
import { expectSoundGeometry, wireCrossings, wiresThroughCallouts } from "./geometry";

const EXAMPLES = path.resolve(__dirname, "../../../examples");
const DEJAVU = path.resolve(__dirname, "../../../node_modules/dejavu-fonts-ttf/ttf");
const files = existsSync(EXAMPLES) ? readdirSync(EXAMPLES).filter((f) => f.endsWith(".json")).sort() : [];

describe.skipIf(files.length === 0)("one-line diagrams of the example projects", () => {
  it.each(files)("%s: every circuit one edge, boxes apart, every equipment tag on the PDF page", async (file) => {
    const record = projectRecordSchema.parse(JSON.parse(readFileSync(path.join(EXAMPLES, file), "utf8")));
    const layout = await layoutOneLine(record);
    expectSoundGeometry(layout, record);
    expect(wireCrossings(layout)).toEqual([]);
    expect(wiresThroughCallouts(layout)).toEqual([]);
    // A valid record has nothing to flag on the drawing.
    expect(layout.nodes.flatMap((n) => n.trouble)).toEqual([]);

    const doc = await PDFDocument.create();
    doc.registerFontkit(fontkit);
    const regular = await doc.embedFont(readFileSync(path.join(DEJAVU, "DejaVuSans.ttf")), { subset: true });
    const bold = await doc.embedFont(readFileSync(path.join(DEJAVU, "DejaVuSans-Bold.ttf")), { subset: true });
    const page = doc.addPage([1224, 792]);
    drawOneLine(page, layout, { x: 36, y: 36, width: 1152, height: 720 }, { regular, bold });
    const pdf = await getDocument({ data: await doc.save(), isEvalSupported: false }).promise;
    const content = await (await pdf.getPage(1)).getTextContent();
    const text = content.items.map((it) => ("str" in it ? it.str : "")).join("\n");
    await pdf.destroy();
    for (const tag of [...record.equipment.map((e) => e.tag), ...record.arrays.map((a) => a.tag), ...record.circuits.map((c) => c.tag)]) {
      expect(text, tag).toContain(tag);
    }
  });
});
