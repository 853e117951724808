import "server-only";
import { and, desc, eq, inArray, or } from "drizzle-orm";
import type { Db } from "../../../db/client";
import {
  organisations,
  packetRevisions,
  projects,
  jurisdictions,
  reviewNotes,
  reviewerLicences,
  reviews,
  users,
  type PacketRevision,
} from "../../../db/schema";
import type { CheckRun } from "../../compliance";
import { requiredLabels } from "../../compliance/labels";
import { formatIssues } from "../../schemas/fields";
import { buildPacketModel } from "../../packet/model";
import { renderPacketDocx } from "../../packet/docx";
import { renderPacketPdf } from "../../packet/pdf";
import { SHEET_TEMPLATE_NAMES, type DatasheetAttachment, type PacketApproval, type PacketInput, type ReviewNote, type SheetTemplateName } from "../../packet/types";
import { projectRecordSchema, type ProjectRecord } from "../../schemas/project-record";
import { getAttachment, getAttachmentFile, getAttachmentFiles } from "../attachments";
import { contextForUser, type ServiceContext } from "../context";
import { ServiceError } from "../errors";
import { documentTitle } from "./documents";
import { revisionHistoryFor } from "./history";
import { packetsRoot, removePacketFile, writePacketFile, type WrittenPacketFile } from "./packet-files";
import type { ProgressStep } from "./view";

class StepError extends Error {}

function reasonOf(error: unknown): string {
  if (error instanceof ServiceError) {
    const issues = error.issues.slice(0, 3).map((i) => `${i.path}: ${i.message}`);
    return issues.length ? `${error.message} (${issues.join("; ")})` : error.message;
  }
  if (error instanceof Error) return error.message;
  return String(error);
}

/** Marks a revision that is still generating as failed; a finished or failed one is left as it is. */
export function failRevision(db: Db, revisionId: string, reason: string, step?: string): void {
  const row = db.select({ state: packetRevisions.state, progressStep: packetRevisions.progressStep }).from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get();
  if (!row || row.state !== "generating") return;
  db.update(packetRevisions)
    .set({
      state: "failed",
      error: `Step "${step ?? row.progressStep}": ${reason}`,
      pdfPath: null,
      pdfSha256: null,
      pageCount: null,
      docxPath: null,
      docxSha256: null,
    })
    .where(and(eq(packetRevisions.id, revisionId), eq(packetRevisions.state, "generating")))
    .run();
}

function approvalFor(db: Db, row: PacketRevision): { approval?: Omit<PacketApproval, "stampImage">; stampAttachmentId?: string | null; notes: ReviewNote[] } {
  const all = db
    .select({ review: reviews, reviewerName: users.name })
    .from(reviews)
    .leftJoin(users, eq(users.id, reviews.reviewerId))
    .where(and(eq(reviews.revisionId, row.id), eq(reviews.orgId, row.orgId)))
    .orderBy(desc(reviews.createdAt))
    .all();
  const notes: ReviewNote[] = [];
  if (all.length) {
    const byReview = new Map(all.map((r) => [r.review.id, r.reviewerName ?? "Reviewer"]));
    const rows = db.select().from(reviewNotes).where(inArray(reviewNotes.reviewId, [...byReview.keys()])).all();
    for (const n of rows) notes.push({ target: n.targetId || n.targetKind, text: n.text, author: byReview.get(n.reviewId) ?? "Reviewer" });
  }
  // An approval counts only for the exact record it was given for.
  const approved = all.find((r) => r.review.decision === "approved" && r.review.licenceSnapshot && r.review.approvedSha256 === row.recordSha256);
  if (!approved) return { notes };
  const licence = approved.review.licenceSnapshot!;
  const stamp = db
    .select({ stampAttachmentId: reviewerLicences.stampAttachmentId })
    .from(reviewerLicences)
    .where(and(eq(reviewerLicences.userId, approved.review.reviewerId), eq(reviewerLicences.orgId, row.orgId)))
    .get();
  return {
    approval: {
      reviewerName: licence.reviewerName,
      licenceNumber: licence.licenceNumber,
      licenceState: licence.region,
      licenceDiscipline: licence.discipline,
      approvedAt: approved.review.createdAt,
      recordSha256: row.recordSha256,
      dispositions: (approved.review.dispositions ?? []).map((d) => ({
        item: d.subject && !d.title.includes(d.subject) ? `${d.title} (${d.subject})` : d.title,
        disposition: d.disposition,
        note: d.note,
      })),
    },
    stampAttachmentId: stamp?.stampAttachmentId ?? null,
    notes,
  };
}

