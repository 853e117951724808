/**
 * A stand-in stamp image for the demo reviewer: two rings and a star, drawn
 * pixel by pixel and written as a PNG. The reviewer's name and licence are
 * printed as text beside it on each sheet, so the image carries no words.
 */
import zlib from "node:zlib";

function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(body) >>> 0);
  return Buffer.concat([length, body, crc]);
}

function insideStar(x: number, y: number, r: number): boolean {
  // A five-pointed star as the union of its triangles, tested by angle and radius.
  const angle = Math.atan2(y, x) + Math.PI / 2;
  const sector = ((angle % ((2 * Math.PI) / 5)) + (2 * Math.PI) / 5) % ((2 * Math.PI) / 5);
  const t = Math.abs(sector - Math.PI / 5) / (Math.PI / 5);
  const edge = r * (0.38 + 0.62 * t);
  return Math.hypot(x, y) <= edge;
}

export function demoStampPng(size = 240): Uint8Array {
  const rows: Buffer[] = [];
  const c = size / 2;
  for (let py = 0; py < size; py++) {
    const row = Buffer.alloc(1 + size * 4);
    for (let px = 0; px < size; px++) {
      const x = px - c + 0.5;
      const y = py - c + 0.5;
      const d = Math.hypot(x, y);
      const ring = (d > c * 0.9 && d < c * 0.98) || (d > c * 0.7 && d < c * 0.74);
      const ink = ring || insideStar(x, y, c * 0.5);
      const o = 1 + px * 4;
      row[o] = 0x1f;
      row[o + 1] = 0x3a;
      row[o + 2] = 0x6b;
      row[o + 3] = ink ? 0xff : 0x00;
    }
    rows.push(row);
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 6; // RGBA
  return new Uint8Array(
    Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      chunk("IHDR", ihdr),
      chunk("IDAT", zlib.deflateSync(Buffer.concat(rows))),
      chunk("IEND", Buffer.alloc(0)),
    ]),
  );
}
