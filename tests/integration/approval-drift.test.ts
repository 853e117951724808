import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { attachments, packetRevisions, projects } from "../../db/schema";
import { describeChange } from "../../lib/record-diff";
import { ServiceError } from "../../lib/services/errors";
import { approvalDrift } from "../../lib/services/projects/approval";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { listApprovedForInstall } from "../../lib/services/revisions/queues";
import { createSubmission, listSubmittableRevisions } from "../../lib/services/submissions";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const org = makeOrg(db, "Drift Firm");
const designer = makeContext(db, org.id, ["designer"]);
const office = makeContext(db, org.id, ["office"]);
const installer = makeContext(db, org.id, ["installer"]);
const jurisdiction = makeJurisdiction(db, org.id);
const opts = { now: new Date("2026-12-01T12:00:00Z"), deliver: async () => undefined };

function approvedProject() {
  const project = makeProject(db, org.id, jurisdiction.id);
  db.update(projects).set({ status: "approved", designLowTempC: -10 }).where(eq(projects.id, project.id)).run();
  const revision = db
    .insert(packetRevisions)
    .values({
      orgId: org.id,
      projectId: project.id,
      number: 1,
      state: "ready",
      reviewState: "approved",
      recordSnapshot: getProjectRecord(designer, project.id).record as unknown as Record<string, unknown>,
      resultsSnapshot: {},
      recordSha256: "0".repeat(64),
      isDraft: false,
      createdBy: designer.user.id,
      createdAt: "2026-11-20T09:00:00.000Z",
    })
    .returning()
    .get();
  return { projectId: project.id, revisionId: revision.id };
}

describe("a record changed after approval", () => {
  it("is offered for submission and to installers while unchanged", () => {
    const { projectId, revisionId } = approvedProject();
    expect(approvalDrift(designer, projectId)).toBeNull();
    expect(listSubmittableRevisions(office).map((r) => r.revisionId)).toContain(revisionId);
    expect(listApprovedForInstall(installer).map((r) => r.revisionId)).toContain(revisionId);
  });

  it("shows the change as old → new and is withdrawn from submission and installers", async () => {
    const { projectId, revisionId } = approvedProject();
    db.update(projects).set({ designLowTempC: -18 }).where(eq(projects.id, projectId)).run();
    const drift = approvalDrift(designer, projectId)!;
    expect(drift.revisionNumber).toBe(1);
    expect(drift.groups.flatMap((g) => g.changes.map(describeChange))).toEqual(["Site designLowTempC: -10 → -18"]);
    expect(listSubmittableRevisions(office).map((r) => r.revisionId)).not.toContain(revisionId);
    expect(listApprovedForInstall(installer).map((r) => r.revisionId)).not.toContain(revisionId);
    let error: unknown;
    try {
      await createSubmission(office, { revisionId, method: "portal", occurredOn: "2026-11-25" }, opts);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ServiceError);
    expect((error as ServiceError).code).toBe("conflict");
    expect((error as ServiceError).message).toMatch(/changed since revision 1 was approved/);
  });

  it("an installer's photo does not count as a change to the design", () => {
    const { projectId, revisionId } = approvedProject();
    db.insert(attachments)
      .values({ orgId: org.id, projectId, kind: "photo", fileName: "label-1.jpg", mimeType: "image/jpeg", sizeBytes: 1000, sha256: "c".repeat(64) })
      .run();
    expect(approvalDrift(designer, projectId)).toBeNull();
    expect(listApprovedForInstall(installer).map((r) => r.revisionId)).toContain(revisionId);
  });
});