function templateOverridesFor(db: Db, row: PacketRevision): Partial<Record<SheetTemplateName, string>> {
  const found = db
    .select({ overrides: jurisdictions.templateOverrides })
    .from(projects)
    .innerJoin(jurisdictions, and(eq(jurisdictions.id, projects.jurisdictionId), eq(jurisdictions.orgId, row.orgId)))
    .where(and(eq(projects.id, row.projectId), eq(projects.orgId, row.orgId)))
    .get();
  const out: Partial<Record<SheetTemplateName, string>> = {};
  for (const [name, source] of Object.entries(found?.overrides ?? {})) {
    if ((SHEET_TEMPLATE_NAMES as readonly string[]).includes(name) && typeof source === "string" && source.trim()) out[name as SheetTemplateName] = source;
  }
  return out;
}

export interface GenerateOptions {
  /** Where the files go; PACKETS_DIR unless given. */
  packetsDir?: string;
}

/**
 * Renders a generating revision's PDF and DOCX from its snapshots and
 * attachments, stores both under PACKETS_DIR by SHA-256 and records the
 * hashes and page count, updating progressStep as it goes. On any failure
 * the revision is marked failed with the step and the reason, and the files
 * this run wrote are removed: a failed revision has no files and cannot be
 * downloaded, reviewed or submitted.
 */
