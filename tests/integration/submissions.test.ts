import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { auditLog, outbox, packetRevisions, projects, submissionEvents, submissions } from "../../db/schema";
import { ServiceError } from "../../lib/services/errors";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { createSubmission, getSubmission, listSubmittableRevisions, recordSubmissionEvent } from "../../lib/services/submissions";
import { codeOf, makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

/** Mail stays queued in the outbox: these tests read the outbox, not an SMTP server. */
const noDelivery = async () => undefined;
const NOW = new Date("2026-12-01T12:00:00Z");
const opts = { now: NOW, deliver: noDelivery };

const org = makeOrg(db, "Submission Test Firm");
const otherOrg = makeOrg(db, "Another Firm");
const designer = makeContext(db, org.id, ["designer"]);
const office = makeContext(db, org.id, ["office"]);
const installer = makeContext(db, org.id, ["installer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const outsiderOffice = makeContext(db, otherOrg.id, ["office"]);
const jurisdiction = makeJurisdiction(db, org.id);

let revisionCounter = 0;
/** A finished revision row; the packet files themselves play no part in submitting. */
function revision(reviewState: "draft" | "in-review" | "returned" | "approved", isDraft = false) {
  const project = makeProject(db, org.id, jurisdiction.id);
  db.update(projects).set({ status: reviewState === "approved" ? "approved" : "in-review" }).where(eq(projects.id, project.id)).run();
  const projectId = project.id;
  const row = db
    .insert(packetRevisions)
    .values({
      orgId: org.id,
      projectId: project.id,
      number: ++revisionCounter,
      state: "ready",
      reviewState,
      // The live record, so the revision shows the design as it stands.
      recordSnapshot: getProjectRecord(designer, projectId).record as unknown as Record<string, unknown>,
      resultsSnapshot: {},
      recordSha256: "0".repeat(64),
      isDraft,
      createdBy: designer.user.id,
      createdAt: "2026-11-20T09:00:00.000Z",
    })
    .returning()
    .get();
  return { projectId: project.id, revisionId: row.id };
}

async function codeOfAsync(fn: () => Promise<unknown>): Promise<string | undefined> {
  try {
    await fn();
  } catch (error) {
    if (error instanceof ServiceError) return error.code;
    throw error;
  }
  return undefined;
}

async function refusal(fn: () => Promise<unknown>): Promise<ServiceError> {
  try {
    await fn();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

const submitInput = (revisionId: string) => ({ revisionId, method: "portal", referenceNumber: "EL-26-0091", occurredOn: "2026-11-25", note: "Uploaded to the portal." });

describe("creating a submission", () => {
  it("submits an approved revision, writes the first event, moves the project and e-mails the designer", async () => {
    const { projectId, revisionId } = revision("approved");
    expect(listSubmittableRevisions(office).map((r) => r.revisionId)).toContain(revisionId);
    const { submissionId } = await createSubmission(office, submitInput(revisionId), opts);
    const view = getSubmission(office, submissionId);
    expect(view.status).toBe("submitted");
    expect(view.method).toBe("portal");
    expect(view.referenceNumber).toBe("EL-26-0091");
    expect(view.events.map((e) => [e.kind, e.occurredOn])).toEqual([["submitted", "2026-11-25"]]);
    expect(db.select().from(projects).where(eq(projects.id, projectId)).get()!.status).toBe("submitted");
    const mail = db.select().from(outbox).where(and(eq(outbox.orgId, org.id), eq(outbox.template, "submitted"), eq(outbox.toAddress, designer.user.email))).all();
    expect(mail).toHaveLength(1);
    expect(mail[0]!.subject).toBe(`Submitted to ${jurisdiction.name}: ${view.projectName}`);
    expect(mail[0]!.bodyText).toContain("reference EL-26-0091");
    expect(db.select().from(auditLog).where(and(eq(auditLog.action, "submission.created"), eq(auditLog.entityId, submissionId))).all()).toHaveLength(1);
    expect(listSubmittableRevisions(office).map((r) => r.revisionId)).not.toContain(revisionId);
    // Twice is refused: events go on the open submission.
    expect(await codeOfAsync(() => createSubmission(office, submitInput(revisionId), opts))).toBe("conflict");
  });

  it("refuses a revision that is not approved, or a draft, saying why", async () => {
    for (const state of ["draft", "in-review", "returned"] as const) {
      const { revisionId } = revision(state);
      const error = await refusal(() => createSubmission(office, submitInput(revisionId), opts));
      expect(error.code).toBe("invalid");
      expect(error.message).toMatch(/not been approved|draft/);
    }
    const { revisionId } = revision("approved", true);
    const error = await refusal(() => createSubmission(office, submitInput(revisionId), opts));
    expect(error.message).toMatch(/is a draft/);
    expect(db.select().from(submissions).where(eq(submissions.revisionId, revisionId)).all()).toHaveLength(0);
  });

  it("is for the office only", async () => {
    const { revisionId } = revision("approved");
    for (const ctx of [designer, reviewer, installer]) {
      expect(await codeOfAsync(() => createSubmission(ctx, submitInput(revisionId), opts))).toBe("forbidden");
    }
    expect(codeOf(() => listSubmittableRevisions(designer))).toBe("forbidden");
  });

  it("refuses a date in the future", async () => {
    const { revisionId } = revision("approved");
    const error = await refusal(() => createSubmission(office, { ...submitInput(revisionId), occurredOn: "2026-12-02" }, opts));
    expect(error.issues.map((i) => i.path)).toEqual(["occurredOn"]);
  });
});

describe("recording events", () => {
  async function openSubmission() {
    const { projectId, revisionId } = revision("approved");
    const { submissionId } = await createSubmission(office, submitInput(revisionId), opts);
    return { projectId, submissionId };
  }

  it("appends events and never changes earlier ones", async () => {
    const { submissionId } = await openSubmission();
    const before = db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).all();
    await recordSubmissionEvent(office, { submissionId, kind: "in-plan-review", occurredOn: "2026-11-26", note: "Assigned." }, opts);
    await recordSubmissionEvent(office, { submissionId, kind: "fee-paid", occurredOn: "2026-11-27", amountUsd: "185.50" }, opts);
    await recordSubmissionEvent(office, { submissionId, kind: "permit-issued", occurredOn: "2026-11-28", permitNumber: "E26-1" }, opts);
    await recordSubmissionEvent(office, { submissionId, kind: "inspection-scheduled", occurredOn: "2027-01-15", inspectionKind: "rough" }, opts);
    const after = db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).all();
    expect(after).toHaveLength(5);
    expect(after.find((e) => e.id === before[0]!.id)).toEqual(before[0]);
    const view = getSubmission(office, submissionId);
    expect(view.status).toBe("inspection-scheduled");
    expect(view.version).toBe(5);
    expect(view.events.map((e) => e.kind)).toEqual(["submitted", "in-plan-review", "fee-paid", "permit-issued", "inspection-scheduled"]);
    expect(view.events[2]!.data).toEqual({ amount: 185.5 });
    expect(view.events[4]!.data).toEqual({ inspectionKind: "rough" });
    expect(db.select().from(auditLog).where(and(eq(auditLog.action, "submission.event"), eq(auditLog.entityId, submissionId))).all()).toHaveLength(4);
  });

  it("refuses permit-issued without a number, fee-paid without an amount, inspections without a kind", async () => {
    const { submissionId } = await openSubmission();
    const cases: [Record<string, unknown>, string][] = [
      [{ kind: "permit-issued", occurredOn: "2026-11-30" }, "permitNumber"],
      [{ kind: "permit-issued", occurredOn: "2026-11-30", permitNumber: "E26-1", expiresOn: "2026-11-29" }, "expiresOn"],
      [{ kind: "fee-paid", occurredOn: "2026-11-30" }, "amountUsd"],
      [{ kind: "inspection-passed", occurredOn: "2026-11-30" }, "inspectionKind"],
      [{ kind: "in-plan-review", occurredOn: "2026-12-02" }, "occurredOn"],
      [{ kind: "inspection-scheduled", occurredOn: "2028-01-15", inspectionKind: "final" }, "occurredOn"],
      [{ kind: "in-plan-review", occurredOn: "2026-11-24" }, "occurredOn"],
    ];
    for (const [input, path] of cases) {
      const error = await refusal(() => recordSubmissionEvent(office, { submissionId, ...input }, opts));
      expect(error.code).toBe("invalid");
      expect(error.issues.map((i) => i.path)).toContain(path);
    }
    expect(getSubmission(office, submissionId).events).toHaveLength(1);
  });

  it("permit-issued records number and expiry, marks the project permitted and e-mails the designer and installers", async () => {
    const { projectId, submissionId } = await openSubmission();
    await recordSubmissionEvent(office, { submissionId, kind: "permit-issued", occurredOn: "2026-11-30", permitNumber: "E26-02001", expiresOn: "2027-05-30" }, opts);
    const view = getSubmission(office, submissionId);
    expect(view.events.at(-1)!.data).toEqual({ permitNumber: "E26-02001", expiresOn: "2027-05-30" });
    expect(db.select().from(projects).where(eq(projects.id, projectId)).get()!.status).toBe("permitted");
    const mail = db
      .select()
      .from(outbox)
      .where(and(eq(outbox.orgId, org.id), eq(outbox.template, "permit-issued")))
      .all()
      .filter((m) => m.bodyText.includes("E26-02001"));
    expect(mail.map((m) => m.toAddress).sort()).toEqual([designer.user.email, installer.user.email].sort());
    expect(mail[0]!.bodyText).toContain("valid until 2027-05-30");
  });

  it("corrections-requested e-mails the designer with the note", async () => {
    const { submissionId } = await openSubmission();
    await recordSubmissionEvent(office, { submissionId, kind: "corrections-requested", occurredOn: "2026-11-28", note: "Show the rapid-shutdown label location." }, opts);
    const mail = db.select().from(outbox).where(and(eq(outbox.orgId, org.id), eq(outbox.template, "corrections-requested"))).all();
    expect(mail).toHaveLength(1);
    expect(mail[0]!.toAddress).toBe(designer.user.email);
    expect(mail[0]!.bodyText).toContain("Show the rapid-shutdown label location.");
    expect(mail[0]!.bodyText).toContain("reference EL-26-0091");
  });

  it("refuses a stale version and events after cancellation", async () => {
    const { submissionId } = await openSubmission();
    expect(await codeOfAsync(() => recordSubmissionEvent(office, { submissionId, kind: "on-hold", occurredOn: "2026-11-28", version: 7 }, opts))).toBe("conflict");
    await recordSubmissionEvent(office, { submissionId, kind: "cancelled", occurredOn: "2026-11-28", version: 1 }, opts);
    expect(await codeOfAsync(() => recordSubmissionEvent(office, { submissionId, kind: "resubmitted", occurredOn: "2026-11-29", revisionId: "any" }, opts))).toBe("conflict");
  });

  it("is for the office only; designers read", async () => {
    const { submissionId } = await openSubmission();
    for (const ctx of [designer, reviewer, installer]) {
      expect(await codeOfAsync(() => recordSubmissionEvent(ctx, { submissionId, kind: "on-hold", occurredOn: "2026-11-28" }, opts))).toBe("forbidden");
    }
    expect(getSubmission(designer, submissionId).id).toBe(submissionId);
    expect(codeOf(() => getSubmission(installer, submissionId))).toBe("forbidden");
  });

  it("another organisation's submission is not found", async () => {
    const { submissionId } = await openSubmission();
    expect(codeOf(() => getSubmission(outsiderOffice, submissionId))).toBe("not-found");
    expect(await codeOfAsync(() => recordSubmissionEvent(outsiderOffice, { submissionId, kind: "on-hold", occurredOn: "2026-11-28" }, opts))).toBe("not-found");
    const { revisionId } = revision("approved");
    expect(await codeOfAsync(() => createSubmission(outsiderOffice, submitInput(revisionId), opts))).toBe("not-found");
    expect(listSubmittableRevisions(outsiderOffice)).toEqual([]);
  });
});

describe("the queue", () => {
  it("lists the organisation's submissions with the submitted date, latest event and permit number", async () => {
    const { listSubmissionQueue } = await import("../../lib/services/submissions");
    const { revisionId } = revision("approved");
    const { submissionId } = await createSubmission(office, { ...submitInput(revisionId), referenceNumber: "" }, opts);
    await recordSubmissionEvent(office, { submissionId, kind: "permit-issued", occurredOn: "2026-11-29", permitNumber: "E26-777" }, opts);
    const entry = listSubmissionQueue(designer).find((e) => e.submissionId === submissionId)!;
    expect(entry).toMatchObject({ status: "permit-issued", submittedOn: "2026-11-25", latestOn: "2026-11-29", permitNumber: "E26-777", referenceNumber: "" });
    expect(listSubmissionQueue(outsiderOffice)).toEqual([]);
    // An empty reference still gives a readable message.
    const mail = db.select().from(outbox).where(and(eq(outbox.template, "submitted"), eq(outbox.orgId, org.id))).all().at(-1)!;
    expect(mail.bodyText).toMatch(/\(portal\)\.$/m);
  });
});
