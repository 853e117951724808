import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { signingCertificates, type SigningCertificate } from "../../../db/schema";
import { env } from "../../env";
import { certificateKeyFrom, CertificateKeyError, openCertificate, sealCertificate } from "../../signing/certificate-key";
import { CertificateRefusedError, readP12, type CertificateSummary } from "../../signing/p12";
import { cleanFileName } from "../attachments/upload";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid, ServiceError } from "../errors";

/** A PKCS#12 file holds a key and a short chain: a few kilobytes. 64 KiB is generous and keeps junk out of the table. */
export const CERTIFICATE_MAX_BYTES = 64 * 1024;

export interface CertificateView {
  id: string;
  fileName: string;
  subjectName: string;
  issuerName: string;
  notAfter: string;
  fingerprintSha256: string;
  uploadedAt: string;
}

export interface CertificateOptions {
  now?: Date;
  /** The sealing key; CERTIFICATE_KEY from the environment unless given. */
  certificateKey?: Buffer;
}

export function sealingKey(options: CertificateOptions): Buffer {
  if (options.certificateKey) return options.certificateKey;
  try {
    return certificateKeyFrom(env().CERTIFICATE_KEY);
  } catch (error) {
    if (error instanceof CertificateKeyError) throw new ServiceError("conflict", `Signing is not set up on this server: ${error.message}`);
    throw error;
  }
}

function toView(row: SigningCertificate): CertificateView {
  return {
    id: row.id,
    fileName: row.fileName,
    subjectName: row.subjectName,
    issuerName: row.issuerName,
    notAfter: row.notAfter,
    fingerprintSha256: row.fingerprintSha256,
    uploadedAt: row.createdAt,
  };
}

export function currentCertificateRow(ctx: ServiceContext): SigningCertificate | undefined {
  return ctx.db
    .select()
    .from(signingCertificates)
    .where(and(eq(signingCertificates.userId, ctx.user.id), eq(signingCertificates.orgId, ctx.orgId), eq(signingCertificates.current, true)))
    .orderBy(desc(signingCertificates.createdAt))
    .get();
}

/** The signed-in reviewer's stored signing certificate, described; null before they upload one. */
export function getOwnCertificate(ctx: ServiceContext): CertificateView | null {
  requirePermission(ctx, "licence:edit-own", "keep a signing certificate");
  const row = currentCertificateRow(ctx);
  return row ? toView(row) : null;
}

/** A certificate refusal as a field error of the form that asked for the password or the file. */
export function certificateIssue(error: unknown, passwordField: string): never {
  if (error instanceof CertificateRefusedError) {
    throw invalid(error.message, [{ path: error.reason === "password" ? passwordField : "certificate", message: error.message }]);
  }
  throw error;
}

/**
 * Stores a reviewer's PKCS#12 signing certificate, sealed at rest. The
 * password is asked for only to check that it opens the file and to read who
 * the certificate names; it is not kept, so each signing asks for it again.
 */
export function uploadSigningCertificate(
  ctx: ServiceContext,
  input: { fileName: string; bytes: Uint8Array; password: string },
  options: CertificateOptions = {},
): CertificateView {
  requirePermission(ctx, "licence:edit-own", "keep a signing certificate");
  const fileName = cleanFileName(input.fileName);
  if (input.bytes.length === 0 || input.bytes.length > CERTIFICATE_MAX_BYTES) {
    throw invalid(`A signing certificate file is at most ${CERTIFICATE_MAX_BYTES / 1024} KB; “${fileName}” is ${Math.ceil(input.bytes.length / 1024)} KB.`, [{ path: "certificate", message: "is not a certificate file" }]);
  }
  if (!input.password) throw invalid("Type the certificate's password so it can be checked.", [{ path: "certificatePassword", message: "is required" }]);
  const key = sealingKey(options);
  let summary: CertificateSummary;
  try {
    summary = readP12(input.bytes, input.password, options.now ?? new Date());
  } catch (error) {
    certificateIssue(error, "certificatePassword");
  }
  const sealed = sealCertificate(key, input.bytes);
  const row = ctx.db.transaction((tx) => {
    tx.update(signingCertificates)
      .set({ current: false })
      .where(and(eq(signingCertificates.userId, ctx.user.id), eq(signingCertificates.orgId, ctx.orgId), eq(signingCertificates.current, true)))
      .run();
    const inserted = tx
      .insert(signingCertificates)
      .values({ orgId: ctx.orgId, userId: ctx.user.id, sealed, fileName, ...summary, current: true })
      .returning()
      .get();
    audit(tx, ctx, "certificate.uploaded", "signing_certificate", inserted.id, {
      fileName,
      subjectName: summary.subjectName,
      issuerName: summary.issuerName,
      notAfter: summary.notAfter,
      fingerprintSha256: summary.fingerprintSha256,
    });
    return inserted;
  });
  return toView(row);
}

/** The stored certificate's bytes, unsealed in memory for one signing. */
export function unsealOwnCertificate(ctx: ServiceContext, options: CertificateOptions): { row: SigningCertificate; p12: Buffer } | null {
  const row = currentCertificateRow(ctx);
  if (!row) return null;
  try {
    return { row, p12: openCertificate(sealingKey(options), row.sealed) };
  } catch (error) {
    if (error instanceof CertificateKeyError) throw new ServiceError("conflict", `Your stored certificate cannot be read: ${error.message} Upload it again.`);
    throw error;
  }
}
