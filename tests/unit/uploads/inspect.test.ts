import { PDFDocument } from "pdf-lib";
import { describe, expect, it } from "vitest";
import { hasEncryptEntry, hasEofMarker, inspectUpload } from "../../../lib/uploads/inspect";
import { UploadRefusedError } from "../../../lib/uploads/refusal";
import { sniffContent } from "../../../lib/uploads/sniff";
import {
  makeBrokenPng,
  makeEncryptedLookingPdf,
  makeGarbledPdf,
  makeHeicHead,
  makeJpeg,
  makePdf,
  makePng,
  makeTruncatedPdf,
} from "./fixtures";

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

describe("PDFs are checked by content", () => {
  it("accepts a real PDF and counts its pages", async () => {
    const result = await inspectUpload(await makePdf(3), { fileName: "korvane-kv-100-30.pdf", maxBytes: 25 * MB, kind: "datasheet" });
    expect(result.content.mimeType).toBe("application/pdf");
    expect(result.content.extension).toBe("pdf");
    expect(result.pageCount).toBe(3);
  });

  it("refuses a PDF whose trailer names an encryption dictionary by reference", async () => {
    const bytes = await makeEncryptedLookingPdf("reference");
    expect(hasEncryptEntry(bytes)).toBe(true);
    const error = await refusal(inspectUpload(bytes, { fileName: "locked.pdf", maxBytes: 25 * MB, kind: "datasheet" }));
    expect(error.reason).toBe("encrypted");
    expect(error.httpStatus).toBe(400);
    expect(error.message).toContain("password-protected or encrypted");
    expect(error.message).toContain("locked.pdf");
  });

  it("refuses an inline encryption dictionary, which pdf-lib itself also treats as encrypted", async () => {
    const bytes = await makeEncryptedLookingPdf("inline");
    await expect(PDFDocument.load(bytes)).rejects.toThrow(/encrypted/i);
    const error = await refusal(inspectUpload(bytes, { fileName: "locked.pdf", maxBytes: 25 * MB }));
    expect(error.reason).toBe("encrypted");
  });

  it("does not mistake the word /Encrypt inside a document's text for an encryption entry", async () => {
    const bytes = await makePdf(1, "Notes on /Encrypt entries");
    expect(hasEncryptEntry(bytes)).toBe(false);
    expect((await inspectUpload(bytes, { fileName: "notes.pdf", maxBytes: 25 * MB })).pageCount).toBe(1);
  });

  it("refuses a PDF cut short before its end marker", async () => {
    const bytes = await makeTruncatedPdf();
    expect(hasEofMarker(bytes)).toBe(false);
    const error = await refusal(inspectUpload(bytes, { fileName: "half.pdf", maxBytes: 25 * MB, kind: "datasheet" }));
    expect(error.reason).toBe("corrupt");
    expect(error.message).toContain("cut short");
  });

  it("refuses a file with a PDF header and end marker but no readable document between", async () => {
    const error = await refusal(inspectUpload(makeGarbledPdf(), { fileName: "garbled.pdf", maxBytes: 25 * MB, kind: "datasheet" }));
    expect(error.reason).toBe("corrupt");
    expect(error.httpStatus).toBe(400);
  });
});

describe("the name never decides the type", () => {
  it("refuses a PNG renamed .pdf as a datasheet, and says what it really is", async () => {
    const error = await refusal(inspectUpload(makePng(), { fileName: "inverter-datasheet.pdf", maxBytes: 25 * MB, kind: "datasheet" }));
    expect(error.reason).toBe("wrong-kind");
    expect(error.httpStatus).toBe(415);
    expect(error.message).toBe("“inverter-datasheet.pdf” is a PNG image, though it is named .pdf; a datasheet must be a PDF.");
  });

  it("takes the same PNG as what it is where an image is allowed", async () => {
    const result = await inspectUpload(makePng(), { fileName: "site.pdf", maxBytes: 25 * MB, kind: "site-plan" });
    expect(result.content.mimeType).toBe("image/png");
    expect(result.pageCount).toBeNull();
  });

  it("refuses a PDF where an image is required", async () => {
    const error = await refusal(inspectUpload(await makePdf(1), { fileName: "nameplate.pdf", maxBytes: 25 * MB, kind: "photo" }));
    expect(error.reason).toBe("wrong-kind");
    expect(error.message).toContain("a photo must be a PNG or JPEG image");
  });

  it("recognises PNG and JPEG by their signature bytes", () => {
    expect(sniffContent(makePng())).toMatchObject({ accepted: true, content: { mimeType: "image/png" } });
    expect(sniffContent(makeJpeg())).toMatchObject({ accepted: true, content: { mimeType: "image/jpeg" } });
    // One byte short of the eight-byte PNG signature is not a PNG.
    expect(sniffContent(makePng().slice(0, 7)).accepted).toBe(false);
  });

  it("accepts a JPEG photo", async () => {
    const result = await inspectUpload(makeJpeg(), { fileName: "nameplate-inv-1.jpg", maxBytes: 25 * MB, kind: "photo" });
    expect(result.content).toMatchObject({ mimeType: "image/jpeg", extension: "jpg" });
  });

  it("refuses a PNG that has the signature but no readable image", async () => {
    const error = await refusal(inspectUpload(makeBrokenPng(), { fileName: "label.png", maxBytes: 25 * MB, kind: "photo" }));
    expect(error.reason).toBe("corrupt");
  });

  it("refuses an HEIC phone photo with a way forward", async () => {
    const error = await refusal(inspectUpload(makeHeicHead(), { fileName: "IMG_2041.HEIC", maxBytes: 25 * MB, kind: "photo" }));
    expect(error.reason).toBe("unsupported-type");
    expect(error.httpStatus).toBe(415);
    expect(error.message).toContain("HEIC");
    expect(error.message).toContain("JPEG");
  });

  it("refuses a text file named .pdf, naming the mismatch", async () => {
    const error = await refusal(inspectUpload(new Uint8Array(Buffer.from("Module: 410 W\n")), { fileName: "module.pdf", maxBytes: 25 * MB }));
    expect(error.reason).toBe("unsupported-type");
    expect(error.message).toContain("named .pdf, but its content is a text file");
  });
});

describe("size", () => {
  it("refuses a file over the configured limit with 413, naming both sizes", async () => {
    const bytes = await makePdf(2);
    const limit = bytes.length - 1;
    const error = await refusal(inspectUpload(bytes, { fileName: "big.pdf", maxBytes: limit, kind: "datasheet" }));
    expect(error.reason).toBe("too-large");
    expect(error.httpStatus).toBe(413);
    expect(error.message).toMatch(/is \d+(\.\d)? KB; the largest file accepted is \d+(\.\d)? KB/);
  });

  it("accepts a file of exactly the limit", async () => {
    const bytes = await makePdf(2);
    await expect(inspectUpload(bytes, { fileName: "fits.pdf", maxBytes: bytes.length })).resolves.toMatchObject({ pageCount: 2 });
  });

  it("refuses an empty file", async () => {
    const error = await refusal(inspectUpload(new Uint8Array(0), { fileName: "empty.pdf", maxBytes: 25 * MB }));
    expect(error.reason).toBe("empty");
    expect(error.httpStatus).toBe(400);
  });
});
