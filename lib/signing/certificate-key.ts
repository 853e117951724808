import { createCipheriv, createDecipheriv, randomBytes } from "node:crypto";

/**
 * Signing certificates are kept encrypted at rest with AES-256-GCM under a
 * key from the environment (CERTIFICATE_KEY, 32 bytes in base64), so a copy of
 * the database alone does not hold a usable certificate file. GCM's tag also
 * refuses a stored blob that was altered. The PKCS#12 file is itself
 * password-protected; that password is never stored anywhere.
 */
const VERSION = "v1";
const IV_BYTES = 12; // the GCM nonce length NIST SP 800-38D recommends
const KEY_BYTES = 32;

export class CertificateKeyError extends Error {}

export function certificateKeyFrom(base64: string | undefined): Buffer {
  if (!base64) throw new CertificateKeyError("CERTIFICATE_KEY is not set: signing certificates cannot be stored or read.");
  const key = Buffer.from(base64, "base64");
  if (key.length !== KEY_BYTES) throw new CertificateKeyError(`CERTIFICATE_KEY must be ${KEY_BYTES} bytes in base64 (it decodes to ${key.length}).`);
  return key;
}

/** "v1.<iv>.<tag>.<ciphertext>", each part base64url. */
export function sealCertificate(key: Buffer, plain: Uint8Array): string {
  const iv = randomBytes(IV_BYTES);
  const cipher = createCipheriv("aes-256-gcm", key, iv);
  const body = Buffer.concat([cipher.update(plain), cipher.final()]);
  return [VERSION, iv.toString("base64url"), cipher.getAuthTag().toString("base64url"), body.toString("base64url")].join(".");
}

export function openCertificate(key: Buffer, sealed: string): Buffer {
  const [version, iv, tag, body] = sealed.split(".");
  if (version !== VERSION || !iv || !tag || body === undefined) throw new CertificateKeyError("The stored certificate is not in a form this server reads.");
  try {
    const decipher = createDecipheriv("aes-256-gcm", key, Buffer.from(iv, "base64url"));
    decipher.setAuthTag(Buffer.from(tag, "base64url"));
    return Buffer.concat([decipher.update(Buffer.from(body, "base64url")), decipher.final()]);
  } catch {
    throw new CertificateKeyError("The stored certificate could not be decrypted with this server's CERTIFICATE_KEY.");
  }
}
