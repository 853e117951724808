import { pdflibAddPlaceholder } from "@signpdf/placeholder-pdf-lib";
import { P12Signer } from "@signpdf/signer-p12";
import signpdf from "@signpdf/signpdf";
import { PDFDocument } from "pdf-lib";

export interface SignatureInfo {
  /** Shown by PDF readers as the signer's name beside the certificate's own. */
  name: string;
  reason: string;
  location: string;
  contactInfo: string;
  signingTime: Date;
}

/**
 * Room left for the PKCS#7 signature in the file: a 2048- or 4096-bit RSA
 * signature with its certificate chain fits in a few kilobytes; 16 KiB leaves
 * room for a longer chain (@signpdf's default is 8 KiB).
 */
const SIGNATURE_BYTES = 16_384;

/**
 * Signs a finished PDF with a PKCS#12 certificate: an invisible signature
 * whose byte range covers the whole file except the signature itself, so any
 * PDF reader shows who signed and that not a byte has changed since.
 */
export async function signPdf(pdf: Uint8Array, p12: Uint8Array, password: string, info: SignatureInfo): Promise<Buffer> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  pdflibAddPlaceholder({
    pdfDoc: doc,
    reason: info.reason,
    contactInfo: info.contactInfo,
    name: info.name,
    location: info.location,
    signingTime: info.signingTime,
    signatureLength: SIGNATURE_BYTES,
    appName: "Sundocket",
  });
  // Object streams would compress the signature dictionary, and the signer must find its placeholder in plain bytes.
  const withPlaceholder = await doc.save({ useObjectStreams: false });
  const signer = new P12Signer(Buffer.from(p12), { passphrase: password });
  return signpdf.sign(Buffer.from(withPlaceholder), signer, info.signingTime);
}
