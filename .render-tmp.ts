import fs from "node:fs";
import { parseProjectFile, runChecks } from "./lib/compliance/index";
import { requiredLabels } from "./lib/compliance/labels";
import { renderPacketPdf } from "./lib/packet/pdf";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
async function main() {
  const file = process.argv[2] ?? "tamarack-hut";
  const parsed = parseProjectFile(JSON.parse(fs.readFileSync(`/work/wt/packet/examples/${file}.json`, "utf8")));
  if (!parsed.ok) throw new Error("bad");
  const run = runChecks(parsed.record);
  const labels = requiredLabels(parsed.record, run.edition);
  const pdf = await renderPacketPdf({ record: parsed.record, run, labels, revision: { number: 1, createdAt: "2026-11-30T10:00:00Z", preparedBy: "Dana Designer", organisation: "Quillfeather Solar Co." }, datasheets: [] });
  fs.writeFileSync(`/tmp/pk/${file}.pdf`, pdf.bytes);
  console.log(pdf.sheetPages.map((s) => `${s.sheet}:${s.pageCount}`).join(" "));
  const doc = await getDocument({ data: pdf.bytes.slice() }).promise;
  const hist = new Map<number, number>(); let small = 0, total = 0; const ex: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const c = await (await doc.getPage(i)).getTextContent();
    for (const it of c.items) { if (!("str" in it) || !it.str.trim()) continue; const [a, b] = it.transform as number[]; const s = Math.round(Math.hypot(a!, b!) * 10) / 10; hist.set(s, (hist.get(s) ?? 0) + it.str.length); total += it.str.length; if (s < 7.95) { small += it.str.length; if (ex.length < 400) ex.push(`p${i} ${s} ${it.str}`); } }
  }
  console.log([...hist].sort((a, b) => a[0] - b[0]).map(([k, v]) => `${k}:${v}`).join(" "));
  console.log(`small ${small}/${total}`);
  fs.writeFileSync(`/tmp/pk/${file}-small.txt`, ex.join("\n"));
}
main();
