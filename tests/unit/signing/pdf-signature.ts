import { createHash } from "node:crypto";
import forge from "node-forge";

/**
 * Reads the one signature of a signed PDF the way a PDF reader checks it,
 * independently of the code that signed it: the /ByteRange, the PKCS#7
 * SignedData in /Contents, the message digest over the byte ranges, and the
 * RSA signature over the signed attributes with the signer's public key.
 */
export interface PdfSignatureCheck {
  byteRange: [number, number, number, number];
  /** True when the byte ranges cover the file from its first byte to its last, less the signature's hex string. */
  coversWholeFile: boolean;
  digestMatches: boolean;
  signatureValid: boolean;
  signerCommonName: string;
}

export function checkPdfSignature(pdf: Uint8Array): PdfSignatureCheck {
  const text = Buffer.from(pdf).toString("latin1");
  const ranges = [...text.matchAll(/\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/g)];
  if (ranges.length !== 1) throw new Error(`expected one /ByteRange, found ${ranges.length}`);
  const [a, b, c, d] = ranges[0]!.slice(1, 5).map(Number) as [number, number, number, number];
  // The gap between the two ranges is exactly "<hex…>", the signature's /Contents.
  const gap = text.slice(a + b, c);
  const coversWholeFile = a === 0 && c + d === pdf.length && /^<[0-9a-fA-F]+>$/.test(gap);
  const signed = Buffer.concat([Buffer.from(pdf.subarray(a, a + b)), Buffer.from(pdf.subarray(c, c + d))]);

  const hex = gap.slice(1, -1).replace(/(00)+$/, "");
  const p7 = forge.pkcs7.messageFromAsn1(forge.asn1.fromDer(forge.util.hexToBytes(hex.length % 2 ? `${hex}0` : hex))) as forge.pkcs7.PkcsSignedData & {
    rawCapture: { authenticatedAttributes: forge.asn1.Asn1[]; signature: string };
  };
  const signer = p7.certificates[0]!;
  const attrs = p7.rawCapture.authenticatedAttributes;
  const digestAttr = attrs.find((attr) => forge.asn1.derToOid((attr.value as forge.asn1.Asn1[])[0]!.value as string) === forge.pki.oids.messageDigest);
  const claimed = ((digestAttr!.value as forge.asn1.Asn1[])[1]!.value as forge.asn1.Asn1[])[0]!.value as string;
  const actual = createHash("sha256").update(signed).digest("binary");
  // RFC 5652 §5.4: the signature is over the DER of the attributes as a SET OF, not as the [0] IMPLICIT tag they are stored under.
  const set = forge.asn1.create(forge.asn1.Class.UNIVERSAL, forge.asn1.Type.SET, true, attrs);
  const md = forge.md.sha256.create();
  md.update(forge.asn1.toDer(set).getBytes());
  let signatureValid = false;
  try {
    signatureValid = (signer.publicKey as forge.pki.rsa.PublicKey).verify(md.digest().getBytes(), p7.rawCapture.signature);
  } catch {
    signatureValid = false;
  }
  return {
    byteRange: [a, b, c, d],
    coversWholeFile,
    digestMatches: claimed === actual,
    signatureValid,
    signerCommonName: String(signer.subject.getField("CN")?.value ?? ""),
  };
}
