import { afterAll, describe, expect, it } from "vitest";
import { packetRevisions, reviewNotes, reviews } from "../../db/schema";
import { ServiceError } from "../../lib/services/errors";
import { listProjectReviews } from "../../lib/services/reviews/history";
import { openNoteCount, respondToNote } from "../../lib/services/reviews/note-thread";
import { sendForReview } from "../../lib/services/reviews/send";
import { getReviewWorkspace } from "../../lib/services/reviews/view";
import { codeOf, makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const org = makeOrg(db, "Note Thread Firm");
const other = makeOrg(db, "Elsewhere Firm");
const designer = makeContext(db, org.id, ["designer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const office = makeContext(db, org.id, ["office"]);
const outsider = makeContext(db, other.id, ["designer", "reviewer"]);
const jurisdiction = makeJurisdiction(db, org.id);

/** A project whose revision 1 came back with two notes: one on a check, one on a sheet. */
function returnedWithNotes() {
  const project = makeProject(db, org.id, jurisdiction.id);
  const revision = db
    .insert(packetRevisions)
    .values({ orgId: org.id, projectId: project.id, number: 1, state: "ready", reviewState: "returned", recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "0".repeat(64), isDraft: false, createdBy: designer.user.id })
    .returning()
    .get();
  const review = db.insert(reviews).values({ orgId: org.id, revisionId: revision.id, reviewerId: reviewer.user.id, decision: "returned" }).returning().get();
  const onCheck = db.insert(reviewNotes).values({ reviewId: review.id, targetKind: "sheet", targetId: "E-004", text: "Show the 75 °C terminal limit." }).returning().get();
  const onSheet = db.insert(reviewNotes).values({ reviewId: review.id, targetKind: "sheet", targetId: "E-006", text: "Label L-3 wording." }).returning().get();
  return { projectId: project.id, notes: [onCheck.id, onSheet.id] as const };
}

function refusal(fn: () => unknown): ServiceError {
  try {
    fn();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

const noteView = (projectId: string, id: string) => listProjectReviews(designer, projectId)[0]!.notes.find((n) => n.id === id)!;

describe("review notes as a conversation", () => {
  it("goes open → addressed by the designer → reopened → addressed → closed by the reviewer, each step kept with who said what", () => {
    const { projectId, notes } = returnedWithNotes();
    expect(openNoteCount(designer, projectId)).toEqual({ open: 2, addressed: 0 });
    respondToNote(designer, { noteId: notes[0], action: "addressed", body: "Limit shown on E-004, row C-2.", seen: 0 });
    expect(noteView(projectId, notes[0]).state).toBe("addressed");
    expect(openNoteCount(designer, projectId)).toEqual({ open: 1, addressed: 1 });
    respondToNote(reviewer, { noteId: notes[0], action: "reopened", body: "Row C-3 too, please." });
    respondToNote(designer, { noteId: notes[0], action: "addressed", body: "C-3 added." });
    respondToNote(reviewer, { noteId: notes[0], action: "closed" });
    const thread = noteView(projectId, notes[0]);
    expect(thread.state).toBe("closed");
    expect(thread.replies.map((r) => [r.action, r.who])).toEqual([
      ["addressed", designer.user.name],
      ["reopened", reviewer.user.name],
      ["addressed", designer.user.name],
      ["closed", reviewer.user.name],
    ]);
    expect(openNoteCount(designer, projectId)).toEqual({ open: 1, addressed: 0 });
  });

  it("refuses steps that do not fit the note or the role, and a stale page, changing nothing", () => {
    const { projectId, notes } = returnedWithNotes();
    expect(refusal(() => respondToNote(designer, { noteId: notes[0], action: "addressed", body: "" })).issues[0]!.path).toBe("body");
    expect(codeOf(() => respondToNote(designer, { noteId: notes[0], action: "closed" }))).toBe("forbidden");
    expect(codeOf(() => respondToNote(reviewer, { noteId: notes[0], action: "addressed", body: "I did it myself." }))).toBe("forbidden");
    expect(codeOf(() => respondToNote(office, { noteId: notes[0], action: "reply", body: "The office asks too." }))).toBe("forbidden");
    expect(codeOf(() => respondToNote(outsider, { noteId: notes[0], action: "reply", body: "Not ours." }))).toBe("not-found");
    expect(refusal(() => respondToNote(reviewer, { noteId: notes[0], action: "reopened" })).message).toMatch(/already open/);
    respondToNote(designer, { noteId: notes[0], action: "reply", body: "Which row do you mean?", seen: 0 });
    expect(codeOf(() => respondToNote(reviewer, { noteId: notes[0], action: "reply", body: "C-2.", seen: 0 }))).toBe("conflict");
    respondToNote(reviewer, { noteId: notes[0], action: "closed", seen: 1 });
    expect(refusal(() => respondToNote(designer, { noteId: notes[0], action: "reply", body: "One more thing." })).message).toMatch(/closed; reopen/);
    expect(noteView(projectId, notes[0]).replies).toHaveLength(2);
    expect(noteView(projectId, notes[1]).replies).toHaveLength(0);
  });
});

describe("a superseded revision", () => {
  it("is not sent again once a later revision exists: refused with the later number, and the page says it is superseded", async () => {
    const project = makeProject(db, org.id, jurisdiction.id);
    const values = { orgId: org.id, projectId: project.id, state: "ready" as const, recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "0".repeat(64), isDraft: false, createdBy: designer.user.id };
    const first = db.insert(packetRevisions).values({ ...values, number: 1, reviewState: "returned" }).returning().get();
    expect(getReviewWorkspace(designer, first.id).supersededBy).toBeNull();
    db.insert(packetRevisions).values({ ...values, number: 2, reviewState: "draft" }).run();
    const error = await sendForReview(designer, first.id, { deliver: async () => undefined }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ServiceError);
    expect((error as ServiceError).message).toBe("Revision 1 is superseded by revision 2; send revision 2 instead.");
    expect(getReviewWorkspace(designer, first.id).supersededBy).toBe(2);
    expect(db.select().from(packetRevisions).all().find((r) => r.id === first.id)!.reviewState).toBe("returned");
  });
});
