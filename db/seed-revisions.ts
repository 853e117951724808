import fs from "node:fs";
import { and, eq } from "drizzle-orm";
import { canonicalJson, sha256Hex } from "../lib/canonical-json";
import { contextForUser } from "../lib/services/context";
import { generateRevisionArtifacts } from "../lib/services/revisions/generate";
import { buildPreflight } from "../lib/services/revisions/preflight";
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

/** Renders a seeded revision's PDF and DOCX in this process; a failure is reported and left on the row. */
async function renderSeeded(db: Db, revisionId: string, projectName: string): Promise<void> {
  const row = await generateRevisionArtifacts(db, revisionId);
  if (row.state !== "ready") console.error(`Demo packet for ${projectName}, revision ${row.number}: ${row.error ?? row.state}`);
}

/**
 * Leaves the demo projects in the states of DEMO_PROJECT_FILES: a revision in
 * review, an approved and submitted one, and one still in design. Each
 * seeded revision gets its real PDF and DOCX; rows seeded before they had
 * files get them on the next run.
 */
export async function seedDemoRevisions(db: Db, orgId: string): Promise<void> {
  const designer = db.select().from(users).where(eq(users.email, "designer@quillfeather.test")).get()!;
  const reviewer = db.select().from(users).where(eq(users.email, DEMO_LICENCE.email)).get()!;
  const office = db.select().from(users).where(eq(users.email, "office@quillfeather.test")).get()!;
  const ctx = contextForUser(db, designer.id);
  const all = db.select().from(projects).where(eq(projects.orgId, orgId)).all();
  for (const demo of DEMO_PROJECT_FILES) {
    if (demo.status === "design") continue;
    const projectName = (JSON.parse(fs.readFileSync(demo.file, "utf8")) as { name: string }).name;
    const project = all.find((p) => p.name === projectName);
    if (!project) continue;
    const existing = db.select().from(packetRevisions).where(eq(packetRevisions.projectId, project.id)).all();
    if (existing.length) {
      for (const r of existing) if (r.state === "ready" && (!r.pdfPath || !r.docxPath)) await renderSeeded(db, r.id, projectName);
      continue;
    }
    const { stored, run, documents, preflight } = buildPreflight(ctx, project.id);
    const recordSha256 = sha256Hex(canonicalJson(stored.record));
    const approved = demo.status === "approved";
    const revision = db
      .insert(packetRevisions)
      .values({
        orgId,
        projectId: project.id,
        number: 1,
        state: "generating",
        progressStep: "queued",
        reviewState: approved ? "approved" : "in-review",
        recordSnapshot: stored.record as unknown as Record<string, unknown>,
        resultsSnapshot: run,
        recordSha256,
        attachmentIds: documents.attachmentIds,
        isDraft: preflight.isDraft,
        createdBy: designer.id,
        // The approved set predates its submission (first event 2026-11-02); the one in review is current.
        ...(approved ? { createdAt: "2026-10-28T15:20:00.000Z" } : {}),
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
          // The reviewer's disposition of each attest item, as the review page asks for before approving.
          dispositions: run.results
            .filter((r) => r.status === "attest")
            .map((r) => ({ resultId: r.id, title: r.title, subject: r.subject ?? null, disposition: "accepted" as const, note: "Confirmed with the installer's site photos before stamping." })),
          createdAt: "2026-10-30T10:05:00.000Z",
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
      db.update(projects).set({ status: "permitted" }).where(eq(projects.id, project.id)).run();
    }
    // Rendered after the review is recorded, so the approved set carries the reviewer's name and licence.
    await renderSeeded(db, revision.id, projectName);
  }
}
