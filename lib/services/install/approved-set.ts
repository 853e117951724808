import "server-only";
import { and, eq } from "drizzle-orm";
import { attachments, packetRevisions, projects, reviews, siteConfirmations, users } from "../../../db/schema";
import { queueEmail } from "../../email/outbox";
import { deliverLater } from "../../jobs";
import { requiredLabels, type LabelRequirement } from "../../compliance/labels";
import { projectRecordSchema, type ProjectRecord } from "../../schemas/project-record";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid, notFound } from "../errors";
import { moveProjectStatus } from "../projects/status";
import { activeWithRole, deliverAfterCommit } from "../submissions/shared";

export interface ApprovedSet {
  revisionId: string;
  revisionNumber: number;
  projectId: string;
  projectName: string;
  address: string;
  record: ProjectRecord;
  labels: LabelRequirement[];
  approvedBy: string | null;
  licenceNumber: string | null;
  approvedAt: string | null;
  hasPdf: boolean;
  /** label id → confirmation; equipment tag → confirmation. */
  confirmations: { itemKind: "label" | "equipment" | "clearance"; itemId: string; confirmedAt: string; note: string; photoAttachmentId: string | null }[];
}

/**
 * An approved revision as the installer works from it: the snapshot that was
 * stamped (not the live design), its labels computed from that snapshot, and
 * what has been confirmed on site. Anything not approved is "not found" here.
 */
export function getApprovedSet(ctx: ServiceContext, revisionId: string): ApprovedSet {
  requirePermission(ctx, "install:read", "open approved sets");
  const row = ctx.db
    .select({ revision: packetRevisions, project: projects })
    .from(packetRevisions)
    .innerJoin(projects, and(eq(projects.id, packetRevisions.projectId), eq(projects.orgId, ctx.orgId)))
    .where(and(eq(packetRevisions.id, revisionId), eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.reviewState, "approved")))
    .get();
  if (!row) throw notFound("Approved set");
  const record = projectRecordSchema.parse(row.revision.recordSnapshot);
  const review = ctx.db
    .select()
    .from(reviews)
    .where(and(eq(reviews.revisionId, revisionId), eq(reviews.orgId, ctx.orgId), eq(reviews.decision, "approved")))
    .get();
  const confirmations = ctx.db
    .select()
    .from(siteConfirmations)
    .where(and(eq(siteConfirmations.revisionId, revisionId), eq(siteConfirmations.orgId, ctx.orgId)))
    .all()
    .map((c) => ({ itemKind: c.itemKind, itemId: c.itemId, confirmedAt: c.createdAt, note: c.note, photoAttachmentId: c.photoAttachmentId }));
  return {
    revisionId,
    revisionNumber: row.revision.number,
    projectId: row.project.id,
    projectName: row.project.name,
    address: row.project.address,
    record,
    labels: requiredLabels(record, record.jurisdiction.necEdition, { calculatedOn: row.revision.createdAt.slice(0, 10) }),
    approvedBy: review?.licenceSnapshot?.reviewerName ?? null,
    licenceNumber: review?.licenceSnapshot?.licenceNumber ?? null,
    approvedAt: review?.createdAt ?? null,
    hasPdf: !!row.revision.pdfPath,
    confirmations,
  };
}

/**
 * Marks a label as placed (or an item as matching its nameplate) on site;
 * idempotent per item. A photo (an attachment of kind "photo" of the same
 * project) may come with it, or be added to an item already confirmed.
 */
