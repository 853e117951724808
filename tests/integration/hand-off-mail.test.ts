import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { auditLog, jurisdictions, outbox, packetRevisions, projects } from "../../db/schema";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { createSubmission, recordSubmissionEvent } from "../../lib/services/submissions";
import { sendOverdueDigest } from "../../lib/services/submissions/digest";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const NOW = new Date("2026-12-01T12:00:00Z");
const opts = { now: NOW, deliver: async () => undefined };

const org = makeOrg(db, "Hand-off Firm");
const designer = makeContext(db, org.id, ["designer"]);
const office = makeContext(db, org.id, ["office"]);
const installer = makeContext(db, org.id, ["installer"]);
const jurisdiction = makeJurisdiction(db, org.id);
// Typical review of 10 calendar days (invented figure for the test jurisdiction).
db.update(jurisdictions).set({ typicalReviewDays: 10 }).where(eq(jurisdictions.id, jurisdiction.id)).run();

let counter = 0;
async function submitted(on: string) {
  const project = makeProject(db, org.id, jurisdiction.id);
  db.update(projects).set({ status: "approved" }).where(eq(projects.id, project.id)).run();
  const rev = db
    .insert(packetRevisions)
    .values({
      orgId: org.id,
      projectId: project.id,
      number: ++counter,
      state: "ready",
      reviewState: "approved",
      recordSnapshot: getProjectRecord(designer, project.id).record as unknown as Record<string, unknown>,
      resultsSnapshot: {},
      recordSha256: "0".repeat(64),
      isDraft: false,
      createdBy: designer.user.id,
      createdAt: "2026-10-20T09:00:00.000Z",
    })
    .returning()
    .get();
  const { submissionId } = await createSubmission(office, { revisionId: rev.id, method: "portal", occurredOn: on, referenceNumber: `HO-${counter}` }, opts);
  return { submissionId, projectName: project.name };
}

const mails = (to: string, template: string) =>
  db
    .select()
    .from(outbox)
    .where(and(eq(outbox.toAddress, to), eq(outbox.template, template)))
    .all();

describe("who is told what", () => {
  it("tells the designer when plan review starts, naming the jurisdiction's usual review days", async () => {
    const { submissionId, projectName } = await submitted("2026-11-25");
    await recordSubmissionEvent(office, { submissionId, kind: "in-plan-review", occurredOn: "2026-11-27" }, opts);
    const mail = mails(designer.user.email, "plan-review-started").at(-1)!;
    expect(mail.subject).toBe(`Plan review started by ${jurisdiction.name}: ${projectName}`);
    expect(mail.bodyText).toContain("usually takes 10 calendar days");
    expect(mails(installer.user.email, "plan-review-started")).toHaveLength(0);
  });

  it("tells the designer and the installers an inspection's result, and a cancellation", async () => {
    const { submissionId, projectName } = await submitted("2026-11-02");
    await recordSubmissionEvent(office, { submissionId, kind: "permit-issued", occurredOn: "2026-11-10", permitNumber: "E-77" }, opts);
    await recordSubmissionEvent(office, { submissionId, kind: "inspection-failed", inspectionKind: "rough", occurredOn: "2026-11-20", note: "Raceway not supported." }, opts);
    for (const who of [designer, installer]) {
      const mail = mails(who.user.email, "inspection-result").at(-1)!;
      expect(mail.subject).toBe(`Rough inspection failed: ${projectName}`);
      expect(mail.bodyText).toContain("permit E-77");
      expect(mail.bodyText).toContain("Raceway not supported.");
    }
    await recordSubmissionEvent(office, { submissionId, kind: "cancelled", occurredOn: "2026-11-21", note: "Client withdrew." }, opts);
    expect(mails(installer.user.email, "submission-cancelled").at(-1)!.bodyText).toContain("Do not build from this set.");
  });
});

describe("the office's daily digest", () => {
  it("lists submissions waiting past the typical review, mails every office user, and goes once a day from the command", async () => {
    // Submitted 2026-11-05, in plan review: 26 calendar days to 2026-12-01 against 10 typical → overdue.
    const late = await submitted("2026-11-05");
    await recordSubmissionEvent(office, { submissionId: late.submissionId, kind: "in-plan-review", occurredOn: "2026-11-06" }, opts);
    // Submitted 2026-11-28: 3 days, not overdue.
    const fresh = await submitted("2026-11-28");
    const sent = await sendOverdueDigest(office, { now: NOW, onceADay: true, deliver: async () => undefined });
    expect(sent).toMatchObject({ day: "2026-12-01", recipients: 1, skipped: false });
    const mail = mails(office.user.email, "overdue-digest").at(-1)!;
    expect(mail.bodyText).toContain(`${late.projectName} at ${jurisdiction.name}: in plan review, 26 days waiting against 10`);
    expect(mail.bodyText).not.toContain(fresh.projectName);
    expect(mail.bodyText).toContain("calendar days counted in UTC, weekends included");
    const again = await sendOverdueDigest(office, { now: NOW, onceADay: true, deliver: async () => undefined });
    expect(again.skipped).toBe(true);
    expect(mails(office.user.email, "overdue-digest")).toHaveLength(1);
    expect(db.select().from(auditLog).where(eq(auditLog.action, "digest.sent")).all()).toHaveLength(1);
    await expect(sendOverdueDigest(designer, { now: NOW })).rejects.toMatchObject({ code: "forbidden" });
  });
});
