import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { jurisdictions, packetRevisions, reviewNotes, reviews, users, type AttestDispositionRecord, type LicenceSnapshot } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { activeWithRole } from "../submissions/shared";
import { formatIssues } from "../../schemas/fields";
import { reviewDecisionSchema, type ReviewNoteInput } from "../../schemas/review";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid, ServiceError, type FieldIssue } from "../errors";
import { moveProjectStatus } from "../projects/status";
import { checkStampable } from "./dispositions";
import { deliverLater, renderLater } from "../../jobs";
import { independenceRefusal, licenceCoverageRefusal } from "./independence";
import {
  deliverAfterCommit,
  findOwnLicence,
  findRevisionForReview,
  isoDay,
  licenceStanding,
  noteTargetLabel,
  PACKET_SHEETS,
  snapshotIntact,
  snapshotRun,
  stampView,
} from "./shared";

export interface DecideOptions {
  now?: Date;
  /** Delivers the queued mail after commit; the outbox's SMTP delivery unless given. */
  deliver?: (db: Db, orgId: string) => Promise<unknown>;
  /**
   * Renders the approved revision again, stamped. By default the packet
   * worker process the revisions service starts; tests render in-process.
   */
  dispatch?: (revisionId: string) => void | Promise<unknown>;
}

export interface Decided {
  reviewId: string;
  revisionId: string;
  number: number;
  decision: "returned" | "approved";
  noteCount: number;
  /** The record hash the approval is bound to. */
  approvedSha256: string | null;
  /** True when the stamped packet is being rendered. */
  restamping: boolean;
  message: string;
}

/**
 * A licensed reviewer's decision on a revision waiting for review.
 *
 * Returning needs a reason (a general note or a note on a check or sheet).
 * Approving needs the reviewer's own licence on file, unexpired, with a stamp
 * image, and a revision that is not a draft; the licence is copied into the review and the approval is bound to
 * the revision's record SHA-256, after checking that the frozen record still
 * hashes to it. The project may have changed since the revision was made: the
 * approval is of the snapshot that was reviewed, which is what the packet
 * shows. After an approval the packet is rendered again with the stamp.
 */
