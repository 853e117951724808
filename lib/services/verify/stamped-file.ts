import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { getDb, type Db } from "../../../db/client";
import { packetRevisions, packetSignatures, projects, reviews, users } from "../../../db/schema";

export type VerifyAnswer =
  | { stamped: false; sha256: string }
  | {
      stamped: true;
      sha256: string;
      projectName: string;
      revisionNumber: number;
      reviewerName: string;
      licenceNumber: string | null;
      licenceRegion: string | null;
      approvedAt: string;
      /** The digital signature the file carries, or null for a stamped packet that was not signed. */
      signature: { subjectName: string; signedAt: string } | null;
    };

export const SHA256_HEX = /^[0-9a-f]{64}$/;

/**
 * Answers a permit counter's question about one file: is this exact file
 * (by SHA-256) the current stamped PDF of an approved revision, and if so of
 * which project, stamped by whom and when. Nothing else is told: no
 * organisation, address, design data or other revisions, and an unknown hash
 * gets the same answer whether or not a similar file exists. No account is
 * needed, so there is no context and no organisation scope: the hash itself
 * is the only key, and it names one file.
 */
export function lookUpStampedFile(db: Db, sha256Input: string): VerifyAnswer {
  const sha256 = sha256Input.trim().toLowerCase();
  if (!SHA256_HEX.test(sha256)) return { stamped: false, sha256 };
  const row = db
    .select({ id: packetRevisions.id, number: packetRevisions.number, projectName: projects.name })
    .from(packetRevisions)
    .innerJoin(projects, and(eq(projects.id, packetRevisions.projectId), eq(projects.orgId, packetRevisions.orgId)))
    .where(and(eq(packetRevisions.pdfSha256, sha256), eq(packetRevisions.reviewState, "approved"), eq(packetRevisions.state, "ready")))
    .get();
  if (!row) return { stamped: false, sha256 };
  const approval = db
    .select({ createdAt: reviews.createdAt, licence: reviews.licenceSnapshot, reviewerName: users.name })
    .from(reviews)
    .innerJoin(users, eq(users.id, reviews.reviewerId))
    .where(and(eq(reviews.revisionId, row.id), eq(reviews.decision, "approved")))
    .orderBy(desc(reviews.createdAt))
    .get();
  if (!approval) return { stamped: false, sha256 };
  const signature = db
    .select({ subjectName: packetSignatures.certificateSubject, signedAt: packetSignatures.signedAt })
    .from(packetSignatures)
    .where(eq(packetSignatures.signedPdfSha256, sha256))
    .get();
  return {
    stamped: true,
    sha256,
    projectName: row.projectName,
    revisionNumber: row.number,
    reviewerName: approval.licence?.reviewerName ?? approval.reviewerName,
    licenceNumber: approval.licence?.licenceNumber ?? null,
    licenceRegion: approval.licence?.region ?? null,
    approvedAt: approval.createdAt,
    signature: signature ?? null,
  };
}

/** The same answer from the app's own database, for the public route and page. */
export function checkStampedFile(sha256: string): VerifyAnswer {
  return lookUpStampedFile(getDb(), sha256);
}
