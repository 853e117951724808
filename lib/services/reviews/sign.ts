import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { packetRevisions, packetSignatures, reviews } from "../../../db/schema";
import { CertificateRefusedError, readP12, type CertificateSummary } from "../../signing/p12";
import { signPdf } from "../../signing/sign-pdf";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid, notFound } from "../errors";
import { packetsRoot, readPacketFile, writePacketFile } from "../revisions/packet-files";
import { certificateIssue, unsealOwnCertificate, type CertificateOptions } from "./certificate";
import { findRevisionForReview } from "./shared";

export interface SigningSecret {
  /** The PKCS#12 password, typed for this signing and never stored. */
  password: string;
  /** A certificate file given for this signing only; the reviewer's stored certificate otherwise. */
  p12?: Uint8Array;
}

export interface SignOptions extends CertificateOptions {
  packetsDir?: string;
}

export interface SignedPacket {
  revisionId: string;
  pdfSha256: string;
  signerName: string;
  message: string;
}

/**
 * The certificate this signing uses, opened with its password; refused
 * before anything changes when the password is wrong or no certificate is at
 * hand. Approval with signing calls this first, so a mistyped password does
 * not leave an approval without its signature.
 */
export function openSigningCertificate(ctx: ServiceContext, secret: SigningSecret, options: CertificateOptions = {}): { p12: Uint8Array; summary: CertificateSummary; certificateId: string | null } {
  if (!secret.password) throw invalid("Type your certificate's password to sign.", [{ path: "certificatePassword", message: "is required" }]);
  let p12: Uint8Array;
  let certificateId: string | null = null;
  if (secret.p12) {
    p12 = secret.p12;
  } else {
    const stored = unsealOwnCertificate(ctx, options);
    if (!stored) throw invalid("Upload your signing certificate on Your licence and stamp, or choose a certificate file to sign with.", [{ path: "certificate", message: "is not on file" }]);
    p12 = stored.p12;
    certificateId = stored.row.id;
  }
  try {
    return { p12, summary: readP12(p12, secret.password, options.now ?? new Date()), certificateId };
  } catch (error) {
    if (error instanceof CertificateRefusedError) certificateIssue(error, "certificatePassword");
    throw error;
  }
}

/**
 * Digitally signs an approved revision's stamped PDF with the approving
 * reviewer's certificate. The signed file replaces the revision's PDF (its
 * SHA-256 is what /verify recognises); the unsigned rendering's hash is kept
 * on the signature row. Only the reviewer whose approval the stamp carries may
 * sign: a signature by anyone else would claim a seal they did not give.
 */
export async function signStampedPacket(ctx: ServiceContext, revisionId: string, secret: SigningSecret, options: SignOptions = {}): Promise<SignedPacket> {
  requirePermission(ctx, "review:decide", "sign stamped packets");
  const { row, project } = findRevisionForReview(ctx, revisionId);
  if (row.reviewState !== "approved") throw conflict(`Revision ${row.number} is not approved; only a stamped packet is signed.`);
  if (row.state !== "ready" || !row.pdfPath || !row.pdfSha256) throw conflict(`Revision ${row.number}'s stamped packet is ${row.state === "generating" ? "still being rendered" : "not ready"}; sign it once it is.`);
  const approval = ctx.db
    .select()
    .from(reviews)
    .where(and(eq(reviews.revisionId, row.id), eq(reviews.orgId, ctx.orgId), eq(reviews.decision, "approved")))
    .orderBy(desc(reviews.createdAt))
    .get();
  if (!approval) throw notFound("The approval of this revision");
  if (approval.reviewerId !== ctx.user.id) throw invalid("Only the reviewer who approved and stamped this revision can sign it.", [{ path: "revision", message: "was stamped by another reviewer" }]);
  const already = ctx.db.select({ id: packetSignatures.id }).from(packetSignatures).where(eq(packetSignatures.signedPdfSha256, row.pdfSha256)).get();
  if (already) throw conflict(`Revision ${row.number}'s stamped packet is already signed.`);

  const { p12, summary, certificateId } = openSigningCertificate(ctx, secret, options);
  const root = options.packetsDir ?? packetsRoot();
  const unsigned = await readPacketFile(root, row.pdfPath);
  if (!unsigned) throw notFound(`The stored PDF of revision ${row.number}`);
  const now = options.now ?? new Date();
  const licence = approval.licenceSnapshot;
  const signed = await signPdf(unsigned, p12, secret.password, {
    name: licence?.reviewerName ?? ctx.user.name,
    reason: `Approved and stamped: ${project.name}, revision ${row.number}${licence ? `, licence ${licence.licenceNumber}` : ""}`,
    location: licence?.region ?? "",
    contactInfo: ctx.user.email,
    signingTime: now,
  });
  const file = await writePacketFile(root, signed, "pdf");

  ctx.db.transaction((tx) => {
    const moved = tx
      .update(packetRevisions)
      .set({ pdfPath: file.key, pdfSha256: file.sha256 })
      .where(and(eq(packetRevisions.id, row.id), eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.pdfSha256, row.pdfSha256!), eq(packetRevisions.state, "ready")))
      .run();
    if (moved.changes === 0) throw conflict(`Revision ${row.number}'s packet changed while it was being signed; reload and sign again.`);
    tx.insert(packetSignatures)
      .values({
        orgId: ctx.orgId,
        revisionId: row.id,
        signedPdfSha256: file.sha256,
        unsignedPdfSha256: row.pdfSha256!,
        signerId: ctx.user.id,
        certificateId,
        certificateSubject: summary.subjectName,
        certificateFingerprint: summary.fingerprintSha256,
        signedAt: now.toISOString(),
      })
      .run();
    audit(tx, ctx, "review.signed", "packet_revision", row.id, {
      projectId: project.id,
      number: row.number,
      unsignedPdfSha256: row.pdfSha256,
      signedPdfSha256: file.sha256,
      certificateSubject: summary.subjectName,
      certificateFingerprint: summary.fingerprintSha256,
      storedCertificate: certificateId !== null,
    });
  });
  return {
    revisionId: row.id,
    pdfSha256: file.sha256,
    signerName: summary.subjectName,
    message: `Revision ${row.number}'s stamped packet is signed with ${summary.subjectName}'s certificate.`,
  };
}
