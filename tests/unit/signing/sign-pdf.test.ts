import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { PDFDocument, StandardFonts } from "pdf-lib";
import { afterAll, describe, expect, it } from "vitest";
import { certificateKeyFrom, openCertificate, sealCertificate } from "../../../lib/signing/certificate-key";
import { readP12 } from "../../../lib/signing/p12";
import { signPdf } from "../../../lib/signing/sign-pdf";
import { checkPdfSignature } from "./pdf-signature";
import { makeThrowawayCertificate } from "./throwaway-ca";

const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-sign-"));
afterAll(() => fs.rmSync(scratch, { recursive: true, force: true }));

const cert = makeThrowawayCertificate();
const INFO = { name: "Ines Marchetti, PE", reason: "Approved", location: "Westmark", contactInfo: "reviewer@example.test", signingTime: new Date("2026-12-01T12:00:00Z") };

async function twoSheetPacket(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (const sheet of ["G-001", "E-001"]) doc.addPage([1224, 792]).drawText(`Sheet ${sheet}`, { x: 72, y: 700, size: 14, font });
  return doc.save();
}

/** poppler's pdfsig, a reader that shares no code with the signer. */
function pdfsig(bytes: Uint8Array): string {
  const file = path.join(scratch, `${Math.random().toString(36).slice(2)}.pdf`);
  fs.writeFileSync(file, bytes);
  try {
    return execFileSync("pdfsig", [file], { encoding: "utf8" });
  } catch (error) {
    // pdfsig exits non-zero for an invalid signature but still reports it.
    return String((error as { stdout?: string }).stdout ?? "");
  }
}

describe("signing a stamped packet", () => {
  it("reads the certificate only with its password and describes it", () => {
    const summary = readP12(cert.p12, cert.password);
    expect(summary.subjectName).toBe("Ines Marchetti, PE");
    expect(summary.issuerName).toBe("Test Licensing Board CA");
    expect(summary.fingerprintSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(() => readP12(cert.p12, "not the password")).toThrow(/password/);
    expect(() => readP12(new TextEncoder().encode("not a certificate"), cert.password)).toThrow();
  });

  it("refuses a certificate outside its validity period", () => {
    expect(() => readP12(cert.p12, cert.password, new Date("2040-01-01T00:00:00Z"))).toThrow(/valid from/);
  });

  it("signs the whole file: the byte range covers everything but the signature, and both pdfsig and a PKCS#7 check accept it", async () => {
    const signed = await signPdf(await twoSheetPacket(), cert.p12, cert.password, INFO);
    const check = checkPdfSignature(signed);
    expect(check.coversWholeFile).toBe(true);
    expect(check.byteRange[0]).toBe(0);
    expect(check.byteRange[2] + check.byteRange[3]).toBe(signed.length);
    expect(check.digestMatches).toBe(true);
    expect(check.signatureValid).toBe(true);
    expect(check.signerCommonName).toBe("Ines Marchetti, PE");

    const report = pdfsig(signed);
    expect(report).toContain("Signer Certificate Common Name: Ines Marchetti, PE");
    expect(report).toContain("Total document signed");
    expect(report).toContain("Signature Validation: Signature is Valid.");
    // The still-valid PDF keeps both sheets.
    expect((await PDFDocument.load(signed)).getPageCount()).toBe(2);
  });

  it("breaks when one byte of the signed content changes", async () => {
    const signed = await signPdf(await twoSheetPacket(), cert.p12, cert.password, INFO);
    const text = signed.toString("latin1");
    // Change one character of the sheet text ("G-001" → "G-002") inside the first signed range.
    const at = text.indexOf("Sheet G-001") >= 0 ? text.indexOf("Sheet G-001") + 10 : text.indexOf("/Producer") + 3;
    expect(at).toBeGreaterThan(0);
    expect(at).toBeLessThan(checkPdfSignature(signed).byteRange[1]);
    const tampered = Buffer.from(signed);
    tampered[at] = tampered[at]! ^ 0x01;
    const check = checkPdfSignature(tampered);
    expect(check.digestMatches).toBe(false);
    expect(pdfsig(tampered)).not.toContain("Signature is Valid.");
  });

  it("keeps the certificate sealed at rest: AES-256-GCM under the environment key, and an altered blob or another key is refused", () => {
    const key = certificateKeyFrom(Buffer.alloc(32, 7).toString("base64"));
    const sealed = sealCertificate(key, cert.p12);
    expect(sealed).not.toContain(Buffer.from(cert.p12).toString("base64url").slice(0, 40));
    expect(new Uint8Array(openCertificate(key, sealed))).toEqual(cert.p12);
    const parts = sealed.split(".");
    const body = Buffer.from(parts[3]!, "base64url");
    body[0] = body[0]! ^ 0x01;
    expect(() => openCertificate(key, [...parts.slice(0, 3), body.toString("base64url")].join("."))).toThrow(/could not be decrypted/);
    expect(() => openCertificate(certificateKeyFrom(Buffer.alloc(32, 8).toString("base64")), sealed)).toThrow(/could not be decrypted/);
    expect(() => certificateKeyFrom(Buffer.alloc(16).toString("base64"))).toThrow(/32 bytes/);
    expect(() => certificateKeyFrom(undefined)).toThrow(/not set/);
  });
});
