import "server-only";
import { and, eq } from "drizzle-orm";
import { jurisdictions, packetSignatures, reviews } from "../../../db/schema";
import { can } from "../../auth/permissions";
import { canonicalJson, sha256Hex } from "../../canonical-json";
import { CHECK_STATUSES, type CheckResult, type CheckRun, type CheckStatus } from "../../compliance/types";
import { requirePermission, type ServiceContext } from "../context";
import { ServiceError } from "../errors";
import { getProjectRecord } from "../projects/get-record";
import { revisionDelta, sendMessage, type RevisionDelta } from "./delta";
import { listRevisionReviews, type ReviewEntry } from "./history";
import { toLicenceView, type LicenceView } from "./licence";
import { currentCertificateRow } from "./certificate";
import { independenceRefusal, licenceCoverageRefusal } from "./independence";
import { findOwnLicence, findRevisionForReview, PACKET_SHEETS, snapshotIntact, snapshotRun, supersedingRevision } from "./shared";

export type ReviewCheck = Pick<CheckResult, "id" | "checkId" | "title" | "status" | "message" | "values" | "formula" | "codeRefs"> & {
  subject: string | null;
  reason: string | null;
};

export interface ReviewWorkspace {
  revision: {
    id: string;
    number: number;
    state: "generating" | "ready" | "failed";
    progressStep: string;
    error: string | null;
    reviewState: "draft" | "in-review" | "returned" | "approved";
    isDraft: boolean;
    pageCount: number | null;
    recordSha256: string;
    pdfSha256: string | null;
    createdAt: string;
    createdByName: string | null;
    /** Inline PDF for the reader's frame, and the download of the same file. */
    pdfViewUrl: string | null;
    pdfDownloadUrl: string | null;
  };
  project: { id: string; name: string; client: string; address: string; jurisdictionName: string | null; status: string };
  edition: CheckRun["edition"] | null;
  counts: CheckRun["counts"] | null;
  /** Check results of the snapshot, grouped by status, worst first; empty groups left out. */
  groups: { status: CheckStatus; results: ReviewCheck[] }[];
  sheets: readonly { code: string; title: string }[];
  /** False when the frozen record no longer hashes to recordSha256; such a revision cannot be approved. */
  snapshotIntact: boolean;
  /** True when the project's record today differs from the snapshot; null when it cannot be read. */
  recordChangedSince: boolean | null;
  history: ReviewEntry[];
  /** The actor's own licence when they review; null otherwise or before they have recorded one. */
  licence: LicenceView | null;
  mayDecide: boolean;
  /** Why the actor may not decide this revision at all (they took part in the work), or null. */
  decisionRefusal: string | null;
  /** Why the actor's licence does not cover the project's jurisdiction, or null; it blocks approval only. */
  licenceCoverage: string | null;
  maySend: boolean;
  /** The later revision that replaces this one; a superseded revision is not sent again. */
  supersededBy: number | null;
  /** What changed since the earlier revision a reviewer decided on; null for a first review. */
  delta: RevisionDelta | null;
  /** The designer's message sent with this revision. */
  sendMessage: { text: string; by: string | null; at: string } | null;
  /** The digital signature on the revision's current PDF, or null when it is not signed. */
  signature: { subjectName: string; signedAt: string } | null;
  /** The actor's stored signing certificate, when they review; approving then asks for its password. */
  certificate: { subjectName: string; notAfter: string } | null;
  /** True when the actor stamped this revision, its PDF is ready and not yet signed. */
  maySign: boolean;
}