export async function decideReview(ctx: ServiceContext, input: unknown, options: DecideOptions = {}): Promise<Decided> {
  requirePermission(ctx, "review:decide", "return or approve packets");
  const parsed = reviewDecisionSchema.safeParse(input);
  if (!parsed.success) throw invalid("The decision was not recorded: some fields are not valid.", formatIssues(parsed.error));
  const { revisionId, decision, generalNotes, notes, confirmStamp, dispositions } = parsed.data;
  const now = options.now ?? new Date();

  const { row, project } = findRevisionForReview(ctx, revisionId);
  if (row.state !== "ready") throw conflict(`Revision ${row.number} has no finished packet to decide on (${row.state}).`);
  if (row.reviewState !== "in-review") {
    const what = row.reviewState === "draft" ? "has not been sent for review" : row.reviewState === "returned" ? "was already returned" : "is already approved";
    throw conflict(`Revision ${row.number} ${what}; there is nothing to decide.`);
  }
  const independence = independenceRefusal(ctx, row, project);
  if (independence) throw new ServiceError("forbidden", independence);
  const run = snapshotRun(row);
  checkNoteTargets(notes, run ? new Set(run.results.map((r) => r.id)) : new Set());

  let licenceSnapshot: LicenceSnapshot | null = null;
  let dispositionRecords: AttestDispositionRecord[];
  if (decision === "returned") {
    dispositionRecords = checkStampable(run, decision, dispositions);
    if (!generalNotes && notes.length === 0) {
      throw invalid("Say why the revision goes back: write a general note or a note on a check or sheet.", [
        { path: "generalNotes", message: "is required when returning without notes on checks or sheets" },
      ]);
    }
  } else {
    if (confirmStamp !== true) {
      throw invalid("Confirm that you have reviewed this revision and that your stamp is to be printed on it.", [{ path: "confirmStamp", message: "must be confirmed" }]);
    }
    const licence = findOwnLicence(ctx);
    if (!licence) throw invalid("Record your licence before approving: open Your licence and stamp.", [{ path: "licence", message: "is not on file" }]);
    const { standing } = licenceStanding(licence.expiresOn, now);
    if (standing === "no-expiry") throw invalid("Your licence record has no expiry date; add it before approving.", [{ path: "licence.expiresOn", message: "is required" }]);
    if (standing === "expired") {
      throw invalid(`Your licence ${licence.licenceNumber} expired on ${licence.expiresOn}; renew it and update your licence record before approving.`, [
        { path: "licence.expiresOn", message: `is in the past (${licence.expiresOn})` },
      ]);
    }
    const coverage = licenceCoverageRefusal(ctx, licence, project);
    if (coverage) throw invalid(coverage, [{ path: "licence.region", message: "does not cover the project's jurisdiction" }]);
    if (!stampView(ctx.db, ctx.orgId, licence.stampAttachmentId)) {
      throw invalid("Upload your stamp image before approving: it is printed on every page of the approved packet.", [{ path: "licence.stamp", message: "is not on file" }]);
    }
    if (!snapshotIntact(row)) {
      throw conflict(`The frozen record of revision ${row.number} no longer matches its SHA-256, so it cannot be approved; ask the designer to generate a new revision.`);
    }
    // A draft's cover says it is not complete for submittal (checks failing or needing input, labels or documents missing); a stamp on it would say otherwise.
    if (row.isDraft) {
      throw invalid(`Revision ${row.number} is a draft: its cover lists what fails or is missing. Return it with notes so the designer can complete it; a draft cannot be stamped.`, [
        { path: "revision", message: "is a draft" },
      ]);
    }
    dispositionRecords = checkStampable(run, decision, dispositions);
    licenceSnapshot = {
      reviewerName: ctx.user.name,
      licenceNumber: licence.licenceNumber,
      region: licence.region,
      discipline: licence.discipline,
      expiresOn: licence.expiresOn,
    };
  }

  const designer = row.createdBy
    ? ctx.db
        .select({ name: users.name, email: users.email, active: users.active })
        .from(users)
        .where(and(eq(users.id, row.createdBy), eq(users.orgId, ctx.orgId)))
        .get()
    : undefined;
  const approvedSha256 = decision === "approved" ? row.recordSha256 : null;
  const createdAt = now.toISOString();

  const reviewId = ctx.db.transaction((tx) => {
    const moved = tx
      .update(packetRevisions)
      .set(decision === "approved" ? { reviewState: "approved", state: "generating", progressStep: "queued", error: null } : { reviewState: "returned" })
      .where(
        and(
          eq(packetRevisions.id, row.id),
          eq(packetRevisions.orgId, ctx.orgId),
          eq(packetRevisions.reviewState, "in-review"),
          eq(packetRevisions.state, "ready"),
          // The bound hash is the one read above; a row changed since is not the one reviewed.
          eq(packetRevisions.recordSha256, row.recordSha256),
        ),
      )
      .run();
    if (moved.changes === 0) throw conflict(`Revision ${row.number} was decided or changed while you were reviewing it; reload the page.`);
    const review = tx
      .insert(reviews)
      .values({
        orgId: ctx.orgId,
        revisionId: row.id,
        reviewerId: ctx.user.id,
        decision,
        generalNotes,
        licenceSnapshot,
        approvedSha256,
        dispositions: dispositionRecords,
        createdAt,
      })
      .returning({ id: reviews.id })
      .get();
    if (notes.length) {
      tx.insert(reviewNotes)
        .values(notes.map((n) => ({ reviewId: review.id, targetKind: n.targetKind, targetId: n.targetKind === "general" ? "" : n.targetId, text: n.text, createdAt })))
        .run();
    }
    // Only a project in review moves (the table allows nothing else); a decision on an older revision leaves a later stage alone.
    moveProjectStatus(tx, ctx, project.id, decision, { reason: `review.${decision}`, ifAllowed: true, now });
    if (decision === "approved") {
      // The office submits approved sets: it hears of one as soon as it is stamped.
      for (const office of activeWithRole(tx, ctx.orgId, "office")) {
        queueEmail(tx, ctx.orgId, office.email, "ready-to-submit", {
          reviewerName: ctx.user.name,
          revisionNumber: row.number,
          projectName: project.name,
          jurisdictionName: jurisdictionNameOf(tx, project.jurisdictionId),
        });
      }
    }
    if (designer?.active) {
      if (decision === "approved") {
        queueEmail(tx, ctx.orgId, designer.email, "approved", {
          designerName: designer.name,
          reviewerName: ctx.user.name,
          licenceNumber: licenceSnapshot!.licenceNumber,
          revisionNumber: row.number,
          projectName: project.name,
          projectId: project.id,
          revisionId: row.id,
        });
      } else {
        queueEmail(tx, ctx.orgId, designer.email, "returned", {
          designerName: designer.name,
          reviewerName: ctx.user.name,
          revisionNumber: row.number,
          projectName: project.name,
          notes: notesForEmail(generalNotes, notes, run),
          projectId: project.id,
          revisionId: row.id,
        });
      }
    }
    audit(tx, ctx, decision === "approved" ? "review.approved" : "review.returned", "packet_revision", row.id, {
      reviewId: review.id,
      projectId: project.id,
      number: row.number,
      noteCount: notes.length,
      hasGeneralNotes: generalNotes.length > 0,
      ...(licenceSnapshot ? { licenceNumber: licenceSnapshot.licenceNumber, region: licenceSnapshot.region, approvedSha256, approvedOn: isoDay(now) } : {}),
    });
    return review.id;
  });

  await deliverAfterCommit(options.deliver ?? deliverLater, ctx.db, ctx.orgId);
  if (decision === "approved") await (options.dispatch ?? ((id: string) => renderLater(ctx.db, "packet.restamp", id)))(row.id);

  const count = notes.length;
  return {
    reviewId,
    revisionId: row.id,
    number: row.number,
    decision,
    noteCount: count,
    approvedSha256,
    restamping: decision === "approved",
    message:
      decision === "approved"
        ? `Revision ${row.number} approved. The stamped packet is being rendered; ${designer?.name ?? "the designer"} has been told.`
        : `Revision ${row.number} returned to ${designer?.name ?? "the designer"} with ${count} note${count === 1 ? "" : "s"}${generalNotes ? " and general notes" : ""}.`,
  };
}

