import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { correctionItems, outbox, packetRevisions, projects } from "../../db/schema";
import { assignCorrection, correctionResponseSheet, listProjectCorrections, listSubmissionCorrections, reopenCorrection, resolveCorrection } from "../../lib/services/corrections";
import { ServiceError } from "../../lib/services/errors";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { listJurisdictionNotes, promoteCorrection } from "../../lib/services/jurisdictions/notes";
import { projectHistory } from "../../lib/services/projects/history";
import { createSubmission, getSubmission, recordSubmissionEvent, voidSubmissionEvent } from "../../lib/services/submissions";
import { readPdfText } from "../unit/packet/pdf-text";
import { codeOf, makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const NOW = new Date("2026-12-01T12:00:00Z");
const opts = { now: NOW, deliver: async () => undefined };

const org = makeOrg(db, "Corrections Firm");
const other = makeOrg(db, "Other Firm");
const designer = makeContext(db, org.id, ["designer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const office = makeContext(db, org.id, ["office"]);
const installer = makeContext(db, org.id, ["installer"]);
const outsider = makeContext(db, other.id, ["designer", "office"]);
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
  const { submissionId } = await createSubmission(office, { revisionId: rev.id, method: "portal", occurredOn: "2026-11-25", referenceNumber: "AB-26-0412" }, opts);
  return { projectId: project.id, submissionId };
}

const LETTER = [
  { comment: "Show the rating of the battery disconnect.", citation: "NEC 706.15(C)", sheet: "E-002" },
  { comment: "Provide the storage system's listing." },
  { comment: "Label the rapid shutdown switch.", citation: "690.56(C)", sheet: "PV-3" },
];

async function refusal(fn: () => Promise<unknown> | unknown): Promise<ServiceError> {
  try {
    await fn();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

async function withLetter() {
  const s = await submitted();
  await recordSubmissionEvent(office, { submissionId: s.submissionId, kind: "corrections-requested", occurredOn: "2026-11-28", corrections: JSON.stringify(LETTER) }, opts);
  return s;
}

describe("AHJ corrections as work items", () => {
  it("records a letter's comments as numbered items, given to the revision's designer, and mails them", async () => {
    const { projectId, submissionId } = await withLetter();
    const view = listProjectCorrections(designer, projectId);
    expect(view.items.map((i) => [i.number, i.comment, i.sheet, i.citation])).toEqual([
      [1, LETTER[0]!.comment, "E-002", "NEC 706.15(C)"],
      [2, LETTER[1]!.comment, "", ""],
      [3, LETTER[2]!.comment, "PV-3", "690.56(C)"],
    ]);
    expect(view.open).toBe(3);
    expect(view.items.every((i) => i.assigneeId === designer.user.id)).toBe(true);
    expect(listSubmissionCorrections(office, submissionId).items).toHaveLength(3);
    const mail = db.select().from(outbox).where(eq(outbox.toAddress, designer.user.email)).all().at(-1)!;
    expect(mail.bodyText).toContain("3. Label the rapid shutdown switch.");
  });

  it("refuses comments on any event but corrections requested, and a comment with no text, recording nothing", async () => {
    const { submissionId } = await submitted();
    const before = getSubmission(office, submissionId).events.length;
    const wrongKind = await refusal(() => recordSubmissionEvent(office, { submissionId, kind: "in-plan-review", occurredOn: "2026-11-26", corrections: LETTER }, opts));
    expect(wrongKind.issues[0]!.path).toBe("corrections");
    const blank = await refusal(() => recordSubmissionEvent(office, { submissionId, kind: "corrections-requested", occurredOn: "2026-11-26", corrections: [{ comment: " " }] }, opts));
    expect(blank.issues[0]!.path).toBe("corrections.0.comment");
    const badAssignee = await refusal(() =>
      recordSubmissionEvent(office, { submissionId, kind: "corrections-requested", occurredOn: "2026-11-26", corrections: LETTER, assigneeId: installer.user.id }, opts),
    );
    expect(badAssignee.issues[0]!.path).toBe("assigneeId");
    expect(getSubmission(office, submissionId).events).toHaveLength(before);
    expect(db.select().from(correctionItems).where(eq(correctionItems.submissionId, submissionId)).all()).toEqual([]);
  });

  it("refuses the resubmittal while a comment is open, naming it, and allows it once every comment has a response", async () => {
    const { projectId, submissionId } = await withLetter();
    const items = listProjectCorrections(designer, projectId).items;
    resolveCorrection(designer, { itemId: items[0]!.id, response: "Disconnect rating 250 A shown on E-002, detail 3.", version: items[0]!.version });
    assignCorrection(office, { itemId: items[1]!.id, assigneeId: reviewer.user.id });
    resolveCorrection(reviewer, { itemId: items[1]!.id, response: "Listing added as attachment 7." });
    const rev2 = approvedRevision(projectId);
    const before = getSubmission(office, submissionId).events.length;
    const open = await refusal(() => recordSubmissionEvent(office, { submissionId, kind: "resubmitted", occurredOn: "2026-11-30", revisionId: rev2.id }, opts));
    expect(open.message).toMatch(/comment 3 is still open/);
    expect(getSubmission(office, submissionId).events).toHaveLength(before);

    resolveCorrection(designer, { itemId: items[2]!.id, response: "Label L-6 added at the switch, sheet PV-3." });
    const done = await recordSubmissionEvent(office, { submissionId, kind: "resubmitted", occurredOn: "2026-11-30", revisionId: rev2.id }, opts);
    expect(done.status).toBe("resubmitted");
    const history = projectHistory(office, projectId).map((h) => h.summary);
    expect(history).toContain('AHJ comment answered: comment 3; "Label L-6 added at the switch, sheet PV-3."');
  });

  it("asks for a real response, refuses a stale form, and reopens a resolved comment", async () => {
    const { projectId } = await withLetter();
    const item = listProjectCorrections(designer, projectId).items[0]!;
    expect((await refusal(() => resolveCorrection(designer, { itemId: item.id, response: "ok" }))).issues[0]!.path).toBe("response");
    resolveCorrection(designer, { itemId: item.id, response: "Rating shown on E-002.", version: item.version });
    expect((await refusal(() => resolveCorrection(designer, { itemId: item.id, response: "Again, differently.", version: item.version }))).code).toBe("conflict");
    const resolved = listProjectCorrections(designer, projectId).items[0]!;
    expect(resolved.open).toBe(false);
    expect(resolved.resolvedByName).toBe(designer.user.name);
    reopenCorrection(reviewer, { itemId: item.id, version: resolved.version });
    expect(listProjectCorrections(designer, projectId).items[0]!.open).toBe(true);
    expect(listProjectCorrections(designer, projectId).open).toBe(3);
  });

  it("lets design and review answer, the office assign, and keeps other roles and organisations out", async () => {
    const { projectId } = await withLetter();
    const item = listProjectCorrections(designer, projectId).items[0]!;
    expect(codeOf(() => resolveCorrection(office, { itemId: item.id, response: "Answered by the office." }))).toBe("forbidden");
    expect(codeOf(() => listProjectCorrections(installer, projectId))).toBe("forbidden");
    expect(codeOf(() => resolveCorrection(outsider, { itemId: item.id, response: "Not our project at all." }))).toBe("not-found");
    expect(codeOf(() => listProjectCorrections(outsider, projectId))).toBe("not-found");
  });

  it("drops the comments of a letter voided as recorded in error", async () => {
    const { projectId, submissionId } = await withLetter();
    const letter = getSubmission(office, submissionId).events.find((e) => e.kind === "corrections-requested")!;
    await voidSubmissionEvent(office, { submissionId, eventId: letter.id, reason: "Letter belonged to another permit." }, opts);
    expect(listProjectCorrections(designer, projectId).items).toEqual([]);
  });

  it("prints the response sheet with each comment and its response, open ones marked open", async () => {
    const { projectId, submissionId } = await withLetter();
    const items = listProjectCorrections(designer, projectId).items;
    resolveCorrection(designer, { itemId: items[0]!.id, response: "Disconnect rating 250 A shown on E-002, detail 3." });
    const sheet = await correctionResponseSheet(office, submissionId, NOW);
    expect(sheet.fileName).toMatch(/-response-to-comments\.pdf$/);
    const text = await readPdfText(sheet.bytes);
    const all = text.pages.join(" ");
    expect(all).toContain("Response to plan-review comments");
    expect(all).toContain("AB-26-0412");
    expect(all).toContain("Comment 1 — Sheet E-002 · NEC 706.15(C)");
    expect(all).toContain("Disconnect rating 250 A shown on E-002, detail 3.");
    expect(all).toContain("Provide the storage system's listing.");
    expect(all).toContain("2 of 3 comments are still open");
    expect(all).toContain("OPEN — not yet answered");
    expect(all).toContain("Not approval");
    // Every character at 8 pt or more (the house minimum).
    expect(Math.min(...text.items.flat().filter((i) => i.str.trim()).map((i) => i.size))).toBeGreaterThanOrEqual(8);
  });

  it("promotes a comment to the jurisdiction's notes log, naming the project it came from", async () => {
    const { projectId } = await withLetter();
    const item = listProjectCorrections(designer, projectId).items[1]!;
    expect(codeOf(() => promoteCorrection(designer, { itemId: item.id }))).toBe("forbidden");
    promoteCorrection(office, { itemId: item.id });
    const log = listJurisdictionNotes(designer, jurisdiction.id);
    expect(log[0]).toMatchObject({ text: "Provide the storage system's listing.", projectId, who: office.user.name });
    expect(codeOf(() => promoteCorrection(outsider, { itemId: item.id }))).toBe("not-found");
  });
});