/** Everything the review page shows, read from the revision's snapshots rather than the live design. */
export function getReviewWorkspace(ctx: ServiceContext, revisionId: string, options: { now?: Date } = {}): ReviewWorkspace {
  requirePermission(ctx, "review:read", "read reviews");
  const { row, project, createdByName } = findRevisionForReview(ctx, revisionId);
  const run = snapshotRun(row);
  const groups = CHECK_STATUSES.map((status) => ({
    status,
    results: (run?.results ?? [])
      .filter((r) => r.status === status)
      .map((r) => ({
        id: r.id,
        checkId: r.checkId,
        title: r.title,
        subject: r.subject ?? null,
        status: r.status,
        message: r.message,
        reason: r.reason ?? null,
        values: r.values,
        formula: r.formula,
        codeRefs: r.codeRefs,
      })),
  })).filter((g) => g.results.length > 0);

  let recordChangedSince: boolean | null = null;
  try {
    recordChangedSince = sha256Hex(canonicalJson(getProjectRecord(ctx, project.id).record)) !== row.recordSha256;
  } catch (error) {
    // A stored project that no longer validates cannot be compared; the page says so rather than guessing.
    if (!(error instanceof ServiceError)) throw error;
  }
  const jurisdiction = project.jurisdictionId
    ? ctx.db.select({ name: jurisdictions.name }).from(jurisdictions).where(eq(jurisdictions.id, project.jurisdictionId)).get()
    : undefined;
  const hasPdf = row.state === "ready" && Boolean(row.pdfPath);
  const reviewer = can(ctx.roles, "review:decide");
  const open = row.state === "ready" && row.reviewState === "in-review";
  const decisionRefusal = reviewer && open ? independenceRefusal(ctx, row, project) : null;
  const ownLicence = reviewer && open ? findOwnLicence(ctx) : undefined;
  const licenceCoverage = ownLicence ? licenceCoverageRefusal(ctx, ownLicence, project) : null;
  const signature = row.pdfSha256
    ? (ctx.db
        .select({ subjectName: packetSignatures.certificateSubject, signedAt: packetSignatures.signedAt })
        .from(packetSignatures)
        .where(and(eq(packetSignatures.signedPdfSha256, row.pdfSha256), eq(packetSignatures.orgId, ctx.orgId)))
        .get() ?? null)
    : null;
  const certificateRow = reviewer && can(ctx.roles, "licence:edit-own") ? currentCertificateRow(ctx) : undefined;
  const stampedByActor =
    row.reviewState === "approved" &&
    Boolean(ctx.db.select({ id: reviews.id }).from(reviews).where(and(eq(reviews.revisionId, row.id), eq(reviews.decision, "approved"), eq(reviews.reviewerId, ctx.user.id))).get());
  const superseding = supersedingRevision(ctx, row);
  return {
    supersededBy: superseding?.number ?? null,
    revision: {
      id: row.id,
      number: row.number,
      state: row.state,
      progressStep: row.progressStep,
      error: row.error,
      reviewState: row.reviewState,
      isDraft: row.isDraft,
      pageCount: row.pageCount,
      recordSha256: row.recordSha256,
      pdfSha256: row.pdfSha256,
      createdAt: row.createdAt,
      createdByName,
      pdfViewUrl: hasPdf ? `/api/reviews/${row.id}/pdf` : null,
      pdfDownloadUrl: hasPdf ? `/api/revisions/${row.id}/pdf` : null,
    },
    project: {
      id: project.id,
      name: project.name,
      client: project.client,
      address: project.address,
      jurisdictionName: jurisdiction?.name ?? null,
      status: project.status,
    },
    edition: run?.edition ?? null,
    counts: run?.counts ?? null,
    groups,
    sheets: PACKET_SHEETS,
    snapshotIntact: snapshotIntact(row),
    recordChangedSince,
    history: listRevisionReviews(ctx, row.id),
    licence: reviewer && can(ctx.roles, "licence:edit-own") ? toLicenceView(ctx, options.now) : null,
    mayDecide: reviewer && open && decisionRefusal === null,
    decisionRefusal,
    licenceCoverage,
    signature,
    certificate: certificateRow ? { subjectName: certificateRow.subjectName, notAfter: certificateRow.notAfter } : null,
    maySign: reviewer && stampedByActor && row.state === "ready" && signature === null,
    maySend: can(ctx.roles, "review:send") && row.state === "ready" && (row.reviewState === "draft" || row.reviewState === "returned"),
    delta: revisionDelta(ctx, row),
    sendMessage: sendMessage(ctx, row.id),
  };
}
