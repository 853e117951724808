import forge from "node-forge";

/**
 * A throwaway certificate authority and a reviewer's signing certificate
 * issued by it, packed as a password-protected PKCS#12 file the way a
 * certificate vendor hands one over. 1024-bit keys keep the tests fast; they
 * are never used outside a test.
 */
export interface ThrowawayCertificate {
  p12: Uint8Array;
  password: string;
  caPem: string;
  certPem: string;
  subjectName: string;
}

function makeCert(publicKey: forge.pki.PublicKey, subject: forge.pki.CertificateField[], issuer: forge.pki.CertificateField[], signingKey: forge.pki.rsa.PrivateKey, opts: { ca: boolean; serial: string; notBefore: Date; notAfter: Date }) {
  const cert = forge.pki.createCertificate();
  cert.publicKey = publicKey;
  cert.serialNumber = opts.serial;
  cert.validity.notBefore = opts.notBefore;
  cert.validity.notAfter = opts.notAfter;
  cert.setSubject(subject);
  cert.setIssuer(issuer);
  cert.setExtensions(
    opts.ca
      ? [
          { name: "basicConstraints", cA: true },
          { name: "keyUsage", keyCertSign: true, cRLSign: true },
        ]
      : [
          { name: "basicConstraints", cA: false },
          { name: "keyUsage", digitalSignature: true, nonRepudiation: true },
        ],
  );
  cert.sign(signingKey, forge.md.sha256.create());
  return cert;
}

export function makeThrowawayCertificate(opts: { subjectName?: string; password?: string; notBefore?: Date; notAfter?: Date } = {}): ThrowawayCertificate {
  const subjectName = opts.subjectName ?? "Ines Marchetti, PE";
  const password = opts.password ?? "seal-it-2026";
  const notBefore = opts.notBefore ?? new Date(Date.now() - 86_400_000);
  const notAfter = opts.notAfter ?? new Date(Date.now() + 365 * 86_400_000);
  const caKeys = forge.pki.rsa.generateKeyPair(1024);
  const caName = [
    { shortName: "CN", value: "Test Licensing Board CA" },
    { shortName: "O", value: "Westmark Test Board" },
  ];
  const ca = makeCert(caKeys.publicKey, caName, caName, caKeys.privateKey, { ca: true, serial: "01", notBefore, notAfter });
  const keys = forge.pki.rsa.generateKeyPair(1024);
  const cert = makeCert(keys.publicKey, [{ shortName: "CN", value: subjectName }, { shortName: "O", value: "Quillfeather Solar Co." }], caName, caKeys.privateKey, {
    ca: false,
    serial: "02",
    notBefore,
    notAfter,
  });
  const asn1 = forge.pkcs12.toPkcs12Asn1(keys.privateKey, [cert, ca], password, { algorithm: "3des" });
  const der = forge.asn1.toDer(asn1).getBytes();
  return { p12: new Uint8Array(Buffer.from(der, "binary")), password, caPem: forge.pki.certificateToPem(ca), certPem: forge.pki.certificateToPem(cert), subjectName };
}
