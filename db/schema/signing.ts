import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { organisations } from "./organisations";
import { packetRevisions } from "./packet-revisions";
import { users } from "./users";

/**
 * A reviewer's PKCS#12 signing certificate, sealed with AES-256-GCM under
 * CERTIFICATE_KEY (lib/signing/certificate-key.ts). Its password is never
 * stored: the reviewer types it each time they sign. The readable columns
 * describe the certificate so the licence page can show it without opening it.
 */
export const signingCertificates = sqliteTable(
  "signing_certificates",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    userId: text("user_id")
      .notNull()
      .references(() => users.id),
    sealed: text("sealed").notNull(),
    fileName: text("file_name").notNull(),
    subjectName: text("subject_name").notNull(),
    issuerName: text("issuer_name").notNull(),
    serialNumber: text("serial_number").notNull(),
    notBefore: text("not_before").notNull(),
    notAfter: text("not_after").notNull(),
    fingerprintSha256: text("fingerprint_sha256").notNull(),
    /** False once replaced by a newer upload; kept so earlier signatures still name their certificate. */
    current: integer("current", { mode: "boolean" }).notNull().default(true),
    createdAt: createdAt(),
  },
  (t) => [index("signing_certificates_user_idx").on(t.userId, t.current)],
);
export type SigningCertificate = typeof signingCertificates.$inferSelect;

/** A digitally signed stamped packet: which file, signed by whom with which certificate, from which unsigned rendering. */
export const packetSignatures = sqliteTable(
  "packet_signatures",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    revisionId: text("revision_id")
      .notNull()
      .references(() => packetRevisions.id),
    signedPdfSha256: text("signed_pdf_sha256").notNull(),
    unsignedPdfSha256: text("unsigned_pdf_sha256").notNull(),
    signerId: text("signer_id")
      .notNull()
      .references(() => users.id),
    certificateId: text("certificate_id").references(() => signingCertificates.id),
    certificateSubject: text("certificate_subject").notNull(),
    certificateFingerprint: text("certificate_fingerprint").notNull(),
    signedAt: text("signed_at").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("packet_signatures_sha_idx").on(t.signedPdfSha256), index("packet_signatures_revision_idx").on(t.revisionId)],
);
export type PacketSignature = typeof packetSignatures.$inferSelect;
