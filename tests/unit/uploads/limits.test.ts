import { describe, expect, it } from "vitest";
import { jpegSize, MAX_IMAGE_PIXELS, pngSize } from "../../../lib/uploads/image-size";
import { inspectUpload } from "../../../lib/uploads/inspect";
import { BodyTooLargeError, readBodyLimited } from "../../../lib/uploads/limited-body";
import { measureInflatedPdf } from "../../../lib/uploads/pdf-inflate";
import { UploadRefusedError } from "../../../lib/uploads/refusal";
import { makeJfif, makeJpeg, makePdf, makePdfBomb, makePng, makePngBomb } from "./fixtures";

const MB = 1024 * 1024;

async function refusal(promise: Promise<unknown>): Promise<UploadRefusedError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof UploadRefusedError) return error;
    throw error;
  }
  throw new Error("expected the upload to be refused");
}

describe("image dimensions come from the header", () => {
  it("reads a PNG's IHDR (PNG spec §11.2.2) and a JPEG's frame header (ITU-T T.81 §B.2.2)", () => {
    expect(pngSize(makePng(7, 5))).toEqual({ width: 7, height: 5 });
    expect(jpegSize(makeJpeg(640, 480))).toEqual({ width: 640, height: 480 });
    expect(jpegSize(makeJfif(4032, 3024))).toEqual({ width: 4032, height: 3024 });
  });

  it("refuses a small PNG that would decode to gigabytes, before decoding it", async () => {
    // 20000 × 20000 one-bit pixels: about 50 KB on disk, 1.6 GB as RGBA.
    const bomb = makePngBomb(20_000, 20_000);
    expect(bomb.length).toBeLessThan(200 * 1024);
    const started = Date.now();
    const error = await refusal(inspectUpload(bomb, { fileName: "site-plan.png", maxBytes: 25 * MB, kind: "site-plan" }));
    expect(error.reason).toBe("too-many-pixels");
    expect(error.httpStatus).toBe(413);
    expect(error.message).toContain("20000 × 20000 px");
    expect(Date.now() - started).toBeLessThan(2_000);
  });

  it("refuses a JPEG photo over the pixel bound, and accepts a 12 MP phone photo", async () => {
    const huge = await refusal(inspectUpload(makeJfif(60_000, 60_000), { fileName: "nameplate.jpg", maxBytes: 25 * MB, kind: "photo" }));
    expect(huge.reason).toBe("too-many-pixels");
    await expect(inspectUpload(makeJfif(4032, 3024), { fileName: "nameplate.jpg", maxBytes: 25 * MB, kind: "photo" })).resolves.toMatchObject({ pageCount: null });
    expect(4032 * 3024).toBeLessThan(MAX_IMAGE_PIXELS);
  });
});

describe("a PDF's inflated size is capped before pdf-lib loads it", () => {
  it("measures what the Flate streams inflate to", async () => {
    const measured = await measureInflatedPdf(await makePdfBomb(3 * MB), 64 * MB);
    expect(measured.overCap).toBe(false);
    expect(measured.inflatedBytes).toBeGreaterThanOrEqual(3 * MB);
  });

  it("refuses an object-stream bomb past the cap, and stops counting there", async () => {
    const bomb = await makePdfBomb(8 * MB);
    expect(bomb.length).toBeLessThan(64 * 1024);
    const measured = await measureInflatedPdf(bomb, 1 * MB);
    expect(measured.overCap).toBe(true);
    expect(measured.inflatedBytes).toBeLessThan(2 * MB);
    const error = await refusal(inspectUpload(bomb, { fileName: "datasheet.pdf", maxBytes: 25 * MB, kind: "datasheet", maxInflatedBytes: 1 * MB }));
    expect(error.reason).toBe("inflates-too-large");
    expect(error.httpStatus).toBe(413);
  });

  it("accepts an ordinary datasheet, with or without object streams", async () => {
    await expect(inspectUpload(await makePdf(3), { fileName: "datasheet.pdf", maxBytes: 25 * MB, kind: "datasheet", maxInflatedBytes: 1 * MB })).resolves.toMatchObject({ pageCount: 3 });
  });
});

/** A body that yields `chunkBytes` per read, up to `totalBytes`, and counts the reads; no Content-Length, as a chunked request. */
function chunkedRequest(chunkBytes: number, totalBytes: number) {
  const counter = { reads: 0 };
  const stream = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        counter.reads += 1;
        if (counter.reads * chunkBytes > totalBytes) controller.close();
        else controller.enqueue(new Uint8Array(chunkBytes));
      },
    },
    { highWaterMark: 0 },
  );
  const request = new Request("http://localhost/api/uploads", { method: "POST", body: stream, duplex: "half" } as RequestInit);
  return { request, counter };
}

describe("request bodies are counted on the stream", () => {
  it("stops reading a chunked body just past the limit", async () => {
    const { request, counter } = chunkedRequest(1024, 512 * MB);
    expect(request.headers.get("content-length")).toBeNull();
    await expect(readBodyLimited(request, 8 * 1024)).rejects.toBeInstanceOf(BodyTooLargeError);
    expect(counter.reads).toBeLessThanOrEqual(10);
  });

  it("reads a body within the limit whole", async () => {
    const { request } = chunkedRequest(1000, 5000);
    expect((await readBodyLimited(request, 8 * 1024)).length).toBe(5000);
  });
});
