import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { auditLog, packetRevisions, projects, submissionEvents } from "../../db/schema";
import { ServiceError } from "../../lib/services/errors";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { moveProjectStatus } from "../../lib/services/projects/status";
import { createSubmission, getSubmission, listSubmissionQueue, recordSubmissionEvent, voidSubmissionEvent } from "../../lib/services/submissions";
import { codeOf, makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const NOW = new Date("2026-12-01T12:00:00Z");
const opts = { now: NOW, deliver: async () => undefined };

const org = makeOrg(db, "Event Order Firm");
const designer = makeContext(db, org.id, ["designer"]);
const office = makeContext(db, org.id, ["office"]);
const jurisdiction = makeJurisdiction(db, org.id);

let counter = 0;
function approvedRevision(projectId: string) {
  return db
    .insert(packetRevisions)
    .values({
      orgId: org.id,
      projectId,
      number: ++counter,
      state: "ready",
      reviewState: "approved",
      // The live record, so the revision shows the design as it stands.
      recordSnapshot: getProjectRecord(designer, projectId).record as unknown as Record<string, unknown>,
      resultsSnapshot: {},
      recordSha256: "0".repeat(64),
      isDraft: false,
      createdBy: designer.user.id,
      createdAt: "2026-11-20T09:00:00.000Z",
    })
    .returning()
    .get();
}

async function submitted() {
  const project = makeProject(db, org.id, jurisdiction.id);
  db.update(projects).set({ status: "approved" }).where(eq(projects.id, project.id)).run();
  const rev = approvedRevision(project.id);
  const { submissionId } = await createSubmission(office, { revisionId: rev.id, method: "portal", occurredOn: "2026-11-25" }, opts);
  return { projectId: project.id, revisionId: rev.id, submissionId };
}

const projectStatus = (id: string) => db.select().from(projects).where(eq(projects.id, id)).get()!.status;
const record = (submissionId: string, input: Record<string, unknown>) => recordSubmissionEvent(office, { submissionId, occurredOn: "2026-11-28", ...input }, opts);

async function refusal(fn: () => Promise<unknown> | unknown): Promise<ServiceError> {
  try {
    await fn();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

describe("event order", () => {
  it("refuses a passed final inspection before the permit, naming why, and records nothing", async () => {
    const { submissionId, projectId } = await submitted();
    const error = await refusal(() => record(submissionId, { kind: "inspection-passed", inspectionKind: "final" }));
    expect(error.code).toBe("invalid");
    expect(error.message).toMatch(/before the permit is issued/);
    expect(error.issues[0]!.path).toBe("kind");
    expect(getSubmission(office, submissionId).events).toHaveLength(1);
    expect(projectStatus(projectId)).toBe("submitted");
  });

  it("closes the application at Finaled: Cancelled after it is refused", async () => {
    const { submissionId, projectId } = await submitted();
    await record(submissionId, { kind: "permit-issued", permitNumber: "E-1" });
    expect(projectStatus(projectId)).toBe("permitted");
    await record(submissionId, { kind: "inspection-passed", inspectionKind: "final" });
    expect(projectStatus(projectId)).toBe("inspected");
    await record(submissionId, { kind: "finaled" });
    expect(projectStatus(projectId)).toBe("closed");
    expect((await refusal(() => record(submissionId, { kind: "cancelled" }))).code).toBe("conflict");
    expect(getSubmission(office, submissionId).allowedNext).toEqual([]);
  });

  it("a fee payment does not change where the application stands", async () => {
    const { submissionId } = await submitted();
    await record(submissionId, { kind: "corrections-requested" });
    const fee = await record(submissionId, { kind: "fee-paid", amountUsd: "90" });
    expect(fee.status).toBe("corrections-requested");
    expect(getSubmission(office, submissionId).allowedNext).toContain("resubmitted");
  });

  it("offers only the kinds the rules allow next", async () => {
    const { submissionId } = await submitted();
    const allowed = getSubmission(office, submissionId).allowedNext;
    expect(allowed).toContain("corrections-requested");
    expect(allowed).not.toContain("submitted");
    expect(allowed).not.toContain("inspection-passed");
    expect(allowed).not.toContain("resubmitted");
  });
});

describe("corrections and resubmission", () => {
  it("moves the project to corrections, then back to submitted with a new revision; the same revision is refused", async () => {
    const { submissionId, projectId, revisionId } = await submitted();
    await record(submissionId, { kind: "corrections-requested", note: "Show the label locations." });
    expect(projectStatus(projectId)).toBe("corrections");
    const same = await refusal(() => record(submissionId, { kind: "resubmitted", revisionId }));
    expect(same.code).toBe("invalid");
    expect(same.issues[0]!.path).toBe("revisionId");
    const second = approvedRevision(projectId);
    const view = getSubmission(office, submissionId);
    expect(view.resubmittable.map((r) => r.id)).toEqual([second.id]);
    await record(submissionId, { kind: "resubmitted", revisionId: second.id });
    expect(projectStatus(projectId)).toBe("submitted");
    expect(getSubmission(office, submissionId).sentRevisionIds).toEqual([revisionId, second.id]);
    // Resubmitting a revision already before the AHJ is refused even after new corrections.
    await record(submissionId, { kind: "corrections-requested" });
    expect((await refusal(() => record(submissionId, { kind: "resubmitted", revisionId: second.id }))).issues[0]!.path).toBe("revisionId");
  });

  it("moves the project to cancelled when the application is withdrawn", async () => {
    const { submissionId, projectId } = await submitted();
    await record(submissionId, { kind: "cancelled" });
    expect(projectStatus(projectId)).toBe("cancelled");
  });
});

describe("voiding", () => {
  it("keeps the voided entry, adds the void with its reason, and works the status out without it", async () => {
    const { submissionId, projectId } = await submitted();
    const permit = await record(submissionId, { kind: "permit-issued", permitNumber: "E-9" });
    expect(projectStatus(projectId)).toBe("permitted");
    const before = db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).all();
    const voided = voidSubmissionEvent(office, { submissionId, eventId: permit.eventId, reason: "Entered on the wrong project." }, { now: NOW });
    expect(voided.status).toBe("submitted");
    const after = db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).all();
    expect(after).toHaveLength(before.length + 1);
    for (const row of before) expect(after.find((r) => r.id === row.id)).toEqual(row);
    const view = getSubmission(office, submissionId);
    expect(view.status).toBe("submitted");
    expect(view.events.find((e) => e.id === permit.eventId)!.voided!.reason).toBe("Entered on the wrong project.");
    expect(view.events.at(-1)!.kind).toBe("voided");
    // The project goes back with the void (through the table's backward moves).
    expect(projectStatus(projectId)).toBe("submitted");
    // With the permit voided, an inspection is again out of order.
    expect((await refusal(() => record(submissionId, { kind: "inspection-scheduled", inspectionKind: "rough" }))).message).toMatch(/before the permit/);
    expect(db.select().from(auditLog).where(and(eq(auditLog.action, "submission.voided"), eq(auditLog.entityId, submissionId))).all()).toHaveLength(1);
    // The queue ignores the voided permit too: no permit number, and the AHJ is still reviewing (6 days since 2026-11-25).
    const queued = listSubmissionQueue(office, { now: NOW }).find((q) => q.submissionId === submissionId)!;
    expect(queued.status).toBe("submitted");
    expect(queued.permitNumber).toBeNull();
    expect(queued.daysWaiting).toBe(6);
    expect(queued.holder).toBe("AHJ");
  });

  it("refuses a void that leaves later entries out of order, a void without reason, and voiding the submission itself", async () => {
    const { submissionId } = await submitted();
    const permit = await record(submissionId, { kind: "permit-issued", permitNumber: "E-10" });
    await record(submissionId, { kind: "inspection-scheduled", inspectionKind: "rough" });
    const error = await refusal(() => voidSubmissionEvent(office, { submissionId, eventId: permit.eventId, reason: "Wrong number." }, { now: NOW }));
    expect(error.message).toMatch(/Void the later entry first/);
    expect((await refusal(() => voidSubmissionEvent(office, { submissionId, eventId: permit.eventId, reason: "" }, { now: NOW }))).issues[0]!.path).toBe("reason");
    const first = getSubmission(office, submissionId).events[0]!;
    expect((await refusal(() => voidSubmissionEvent(office, { submissionId, eventId: first.id, reason: "Never sent." }, { now: NOW }))).message).toMatch(/record Cancelled/);
    expect(codeOf(() => voidSubmissionEvent(designer, { submissionId, eventId: permit.eventId, reason: "Not mine." }, { now: NOW }))).toBe("forbidden");
  });
});

describe("the project status service", () => {
  it("refuses a move the table does not allow and audits the ones it makes", () => {
    const project = makeProject(db, org.id, jurisdiction.id);
    db.transaction((tx) => moveProjectStatus(tx, office, project.id, "in-review", { reason: "test" }));
    expect(projectStatus(project.id)).toBe("in-review");
    expect(codeOf(() => db.transaction((tx) => moveProjectStatus(tx, office, project.id, "permitted", { reason: "test" })))).toBe("conflict");
    expect(db.transaction((tx) => moveProjectStatus(tx, office, project.id, "permitted", { reason: "test", ifAllowed: true })).moved).toBe(false);
    expect(projectStatus(project.id)).toBe("in-review");
    const rows = db.select().from(auditLog).where(and(eq(auditLog.action, "project.status"), eq(auditLog.entityId, project.id))).all();
    expect(rows.map((r) => r.detail)).toEqual([{ from: "design", to: "in-review", reason: "test" }]);
  });
});
