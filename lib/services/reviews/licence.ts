import "server-only";
import { and, eq } from "drizzle-orm";
import { reviewerLicences } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { licenceInputSchema } from "../../schemas/review";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { findOwnLicence, isoDay, licenceStanding, stampView, type LicenceStanding, type StampView } from "./shared";

export interface LicenceView {
  id: string;
  licenceNumber: string;
  region: string;
  discipline: string;
  expiresOn: string | null;
  version: number;
  updatedAt: string;
  standing: LicenceStanding;
  /** Days until expiry (negative once expired); null without an expiry date. */
  daysLeft: number | null;
  stamp: StampView | null;
  /** What stands between this licence and an approval, in words; empty when it can approve. */
  blockers: string[];
}

export function toLicenceView(ctx: ServiceContext, now: Date = new Date()): LicenceView | null {
  const row = findOwnLicence(ctx);
  if (!row) return null;
  const { standing, daysLeft } = licenceStanding(row.expiresOn, now);
  const stamp = stampView(ctx.db, ctx.orgId, row.stampAttachmentId);
  const blockers: string[] = [];
  if (standing === "expired") blockers.push(`the licence expired on ${row.expiresOn}`);
  if (standing === "no-expiry") blockers.push("the licence record has no expiry date");
  if (!stamp) blockers.push("no stamp image is on file");
  return {
    id: row.id,
    licenceNumber: row.licenceNumber,
    region: row.region,
    discipline: row.discipline,
    expiresOn: row.expiresOn,
    version: row.version,
    updatedAt: row.updatedAt,
    standing,
    daysLeft,
    stamp,
    blockers,
  };
}

/** The signed-in reviewer's own licence record, or null before they have recorded one. */
export function getOwnLicence(ctx: ServiceContext, options: { now?: Date } = {}): LicenceView | null {
  requirePermission(ctx, "licence:edit-own", "keep a licence record");
  return toLicenceView(ctx, options.now);
}

/**
 * Records or updates the reviewer's own licence. An expiry already past is
 * refused: a record that cannot stamp anything is a mistake, not a state to
 * keep. The version the form read must still be current.
 */
export function saveOwnLicence(ctx: ServiceContext, input: unknown, options: { now?: Date } = {}): LicenceView {
  requirePermission(ctx, "licence:edit-own", "keep a licence record");
  const parsed = licenceInputSchema.safeParse(input);
  if (!parsed.success) throw invalid("The licence was not saved: some fields are not valid.", formatIssues(parsed.error));
  const now = options.now ?? new Date();
  const { version, ...fields } = parsed.data;
  const today = isoDay(now);
  if (fields.expiresOn < today) {
    throw invalid("The licence was not saved: its expiry date has passed.", [{ path: "expiresOn", message: `is in the past (today is ${today}); enter the expiry of your current licence` }]);
  }

  ctx.db.transaction((tx) => {
    const existing = tx
      .select()
      .from(reviewerLicences)
      .where(and(eq(reviewerLicences.userId, ctx.user.id), eq(reviewerLicences.orgId, ctx.orgId)))
      .get();
    if (!existing) {
      const row = tx
        .insert(reviewerLicences)
        .values({ ...fields, orgId: ctx.orgId, userId: ctx.user.id, createdAt: now.toISOString(), updatedAt: now.toISOString() })
        .returning({ id: reviewerLicences.id })
        .get();
      audit(tx, ctx, "licence.saved", "reviewer_licence", row.id, { ...fields, created: true });
      return;
    }
    if (version === undefined || version !== existing.version) {
      throw conflict("Your licence record was changed in another window since this form was opened; reload to see it, then save again.");
    }
    tx.update(reviewerLicences)
      .set({ ...fields, updatedAt: now.toISOString(), version: existing.version + 1 })
      .where(and(eq(reviewerLicences.id, existing.id), eq(reviewerLicences.version, existing.version)))
      .run();
    const changed = Object.fromEntries(
      (Object.keys(fields) as (keyof typeof fields)[]).filter((k) => existing[k] !== fields[k]).map((k) => [k, { from: existing[k], to: fields[k] }]),
    );
    audit(tx, ctx, "licence.saved", "reviewer_licence", existing.id, { changed });
  });
  return toLicenceView(ctx, now)!;
}
