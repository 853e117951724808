import "server-only";
import { and, desc, eq, gt, ne } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { attachments, packetRevisions, projects, reviewerLicences, userRoles, users, type PacketRevision, type ReviewerLicence } from "../../../db/schema";
import { canonicalJson, sha256Hex } from "../../canonical-json";
import type { CheckResult, CheckRun } from "../../compliance/types";
import { SHEET_PLAN } from "../../packet/model";
import type { ServiceContext } from "../context";
import { notFound } from "../errors";
import { findRevisionInOrg } from "../revisions/view";

export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/** The sheets of every packet, in the order the sheet index lists them; notes may point at any of them. */
export const PACKET_SHEETS: readonly { code: string; title: string }[] = SHEET_PLAN.map(({ code, title }) => ({ code, title }));

/** A revision of the actor's organisation with its project, or not-found (also for another organisation's id). */
export function findRevisionForReview(ctx: ServiceContext, revisionId: string) {
  const { row, createdByName } = findRevisionInOrg(ctx, revisionId);
  const project = ctx.db
    .select()
    .from(projects)
    .where(and(eq(projects.id, row.projectId), eq(projects.orgId, ctx.orgId)))
    .get();
  if (!project) throw notFound("Packet revision");
  return { row, project, createdByName };
}

/**
 * True when the revision's frozen record still hashes to the SHA-256 it was
 * generated with. An approval is bound to that hash, so a snapshot that no
 * longer matches it cannot be approved.
 */
export function snapshotIntact(row: Pick<PacketRevision, "recordSnapshot" | "recordSha256">): boolean {
  return sha256Hex(canonicalJson(row.recordSnapshot)) === row.recordSha256;
}

export function snapshotRun(row: Pick<PacketRevision, "resultsSnapshot">): CheckRun | null {
  const run = row.resultsSnapshot as CheckRun | null;
  if (!run || !Array.isArray(run.results) || !run.counts) return null;
  return run;
}

export function resultLabel(result: Pick<CheckResult, "title" | "subject">): string {
  // Titles of per-item checks often name their subject already ("… : C-2").
  return result.subject && !result.title.includes(result.subject) ? `${result.title} (${result.subject})` : result.title;
}

/** How a note's target is named to the designer: "Check: Conductor ampacity (PV-1)", "Sheet E-003 Calculations". */
export function noteTargetLabel(kind: "check" | "sheet" | "general", targetId: string, run: CheckRun | null): string {
  if (kind === "general") return "General";
  if (kind === "sheet") {
    const sheet = PACKET_SHEETS.find((s) => s.code === targetId);
    return sheet ? `Sheet ${sheet.code} ${sheet.title}` : `Sheet ${targetId}`;
  }
  const result = run?.results.find((r) => r.id === targetId);
  return result ? `Check: ${resultLabel(result)}` : `Check ${targetId}`;
}

/** Active reviewers of the actor's organisation, who are told when a revision waits for them. */
export function activeReviewers(db: Db | Tx, orgId: string): { id: string; name: string; email: string }[] {
  return db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "reviewer")))
    .where(and(eq(users.orgId, orgId), eq(users.active, true)))
    .orderBy(users.name)
    .all();
}

export function findOwnLicence(ctx: ServiceContext): ReviewerLicence | undefined {
  return ctx.db
    .select()
    .from(reviewerLicences)
    .where(and(eq(reviewerLicences.userId, ctx.user.id), eq(reviewerLicences.orgId, ctx.orgId)))
    .get();
}

/** "2026-12-01": licences expire on a calendar day, read in UTC like every timestamp the product stores. */
export function isoDay(now: Date): string {
  return now.toISOString().slice(0, 10);
}

/** Warned about a month ahead, time enough to renew before a packet waits on it (common practice). */
export const LICENCE_WARNING_DAYS = 30;

export type LicenceStanding = "valid" | "expires-soon" | "expired" | "no-expiry";

export function licenceStanding(expiresOn: string | null, now: Date): { standing: LicenceStanding; daysLeft: number | null } {
  if (!expiresOn) return { standing: "no-expiry", daysLeft: null };
  const today = Date.parse(`${isoDay(now)}T00:00:00Z`);
  const expiry = Date.parse(`${expiresOn}T00:00:00Z`);
  if (!Number.isFinite(expiry)) return { standing: "no-expiry", daysLeft: null };
  // A licence is good through its expiry day.
  const daysLeft = Math.round((expiry - today) / 86_400_000);
  if (daysLeft < 0) return { standing: "expired", daysLeft };
  return { standing: daysLeft <= LICENCE_WARNING_DAYS ? "expires-soon" : "valid", daysLeft };
}

export interface StampView {
  attachmentId: string;
  fileName: string;
  mimeType: string;
  sizeBytes: number;
  uploadedAt: string;
  /** Shown inline on the licence page. */
  url: string;
}

export function stampView(db: Db | Tx, orgId: string, attachmentId: string | null): StampView | null {
  if (!attachmentId) return null;
  const row = db
    .select()
    .from(attachments)
    .where(and(eq(attachments.id, attachmentId), eq(attachments.orgId, orgId), eq(attachments.kind, "stamp")))
    .get();
  if (!row) return null;
  return {
    attachmentId: row.id,
    fileName: row.fileName,
    mimeType: row.mimeType,
    sizeBytes: row.sizeBytes,
    uploadedAt: row.createdAt,
    url: `/api/attachments/${row.id}?inline=1`,
  };
}

/** Runs a mail delivery after commit; a failed delivery stays visible in the outbox and never undoes the hand-off. */
export async function deliverAfterCommit(deliver: (db: Db, orgId: string) => Promise<unknown>, db: Db, orgId: string): Promise<void> {
  try {
    await deliver(db, orgId);
  } catch (error) {
    console.error("mail delivery after a review hand-off failed", error);
  }
}

/**
 * The newest later revision of the same project that has a packet or is
 * being rendered: once it exists, the earlier one is superseded and is not
 * sent for review again.
 */
export function supersedingRevision(ctx: ServiceContext, row: Pick<PacketRevision, "projectId" | "number">): { id: string; number: number } | null {
  const later = ctx.db
    .select({ id: packetRevisions.id, number: packetRevisions.number })
    .from(packetRevisions)
    .where(and(eq(packetRevisions.orgId, ctx.orgId), eq(packetRevisions.projectId, row.projectId), gt(packetRevisions.number, row.number), ne(packetRevisions.state, "failed")))
    .orderBy(desc(packetRevisions.number))
    .get();
  return later ?? null;
}