function checkNoteTargets(notes: ReviewNoteInput[], resultIds: Set<string>): void {
  const sheets = new Set(PACKET_SHEETS.map((s) => s.code));
  const issues: FieldIssue[] = [];
  notes.forEach((n, i) => {
    if (n.targetKind === "check" && !resultIds.has(n.targetId)) issues.push({ path: `notes.${i}.targetId`, message: `names no check result of this revision (${n.targetId || "empty"})` });
    if (n.targetKind === "sheet" && !sheets.has(n.targetId)) issues.push({ path: `notes.${i}.targetId`, message: `names no sheet of the packet (${n.targetId || "empty"})` });
  });
  if (issues.length) throw invalid("Some notes point at nothing in this revision.", issues);
}

function notesForEmail(generalNotes: string, notes: ReviewNoteInput[], run: ReturnType<typeof snapshotRun>): string {
  const lines: string[] = [];
  if (generalNotes) lines.push(generalNotes, "");
  for (const n of notes) lines.push(`- ${noteTargetLabel(n.targetKind, n.targetId, run)}: ${n.text}`);
  return lines.join("\n").trim() || "(no notes)";
}

function jurisdictionNameOf(tx: Pick<ServiceContext["db"], "select">, jurisdictionId: string | null): string {
  if (!jurisdictionId) return "its jurisdiction";
  return tx.select({ name: jurisdictions.name }).from(jurisdictions).where(eq(jurisdictions.id, jurisdictionId)).get()?.name ?? "its jurisdiction";
}
