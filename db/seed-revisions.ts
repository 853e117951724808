import { and, eq } from "drizzle-orm";
import { canonicalJson, sha256Hex } from "../lib/canonical-json";
import { runChecks } from "../lib/compliance";
import { contextForUser } from "../lib/services/context";
import { getProjectRecord } from "../lib/services/projects/get-record";
import type { Db } from "./client";
import { DEMO_LICENCE, DEMO_PROJECT_FILES } from "./demo-scenario";
import {
  packetRevisions,
  projects,
  reviewerLicences,
  reviews,
  submissionEvents,
  submissions,
  users,
} from "./schema";

/**
 * Leaves the demo projects in the states of DEMO_PROJECT_FILES: a revision in
 * review, an approved and submitted one, and one still in design.
 */
export async function seedDemoRevisions(db: Db, orgId: string): Promise<void> {
  const designer = db.select().from(users).where(eq(users.email, "designer@quillfeather.test")).get()!;
  const reviewer = db.select().from(users).where(eq(users.email, DEMO_LICENCE.email)).get()!;
  const office = db.select().from(users).where(eq(users.email, "office@quillfeather.test")).get()!;
  const ctx = contextForUser(db, designer.id);
  const all = db.select().from(projects).where(eq(projects.orgId, orgId)).all();
  for (const demo of DEMO_PROJECT_FILES) {
    if (demo.status === "design") continue;
    const name = (await import("node:fs")).readFileSync(demo.file, "utf8");
    const projectName = (JSON.parse(name) as { name: string }).name;
    const project = all.find((p) => p.name === projectName);
    if (!project) continue;
    const hasRevision = db.select({ id: packetRevisions.id }).from(packetRevisions).where(eq(packetRevisions.projectId, project.id)).get();
    if (hasRevision) continue;
    const stored = getProjectRecord(ctx, project.id);
    const run = runChecks(stored.record);
    const recordSha256 = sha256Hex(canonicalJson(stored.record));
    const approved = demo.status === "approved";
    const revision = db
      .insert(packetRevisions)
      .values({
        orgId,
        projectId: project.id,
        number: 1,
        state: "ready",
        progressStep: "done",
        reviewState: approved ? "approved" : "in-review",
        recordSnapshot: stored.record as unknown as Record<string, unknown>,
        resultsSnapshot: run,
        recordSha256,
        isDraft: run.counts.fail > 0,
        createdBy: designer.id,
      })
      .returning()
      .get();
    db.update(projects).set({ status: demo.status }).where(eq(projects.id, project.id)).run();
    if (approved) {
      const licence = db.select().from(reviewerLicences).where(and(eq(reviewerLicences.userId, reviewer.id), eq(reviewerLicences.orgId, orgId))).get()!;
      db.insert(reviews)
        .values({
          orgId,
          revisionId: revision.id,
          reviewerId: reviewer.id,
          decision: "approved",
          generalNotes: "Reviewed against the calculations and schedules. Install per the approved set; labels per E-006.",
          licenceSnapshot: {
            reviewerName: reviewer.name,
            licenceNumber: licence.licenceNumber,
            region: licence.region,
            discipline: licence.discipline,
            expiresOn: licence.expiresOn,
          },
          approvedSha256: recordSha256,
        })
        .run();
      const submission = db
        .insert(submissions)
        .values({
          orgId,
          projectId: project.id,
          jurisdictionId: project.jurisdictionId!,
          revisionId: revision.id,
          method: "portal",
          referenceNumber: "KF-ELEC-2026-0417",
          status: "permit-issued",
          createdBy: office.id,
        })
        .returning()
        .get();
      const events = [
        { kind: "submitted" as const, occurredOn: "2026-11-02", note: "Uploaded packet rev 1 and datasheets to the city portal." },
        { kind: "in-plan-review" as const, occurredOn: "2026-11-05", note: "Assigned to plan reviewer." },
        { kind: "fee-paid" as const, occurredOn: "2026-11-06", note: "Plan review and permit fee paid online.", data: { amount: 185 } },
        {
          kind: "permit-issued" as const,
          occurredOn: "2026-11-13",
          note: "Permit issued; card to be posted at the stall.",
          data: { permitNumber: "E26-01893", expiresOn: "2027-05-12" },
        },
      ];
      for (const e of events) db.insert(submissionEvents).values({ ...e, orgId, submissionId: submission.id, userId: office.id }).run();
    }
  }
}
