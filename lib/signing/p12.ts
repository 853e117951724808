import { createHash } from "node:crypto";
import forge from "node-forge";

export interface CertificateSummary {
  /** The certificate holder's common name, as a PDF reader shows the signer. */
  subjectName: string;
  issuerName: string;
  serialNumber: string;
  notBefore: string;
  notAfter: string;
  /** SHA-256 of the DER-encoded certificate, lower-case hex. */
  fingerprintSha256: string;
}

export class CertificateRefusedError extends Error {
  constructor(
    readonly reason: "password" | "no-key" | "expired" | "not-p12",
    message: string,
  ) {
    super(message);
  }
}

function commonName(name: forge.pki.Certificate["subject"]): string {
  const cn = name.getField("CN")?.value as string | undefined;
  const o = name.getField("O")?.value as string | undefined;
  return cn ?? o ?? name.attributes.map((a) => `${a.shortName ?? a.name}=${String(a.value)}`).join(", ");
}

/**
 * Opens a PKCS#12 file with its password and describes the signing
 * certificate in it (the one whose key it carries). Refuses a wrong password,
 * a file without a private key and, given `now`, a certificate outside its
 * validity period: a PDF reader would show such a signature as invalid.
 */
export function readP12(bytes: Uint8Array, password: string, now?: Date): CertificateSummary {
  let p12: forge.pkcs12.Pkcs12Pfx;
  try {
    const asn1 = forge.asn1.fromDer(forge.util.createBuffer(Buffer.from(bytes).toString("binary")));
    p12 = forge.pkcs12.pkcs12FromAsn1(asn1, false, password);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    if (/mac|password|invalid/i.test(message)) throw new CertificateRefusedError("password", "The certificate's password is not right, or the file is damaged.");
    throw new CertificateRefusedError("not-p12", "This file is not a PKCS#12 certificate (.p12 or .pfx).");
  }
  const bags = (type: string): forge.pkcs12.Bag[] => p12.getBags({ bagType: type })[type] ?? [];
  const keyBags = [...bags(forge.pki.oids.pkcs8ShroudedKeyBag!), ...bags(forge.pki.oids.keyBag!)];
  const key = keyBags.find((b) => b.key)?.key as forge.pki.rsa.PrivateKey | undefined;
  if (!key) throw new CertificateRefusedError("no-key", "The certificate file holds no private key, so it cannot sign.");
  const certs = bags(forge.pki.oids.certBag!)
    .map((b) => b.cert)
    .filter((c): c is forge.pki.Certificate => Boolean(c));
  // The signing certificate is the one whose public key matches the private key; the others are its chain.
  const cert = certs.find((c) => {
    const pub = c.publicKey as forge.pki.rsa.PublicKey;
    return pub.n && pub.n.compareTo(key.n) === 0 && pub.e.compareTo(key.e) === 0;
  });
  if (!cert) throw new CertificateRefusedError("no-key", "The certificate file holds no certificate for its private key.");
  if (now && (now < cert.validity.notBefore || now > cert.validity.notAfter)) {
    throw new CertificateRefusedError("expired", `The certificate is valid from ${cert.validity.notBefore.toISOString().slice(0, 10)} to ${cert.validity.notAfter.toISOString().slice(0, 10)}, not today.`);
  }
  const der = forge.asn1.toDer(forge.pki.certificateToAsn1(cert)).getBytes();
  return {
    subjectName: commonName(cert.subject),
    issuerName: commonName(cert.issuer),
    serialNumber: cert.serialNumber,
    notBefore: cert.validity.notBefore.toISOString(),
    notAfter: cert.validity.notAfter.toISOString(),
    fingerprintSha256: createHash("sha256").update(Buffer.from(der, "binary")).digest("hex"),
  };
}