export async function generateRevisionArtifacts(db: Db, revisionId: string, options: GenerateOptions = {}): Promise<PacketRevision> {
  const initial = db.select().from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get();
  if (!initial) throw new Error(`no packet revision ${revisionId}`);
  // Seeded rows recorded before their files existed are rendered as well.
  const renderable = initial.state === "generating" || (initial.state === "ready" && (!initial.pdfPath || !initial.docxPath));
  if (!renderable) return initial;
  const row = initial;
  const root = options.packetsDir ?? packetsRoot();
  const written: WrittenPacketFile[] = [];
  let step: ProgressStep = "snapshot";
  const at = (next: ProgressStep) => {
    step = next;
    db.update(packetRevisions).set({ progressStep: next }).where(eq(packetRevisions.id, row.id)).run();
  };
  const stillOurs = or(eq(packetRevisions.state, "generating"), eq(packetRevisions.state, "ready"));

  try {
    at("snapshot");
    const parsed = projectRecordSchema.safeParse(row.recordSnapshot);
    if (!parsed.success) {
      const first = formatIssues(parsed.error)[0];
      throw new StepError(`the record snapshot does not validate${first ? ` (${first.path}: ${first.message})` : ""}`);
    }
    const record: ProjectRecord = parsed.data;
    if (!row.createdBy) throw new StepError("the revision has no author to generate it for");
    const ctx: ServiceContext = contextForUser(db, row.createdBy);
    if (ctx.orgId !== row.orgId) throw new StepError("the revision's author belongs to another organisation");

    at("checks");
    const run = row.resultsSnapshot as CheckRun;
    if (!run || !Array.isArray(run.results) || !run.counts) throw new StepError("the check results snapshot is missing");
    const labels = requiredLabels(record, run.edition, { calculatedOn: row.createdAt.slice(0, 10) });
    const { approval, stampAttachmentId, notes } = approvalFor(db, row);
    const org = db.select().from(organisations).where(eq(organisations.id, row.orgId)).get();
    const author = db.select({ name: users.name }).from(users).where(eq(users.id, row.createdBy)).get();

    at("sheets");
    const ids = Array.isArray(row.attachmentIds) ? row.attachmentIds : [];
    const views = ids.map((id) => getAttachment(ctx, id));
    const sitePlanView = views.find((v) => v.kind === "site-plan");
    const mergedViews = views.filter((v) => v !== sitePlanView);
    let sitePlan: PacketInput["sitePlan"];
    if (sitePlanView) {
      const file = await getAttachmentFile(ctx, sitePlanView.id);
      const type = file.attachment.mimeType === "application/pdf" ? "pdf" : file.attachment.mimeType === "image/png" ? "png" : "jpeg";
      sitePlan = { bytes: file.bytes, type, fileName: file.attachment.fileName };
    }
    let stampImage: PacketApproval["stampImage"];
    if (approval && stampAttachmentId) {
      const stamp = await getAttachmentFile(ctx, stampAttachmentId);
      if (stamp.attachment.mimeType === "image/png" || stamp.attachment.mimeType === "image/jpeg") {
        stampImage = { bytes: stamp.bytes, type: stamp.attachment.mimeType === "image/png" ? "png" : "jpeg" };
      }
    }
    const input: PacketInput = {
      record,
      run,
      labels,
      revision: {
        number: row.number,
        createdAt: row.createdAt,
        preparedBy: author?.name ?? "",
        organisation: org?.name ?? "",
        ...(org?.licenceNumber
          ? { organisationLicence: { number: org.licenceNumber, classification: org.licenceClassification ?? undefined, state: org.licenceState ?? undefined } }
          : {}),
        organisationContact: { phone: org?.phone ?? undefined, email: org?.email ?? undefined, address: org?.address ?? undefined },
      },
      revisionHistory: revisionHistoryFor(db, row),
      ...(approval ? { approval: { ...approval, ...(stampImage ? { stampImage } : {}) } } : {}),
      reviewNotes: notes,
      ...(sitePlan ? { sitePlan } : {}),
      datasheets: [],
      templateOverrides: templateOverridesFor(db, row),
    };
    // Lays every sheet template out once before any bytes are read, so a bad template is named at this step.
    buildPacketModel(input);

    at("datasheets");
    const files = await getAttachmentFiles(ctx, mergedViews.map((v) => v.id));
    const datasheets: DatasheetAttachment[] = files.map((f) => ({
      title: documentTitle(record, f.attachment),
      ...(f.attachment.equipmentTag ? { equipmentTag: f.attachment.equipmentTag } : {}),
      bytes: f.bytes,
    }));
    const full: PacketInput = { ...input, datasheets };
    const model = buildPacketModel(full);
    const pdf = await renderPacketPdf(full);
    const pdfFile = await writePacketFile(root, pdf.bytes, "pdf");
    if (pdfFile.created) written.push(pdfFile);

    at("docx");
    const docx = await renderPacketDocx(full, { sheetPages: pdf.sheetPages });
    const docxFile = await writePacketFile(root, docx, "docx");
    if (docxFile.created) written.push(docxFile);

    const done = db
      .update(packetRevisions)
      .set({
        state: "ready",
        progressStep: "done",
        error: null,
        isDraft: row.isDraft || model.draft.isDraft,
        pdfPath: pdfFile.key,
        pdfSha256: pdfFile.sha256,
        pageCount: pdf.pageCount,
        docxPath: docxFile.key,
        docxSha256: docxFile.sha256,
      })
      .where(and(eq(packetRevisions.id, row.id), stillOurs))
      .run();
    if (done.changes === 0) throw new StepError("the revision was closed while it was being generated");
  } catch (error) {
    for (const file of written) await removePacketFile(root, file.key).catch(() => undefined);
    const reason = reasonOf(error);
    // The attachment ids stay, so an approved revision whose stamped rendering failed can be rendered again.
    db.update(packetRevisions)
      .set({ state: "failed", error: `Step "${step}": ${reason}`, pdfPath: null, pdfSha256: null, pageCount: null, docxPath: null, docxSha256: null })
      .where(and(eq(packetRevisions.id, row.id), stillOurs))
      .run();
  }
  return db.select().from(packetRevisions).where(eq(packetRevisions.id, row.id)).get()!;
}
