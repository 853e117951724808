import { createInflate, constants } from "node:zlib";

/**
 * The most bytes a PDF's Flate streams may inflate to, all together. pdf-lib
 * inflates every object stream when it loads a file, so a 100 KB upload whose
 * object stream inflates to gigabytes would take the server's memory with it.
 * Datasheets and scanned site plans inflate to a few times their size (their
 * images are mostly JPEG, which stays compressed); 256 MB is ten times the
 * upload limit.
 */
export const PDF_MAX_INFLATED_BYTES = 256 * 1024 * 1024;

const STREAM = Buffer.from("stream", "latin1");
const ENDSTREAM = Buffer.from("endstream", "latin1");

/** A zlib header (RFC 1950 §2.2): deflate method, window ≤ 32 K, and a check value that makes CMF·256 + FLG a multiple of 31. */
function isZlibHeader(cmf: number | undefined, flg: number | undefined): boolean {
  if (cmf === undefined || flg === undefined) return false;
  return (cmf & 0x0f) === 8 && cmf >> 4 <= 7 && (cmf * 256 + flg) % 31 === 0;
}

/** Counts what one stream inflates to, stopping as soon as the count passes `budget`. Damaged data counts what came out before the damage. */
function inflatedLength(data: Buffer, budget: number): Promise<number> {
  return new Promise((resolve) => {
    let total = 0;
    let settled = false;
    const inflate = createInflate({ finishFlush: constants.Z_SYNC_FLUSH });
    const finish = () => {
      if (settled) return;
      settled = true;
      resolve(total);
    };
    inflate.on("data", (chunk: Buffer) => {
      total += chunk.length;
      if (total > budget) {
        inflate.destroy();
        finish();
      }
    });
    inflate.on("end", finish);
    inflate.on("error", finish);
    inflate.on("close", finish);
    inflate.end(data);
  });
}

/**
 * The bytes a PDF's zlib-compressed streams inflate to, counted without
 * keeping them, up to just past `cap` (then the answer is over the cap and the
 * count stops). Streams are found by their keywords (ISO 32000-1 §7.3.8), so a
 * file too damaged to parse is still measured.
 */
export async function measureInflatedPdf(bytes: Uint8Array, cap = PDF_MAX_INFLATED_BYTES): Promise<{ inflatedBytes: number; overCap: boolean }> {
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let total = 0;
  let at = buf.indexOf(STREAM, 0);
  while (at >= 0) {
    // "endstream" also contains "stream"; only a keyword followed by an end of line starts data.
    let start = at + STREAM.length;
    const preceded = at >= 3 && buf.subarray(at - 3, at).toString("latin1") === "end";
    if (!preceded && (buf[start] === 0x0d || buf[start] === 0x0a)) {
      if (buf[start] === 0x0d && buf[start + 1] === 0x0a) start += 2;
      else start += 1;
      const end = buf.indexOf(ENDSTREAM, start);
      const stop = end < 0 ? buf.length : end;
      if (isZlibHeader(buf[start], buf[start + 1])) {
        total += await inflatedLength(buf.subarray(start, stop), cap - total);
        if (total > cap) return { inflatedBytes: total, overCap: true };
      }
      at = buf.indexOf(STREAM, stop + ENDSTREAM.length);
      continue;
    }
    at = buf.indexOf(STREAM, at + STREAM.length);
  }
  return { inflatedBytes: total, overCap: false };
}
