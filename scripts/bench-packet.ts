/**
 * Packet benchmark: a project with ten attached 20-page datasheets. Times the
 * whole packet (sheets, one-line, label artwork, datasheets merged and
 * stamped) against pdf-lib alone merging the same ten files, and prints the
 * ratio (wall time, and CPU time, which a shared machine disturbs less) and
 * the peak resident memory. Run: npx tsx scripts/bench-packet.ts
 */
import fs from "node:fs";
import path from "node:path";
import { deflateSync } from "node:zlib";
import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, concatTransformationMatrix, drawObject, popGraphicsState, pushGraphicsState, rgb } from "pdf-lib";
import { parseProjectFile, runChecks } from "../lib/compliance/index";
import { renderPacketPdf } from "../lib/packet/pdf";
import type { DatasheetAttachment, PacketInput } from "../lib/packet/types";

const DATASHEETS = 10;
const PAGES_EACH = 20;
const RUNS = 3;

/** A deterministic pseudo-random generator, so every run benches the same files. */
function prng(seed: number) {
  let x = seed >>> 0 || 1;
  return () => {
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    return (x >>> 0) / 4294967296;
  };
}

/** A photo-like image XObject (noisy RGB, which does not compress, as a product photo does not). */
function photoStream(doc: PDFDocument, seed: number, width: number, height: number) {
  const rand = prng(seed);
  const pixels = new Uint8Array(width * height * 3);
  for (let i = 0; i < pixels.length; i += 1) pixels[i] = Math.floor(rand() * 64) + (i % 3) * 60;
  const stream = doc.context.stream(deflateSync(pixels), {
    Type: "XObject", Subtype: "Image", Width: width, Height: height, ColorSpace: "DeviceRGB", BitsPerComponent: 8, Filter: "FlateDecode",
  });
  return doc.context.register(stream);
}

const fontBytes = fs.readFileSync(path.join(process.cwd(), "fonts", "pdf", "DejaVuSans.ttf"));

/**
 * A manufacturer's manual as it is usually attached: letter pages with an
 * embedded font, a ratings table in vector rules, and product photos
 * (four per file, each shown on five pages).
 */
async function makeDatasheet(n: number): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.registerFontkit(fontkit);
  const font = await doc.embedFont(fontBytes, { subset: true });
  const photos = [0, 1, 2, 3].map((k) => photoStream(doc, n * 10 + k + 1, 360, 240));
  for (let p = 1; p <= PAGES_EACH; p += 1) {
    const page = doc.addPage([612, 792]);
    page.drawRectangle({ x: 0, y: 740, width: 612, height: 52, color: rgb(0.1, 0.3, 0.5) });
    page.drawText(`Model NX-${n}00 technical data — page ${p}`, { x: 40, y: 758, size: 18, font, color: rgb(1, 1, 1) });
    for (let row = 0; row < 28; row += 1) {
      const y = 700 - row * 16;
      page.drawText(`Parameter ${row + 1} …………… ${(n * 13.7 + row * 2.1).toFixed(1)} unit (±2 %)`, { x: 40, y, size: 9, font });
      page.drawLine({ start: { x: 40, y: y - 4 }, end: { x: 572, y: y - 4 }, thickness: 0.3, color: rgb(0.7, 0.7, 0.7) });
    }
    const key = page.node.newXObject("Photo", photos[(p - 1) % photos.length]!);
    page.pushOperators(pushGraphicsState(), concatTransformationMatrix(360, 0, 0, 240, 126, 40), drawObject(key), popGraphicsState());
  }
  return doc.save();
}

let peakRss = 0;
function sample() {
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
}

/** Wall time, and this process's CPU time, which other work on a shared machine disturbs less. */
async function timed<T>(fn: () => Promise<T>): Promise<{ ms: number; cpuMs: number; value: T }> {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const value = await fn();
  const c = process.cpuUsage(c0);
  return { ms: performance.now() - t0, cpuMs: (c.user + c.system) / 1000, value };
}

async function mergeOnly(files: Uint8Array[]): Promise<Uint8Array> {
  const out = await PDFDocument.create();
  for (const bytes of files) {
    const src = await PDFDocument.load(bytes);
    const pages = await out.copyPages(src, src.getPageIndices());
    for (const p of pages) out.addPage(p);
  }
  return out.save();
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

async function main() {
  const timer = setInterval(sample, 5);
  const files = await Promise.all(Array.from({ length: DATASHEETS }, (_, i) => makeDatasheet(i + 1)));
  const example = path.join(process.cwd(), "examples", "ferncliff-farmhouse.json");
  const parsed = parseProjectFile(JSON.parse(fs.readFileSync(example, "utf8")));
  if (!parsed.ok) throw new Error(`example does not parse: ${JSON.stringify(parsed.issues)}`);
  const run = runChecks(parsed.record);
  const tags = parsed.record.equipment.map((e) => e.tag);
  const datasheets: DatasheetAttachment[] = files.map((bytes, i) => ({
    title: `Datasheet ${i + 1}`,
    equipmentTag: tags[i % Math.max(1, tags.length)],
    bytes,
  }));
  const input: PacketInput = {
    record: parsed.record,
    run,
    labels: [],
    revision: { number: 1, createdAt: "2026-12-01T12:00:00.000Z", preparedBy: "Bench", organisation: "Bench" },
    datasheets,
  };

  // One warm-up of each so module loading and JIT do not count against either side.
  await mergeOnly(files);
  await renderPacketPdf(input);
  sample();
  const baselineRss = peakRss;

  const merge: number[] = [];
  const packet: number[] = [];
  const mergeCpu: number[] = [];
  const packetCpu: number[] = [];
  let pages = 0;
  let bytes = 0;
  for (let i = 0; i < RUNS; i += 1) {
    const m = await timed(() => mergeOnly(files));
    merge.push(m.ms);
    mergeCpu.push(m.cpuMs);
    sample();
    const r = await timed(() => renderPacketPdf(input));
    sample();
    packet.push(r.ms);
    packetCpu.push(r.cpuMs);
    pages = r.value.pageCount;
    bytes = r.value.bytes.length;
  }
  clearInterval(timer);
  const m = median(merge);
  const p = median(packet);
  const mb = (n: number) => (n / 1024 / 1024).toFixed(1);
  const inputMb = files.reduce((t, f) => t + f.length, 0);
  console.log(`datasheets: ${DATASHEETS} × ${PAGES_EACH} pages, ${mb(inputMb)} MB; packet: ${pages} pages, ${mb(bytes)} MB`);
  console.log(`pdf-lib merge alone: median ${m.toFixed(0)} ms wall, ${median(mergeCpu).toFixed(0)} ms CPU (runs: ${merge.map((x) => x.toFixed(0)).join(", ")})`);
  console.log(`whole packet:        median ${p.toFixed(0)} ms wall, ${median(packetCpu).toFixed(0)} ms CPU (runs: ${packet.map((x) => x.toFixed(0)).join(", ")})`);
  console.log(`ratio packet / merge: ${(p / m).toFixed(2)}× wall, ${(median(packetCpu) / median(mergeCpu)).toFixed(2)}× CPU (aim: under 2×)`);
  console.log(`peak RSS: ${mb(peakRss)} MB (after warm-up ${mb(baselineRss)} MB)`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