export function confirmOnSite(
  ctx: ServiceContext,
  input: { revisionId: string; itemKind: "label" | "equipment" | "clearance"; itemId: string; note?: string; photoAttachmentId?: string },
): void {
  requirePermission(ctx, "install:confirm", "confirm installed items");
  const set = getApprovedSet(ctx, input.revisionId);
  const known =
    input.itemKind === "label"
      ? set.labels.some((l) => l.id === input.itemId)
      : input.itemKind === "equipment"
        ? set.record.equipment.some((e) => e.tag === input.itemId)
        : input.itemId.length > 0;
  if (!known) throw invalid(`${input.itemId} is not part of the approved set.`, [{ path: "itemId", message: "not in the approved set" }]);
  if (input.photoAttachmentId) {
    const photo = ctx.db
      .select({ id: attachments.id })
      .from(attachments)
      .where(
        and(
          eq(attachments.id, input.photoAttachmentId),
          eq(attachments.orgId, ctx.orgId),
          eq(attachments.projectId, set.projectId),
          eq(attachments.kind, "photo"),
        ),
      )
      .get();
    if (!photo) throw invalid("That photo is not a photo of this project.", [{ path: "photoAttachmentId", message: "not a photo of this project" }]);
  }
  const photoAttachmentId = input.photoAttachmentId ?? null;
  let mailed = 0;
  ctx.db.transaction((tx) => {
    const insert = tx.insert(siteConfirmations).values({
      orgId: ctx.orgId,
      revisionId: input.revisionId,
      itemKind: input.itemKind,
      itemId: input.itemId,
      confirmedBy: ctx.user.id,
      note: input.note ?? "",
      photoAttachmentId,
    });
    if (photoAttachmentId) {
      insert
        .onConflictDoUpdate({ target: [siteConfirmations.revisionId, siteConfirmations.itemKind, siteConfirmations.itemId], set: { photoAttachmentId } })
        .run();
    } else {
      insert.onConflictDoNothing().run();
    }
    audit(tx, ctx, "site.confirmed", "revision", input.revisionId, { itemKind: input.itemKind, itemId: input.itemId, photoAttachmentId });
    // Every label placed and every item matched to its nameplate: the system is installed (a permitted project says so).
    const done = new Set(
      tx
        .select({ itemKind: siteConfirmations.itemKind, itemId: siteConfirmations.itemId })
        .from(siteConfirmations)
        .where(and(eq(siteConfirmations.revisionId, input.revisionId), eq(siteConfirmations.orgId, ctx.orgId)))
        .all()
        .map((c) => `${c.itemKind}:${c.itemId}`),
    );
    const isComplete = (has: (key: string) => boolean) => set.labels.every((l) => has(`label:${l.id}`)) && set.record.equipment.every((e) => has(`equipment:${e.tag}`));
    const complete = isComplete((k) => done.has(k));
    if (complete) moveProjectStatus(tx, ctx, set.projectId, "installed", { reason: "site.confirmed", ifAllowed: true });
    // The item that completes the checklist tells the office and the designer, once.
    const before = new Set(set.confirmations.map((c) => `${c.itemKind}:${c.itemId}`));
    if (complete && !isComplete((k) => before.has(k))) {
      const to = new Map<string, string>();
      for (const u of [...activeWithRole(tx, ctx.orgId, "office"), ...designerOf(tx, ctx.orgId, input.revisionId)]) to.set(u.email, u.name);
      for (const email of to.keys()) {
        queueEmail(tx, ctx.orgId, email, "checklist-complete", {
          installerName: ctx.user.name,
          projectName: set.projectName,
          revisionNumber: set.revisionNumber,
          revisionId: set.revisionId,
          itemCount: set.labels.length + set.record.equipment.length,
        });
      }
      mailed = to.size;
    }
  });
  if (mailed > 0) void deliverAfterCommit(deliverLater, ctx.db, ctx.orgId);
}

function designerOf(tx: Pick<ServiceContext["db"], "select">, orgId: string, revisionId: string): { name: string; email: string }[] {
  const row = tx
    .select({ name: users.name, email: users.email, active: users.active })
    .from(packetRevisions)
    .innerJoin(users, eq(users.id, packetRevisions.createdBy))
    .where(and(eq(packetRevisions.id, revisionId), eq(packetRevisions.orgId, orgId)))
    .get();
  return row?.active ? [{ name: row.name, email: row.email }] : [];
}

export function unconfirmOnSite(ctx: ServiceContext, input: { revisionId: string; itemKind: "label" | "equipment" | "clearance"; itemId: string }): void {
  requirePermission(ctx, "install:confirm", "confirm installed items");
  getApprovedSet(ctx, input.revisionId);
  ctx.db.transaction((tx) => {
    tx.delete(siteConfirmations)
      .where(
        and(
          eq(siteConfirmations.revisionId, input.revisionId),
          eq(siteConfirmations.orgId, ctx.orgId),
          eq(siteConfirmations.itemKind, input.itemKind),
          eq(siteConfirmations.itemId, input.itemId),
        ),
      )
      .run();
    audit(tx, ctx, "site.unconfirmed", "revision", input.revisionId, { itemKind: input.itemKind, itemId: input.itemId });
  });
}
