import { deflateSync } from "node:zlib";
import { PDFDocument, StandardFonts } from "pdf-lib";

/** A real PDF of the given number of pages, made with pdf-lib, classic xref table and trailer. */
export async function makePdf(pages = 2, title = "Datasheet"): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(title);
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let i = 0; i < pages; i++) {
    const page = doc.addPage([612, 792]);
    page.drawText(`${title}, page ${i + 1}`, { x: 72, y: 720, size: 14, font });
  }
  return doc.save({ useObjectStreams: false });
}

const latin1 = (bytes: Uint8Array) => Buffer.from(bytes).toString("latin1");
const fromLatin1 = (text: string) => new Uint8Array(Buffer.from(text, "latin1"));

/**
 * A PDF whose trailer names an encryption dictionary, as a password-protected
 * file's does (ISO 32000-1 §7.6.1). The trailer follows the xref table, so
 * inserting into it moves no object offsets.
 */
export async function makeEncryptedLookingPdf(form: "reference" | "inline" = "reference"): Promise<Uint8Array> {
  const text = latin1(await makePdf(1, "Protected datasheet"));
  const entry = form === "reference" ? "/Encrypt 99 0 R" : "/Encrypt << /Filter /Standard /V 2 /R 3 /Length 128 /P -3904 >>";
  if (!text.includes("trailer\n<<")) throw new Error("fixture: expected a classic trailer");
  return fromLatin1(text.replace("trailer\n<<", `trailer\n<<\n${entry}\n`));
}

/** The first part of a real PDF, as a download cut short leaves it. */
export async function makeTruncatedPdf(): Promise<Uint8Array> {
  const bytes = await makePdf(3);
  return bytes.slice(0, Math.floor(bytes.length * 0.6));
}

/** Starts and ends like a PDF, with nothing readable between. */
export function makeGarbledPdf(): Uint8Array {
  return fromLatin1("%PDF-1.7\n%\xe2\xe3\xcf\xd3\n" + "this is not a PDF body ".repeat(40) + "\nstartxref\n12\n%%EOF\n");
}

function crc32(bytes: Uint8Array): number {
  let crc = 0xffffffff;
  for (const b of bytes) {
    crc ^= b;
    for (let k = 0; k < 8; k++) crc = crc & 1 ? (crc >>> 1) ^ 0xedb88320 : crc >>> 1;
  }
  return (crc ^ 0xffffffff) >>> 0;
}

function pngChunk(type: string, data: Uint8Array): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const typed = Buffer.concat([Buffer.from(type, "latin1"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed));
  return Buffer.concat([length, typed, crc]);
}

/** A real RGB PNG (PNG spec §5: signature, IHDR, IDAT, IEND). */
export function makePng(width = 4, height = 3): Uint8Array {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // colour type: truecolour
  const rows = Buffer.alloc((width * 3 + 1) * height);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) rows[y * (width * 3 + 1) + 1 + x * 3] = (x * 60) & 0xff;
  return new Uint8Array(
    Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      pngChunk("IHDR", ihdr),
      pngChunk("IDAT", deflateSync(rows)),
      pngChunk("IEND", new Uint8Array(0)),
    ]),
  );
}

/** The PNG signature followed by nothing a decoder can read. */
export function makeBrokenPng(): Uint8Array {
  return new Uint8Array(Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.from("not chunks at all, just text")]));
}

/**
 * The smallest JPEG structure a reader needs for its size: SOI, a baseline
 * SOF0 segment (ITU-T T.81 B.2.2: 8-bit, 1 × 1, three components), EOI.
 */
export function makeJpeg(width = 1, height = 1): Uint8Array {
  return new Uint8Array([
    0xff, 0xd8, 0xff, 0xc0, 0x00, 0x11, 0x08, height >> 8, height & 0xff, width >> 8, width & 0xff, 0x03, 0x01, 0x22, 0x00, 0x02, 0x11, 0x01, 0x03, 0x11, 0x01, 0xff, 0xd9,
  ]);
}

/** A JPEG that opens with an APP0 (JFIF) segment before its frame header, as cameras and editors write them. */
export function makeJfif(width: number, height: number): Uint8Array {
  const app0 = [0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00];
  const rest = makeJpeg(width, height).slice(2);
  return new Uint8Array([0xff, 0xd8, ...app0, ...rest]);
}

/**
 * A decompression bomb: a valid 1-bit greyscale PNG of width × height pixels,
 * all black, which deflates to a few tens of kilobytes but decodes to
 * width × height × 4 bytes of RGBA.
 */
export function makePngBomb(width: number, height: number): Uint8Array {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // colour type: greyscale
  const rowBytes = 1 + Math.ceil(width / 8);
  return new Uint8Array(
    Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      pngChunk("IHDR", ihdr),
      pngChunk("IDAT", deflateSync(Buffer.alloc(rowBytes * height), { level: 9 })),
      pngChunk("IEND", new Uint8Array(0)),
    ]),
  );
}

/**
 * A real PDF carrying one extra object stream (ISO 32000-1 §7.5.7) whose Flate
 * data inflates to `inflatedBytes` of spaces: a few kilobytes on disk.
 */
export async function makePdfBomb(inflatedBytes: number): Promise<Uint8Array> {
  const text = latin1(await makePdf(1, "Datasheet"));
  const data = deflateSync(Buffer.alloc(inflatedBytes, 0x20), { level: 9 });
  const object = Buffer.concat([
    Buffer.from(`99 0 obj\n<< /Type /ObjStm /N 1 /First 4 /Filter /FlateDecode /Length ${data.length} >>\nstream\n`, "latin1"),
    data,
    Buffer.from("\nendstream\nendobj\n", "latin1"),
  ]);
  const at = text.indexOf("\n", text.indexOf("%PDF-")) + 1;
  return new Uint8Array(Buffer.concat([Buffer.from(text.slice(0, at), "latin1"), object, Buffer.from(text.slice(at), "latin1")]));
}

/** The start of an HEIC photo as phones write it (ISO/IEC 23008-12 'ftyp' box, brand heic). */
export function makeHeicHead(): Uint8Array {
  return new Uint8Array(Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from("ftypheic\0\0\0\0mif1heic", "latin1"), Buffer.alloc(64)]));
}
