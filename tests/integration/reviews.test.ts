import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { PDFDocument, StandardFonts } from "pdf-lib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditLog, outbox, packetRevisions, projects, reviewerLicences, reviewNotes, reviews } from "../../db/schema";
import { AHJ_FOOTER, REVIEW_MARKING } from "../../lib/packet/model";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import type { ServiceContext } from "../../lib/services/context";
import { ServiceError } from "../../lib/services/errors";
import { createProject } from "../../lib/services/projects/create";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { uploadAttachment } from "../../lib/services/attachments";
import { generateRevisionArtifacts, getRevisionFile, startRevision } from "../../lib/services/revisions";
import {
  decideReview,
  getOwnLicence,
  getReviewWorkspace,
  listProjectReviews,
  renderStampedPacketAgain,
  saveOwnLicence,
  sendForReview,
  uploadStampImage,
} from "../../lib/services/reviews";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { UploadRefusedError } from "../../lib/uploads/refusal";
import { makePng } from "../unit/packet/fixtures";
import { readPdfText } from "../unit/packet/pdf-text";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-reviews-"));
const packetsDir = path.join(scratch, "packets");
setFileStore(new DiskFileStore(path.join(scratch, "uploads")));
afterAll(() => {
  setFileStore(undefined);
  env.cleanup();
  fs.rmSync(scratch, { recursive: true, force: true });
});

/** Mail stays queued in the outbox: these tests read the outbox, not an SMTP server. */
const noDelivery = async () => undefined;
const render = (id: string) => generateRevisionArtifacts(db, id, { packetsDir });
const NOW = new Date("2026-12-01T12:00:00Z");

async function codeOf(fn: () => unknown): Promise<string | undefined> {
  try {
    await fn();
  } catch (error) {
    if (error instanceof UploadRefusedError) return `upload:${error.reason}`;
    if (error instanceof ServiceError) return error.code;
    throw error;
  }
  return undefined;
}

const org = makeOrg(db, "Review Test Firm");
const otherOrg = makeOrg(db, "Another Firm");
const designer = makeContext(db, org.id, ["designer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const secondReviewer = makeContext(db, org.id, ["reviewer"]);
const office = makeContext(db, org.id, ["office"]);
const admin = makeContext(db, org.id, ["admin"]);
const outsiderReviewer = makeContext(db, otherOrg.id, ["reviewer"]);
const outsiderDesigner = makeContext(db, otherOrg.id, ["designer"]);
const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
const jurisdiction = makeJurisdiction(db, org.id, record.jurisdiction.necEdition);

function newProject(ctx: ServiceContext, name: string): string {
  const { id } = createProject(ctx, { name, client: record.client, systemKind: record.systemKind, jurisdictionId: jurisdiction.id, address: record.site.address });
  saveProjectRecord(ctx, id, { ...record, name }, getProjectRecord(ctx, id).version);
  return id;
}

async function readyRevision(projectId: string): Promise<string> {
  const { revisionId } = startRevision(designer, projectId, { dispatch: () => undefined });
  const row = await render(revisionId);
  expect(row.state).toBe("ready");
  return revisionId;
}

function revisionRow(id: string) {
  return db.select().from(packetRevisions).where(eq(packetRevisions.id, id)).get()!;
}

function mailTo(address: string, template: string) {
  return db
    .select()
    .from(outbox)
    .where(and(eq(outbox.orgId, org.id), eq(outbox.toAddress, address), eq(outbox.template, template)))
    .all();
}

/** A check result id of the revision's snapshot, for notes. */
function firstFailingResult(revisionId: string): { id: string; title: string } {
  const ws = getReviewWorkspace(reviewer, revisionId);
  const fail = ws.groups.find((g) => g.status === "fail") ?? ws.groups[0]!;
  return fail.results[0]!;
}

const stall = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/market-stall.json", "utf8")));
const stallJurisdiction = makeJurisdiction(db, org.id, stall.jurisdiction.necEdition);

async function onePagePdf(label: string): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.addPage([612, 792]).drawText(label, { x: 72, y: 700, size: 14, font: await doc.embedFont(StandardFonts.Helvetica) });
  return doc.save();
}

/** The market stall with every document its jurisdiction asks for, so its revision is complete rather than a draft. */
async function completeRevision(name: string): Promise<{ projectId: string; revisionId: string }> {
  const { id } = createProject(designer, { name, client: stall.client, systemKind: stall.systemKind, jurisdictionId: stallJurisdiction.id, address: stall.site.address });
  saveProjectRecord(designer, id, { ...stall, name }, getProjectRecord(designer, id).version);
  for (const tag of ["MOD-1", "CC-1", "BAT-1", "INV-1"]) {
    await uploadAttachment(designer, { projectId: id, kind: "datasheet", equipmentTag: tag, fileName: `${tag}.pdf`, bytes: await onePagePdf(`${name} ${tag} datasheet`) });
  }
  await uploadAttachment(designer, { projectId: id, kind: "storage-listing", equipmentTag: "BAT-1", fileName: "listing.pdf", bytes: await onePagePdf(`${name} storage listing`) });
  await uploadAttachment(designer, { projectId: id, kind: "site-plan", fileName: "site.pdf", bytes: await onePagePdf(`${name} site plan`) });
  const revisionId = await readyRevision(id);
  expect(revisionRow(revisionId).isDraft, "the complete stall is not a draft").toBe(false);
  return { projectId: id, revisionId };
}

/** A disposition for every attest item of the revision, accepted with a note, as a reviewer gives them before approving. */
function acceptAll(id: string) {
  const run = revisionRow(id).resultsSnapshot as { results: { id: string; status: string }[] };
  return run.results.filter((r) => r.status === "attest").map((r) => ({ resultId: r.id, disposition: "accepted", note: `Seen on the site photos (${r.id}).` }));
}

/** What a designer says when sending a set whose checks fail. */
const HUT_MESSAGE = "The failing breaker is being replaced; please review the rest of the set.";

let projectId = "";
let revisionId = "";

beforeAll(async () => {
  projectId = newProject(designer, "Tamarack hut review copy");
  revisionId = await readyRevision(projectId);
}, 90_000);

describe("sending a revision for review", () => {
  it("is refused to reviewers, the office and other organisations", async () => {
    expect(await codeOf(() => sendForReview(reviewer, revisionId, { deliver: noDelivery }))).toBe("forbidden");
    expect(await codeOf(() => sendForReview(office, revisionId, { deliver: noDelivery }))).toBe("forbidden");
    expect(await codeOf(() => sendForReview(outsiderDesigner, revisionId, { deliver: noDelivery }))).toBe("not-found");
    expect(revisionRow(revisionId).reviewState).toBe("draft");
  });

  it("puts the revision and the project in review and e-mails every reviewer through the outbox", async () => {
    // The hut has failing checks, so sending it needs a message.
    expect(await codeOf(() => sendForReview(designer, revisionId, { deliver: noDelivery }))).toBe("invalid");
    const sent = await sendForReview(designer, revisionId, { deliver: noDelivery, message: HUT_MESSAGE });
    expect(sent.reviewState).toBe("in-review");
    expect(revisionRow(revisionId).reviewState).toBe("in-review");
    expect(db.select().from(projects).where(eq(projects.id, projectId)).get()!.status).toBe("in-review");
    for (const r of [reviewer, secondReviewer]) {
      const mail = mailTo(r.user.email, "sent-for-review");
      expect(mail).toHaveLength(1);
      expect(mail[0]!.subject).toBe("For review: Tamarack hut review copy — packet revision 1");
      expect(mail[0]!.bodyText).toContain(designer.user.name);
      expect(mail[0]!.status).toBe("queued");
    }
    // Nobody outside the organisation hears of it.
    expect(db.select().from(outbox).where(eq(outbox.toAddress, outsiderReviewer.user.email)).all()).toHaveLength(0);
    expect(db.select().from(auditLog).where(and(eq(auditLog.action, "review.sent"), eq(auditLog.entityId, revisionId))).all()).toHaveLength(1);
  });

  it("refuses to send a revision already waiting", async () => {
    expect(await codeOf(() => sendForReview(designer, revisionId, { deliver: noDelivery, message: HUT_MESSAGE }))).toBe("conflict");
  });
});

describe("deciding", () => {
  it("is for reviewers only: a designer may send but not approve or return, nor may the office or an admin", async () => {
    for (const ctx of [designer, office, admin]) {
      expect(await codeOf(() => decideReview(ctx, { revisionId, decision: "approved", confirmStamp: true }, { deliver: noDelivery, dispatch: render }))).toBe("forbidden");
      expect(await codeOf(() => decideReview(ctx, { revisionId, decision: "returned", generalNotes: "x" }, { deliver: noDelivery }))).toBe("forbidden");
    }
    expect(revisionRow(revisionId).reviewState).toBe("in-review");
  });

  it("answers not-found for another organisation's revision", async () => {
    expect(await codeOf(() => decideReview(outsiderReviewer, { revisionId, decision: "returned", generalNotes: "x" }, { deliver: noDelivery }))).toBe("not-found");
    expect(await codeOf(() => getReviewWorkspace(outsiderReviewer, revisionId))).toBe("not-found");
    expect(revisionRow(revisionId).reviewState).toBe("in-review");
  });

  it("refuses a return without a general note or a note on a check or sheet", async () => {
    const error = await decideReview(reviewer, { revisionId, decision: "returned", generalNotes: "   ", notes: [] }, { deliver: noDelivery }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ServiceError);
    expect((error as ServiceError).code).toBe("invalid");
    expect((error as ServiceError).issues.map((i) => i.path)).toContain("generalNotes");
    expect(revisionRow(revisionId).reviewState).toBe("in-review");
    expect(db.select().from(reviews).where(eq(reviews.revisionId, revisionId)).all()).toHaveLength(0);
  });

  it("refuses notes that point at a check or sheet the revision does not have", async () => {
    const badCheck = { targetKind: "check", targetId: "no-such-check:X-9", text: "?" };
    const badSheet = { targetKind: "sheet", targetId: "Z-999", text: "?" };
    expect(await codeOf(() => decideReview(reviewer, { revisionId, decision: "returned", notes: [badCheck] }, { deliver: noDelivery }))).toBe("invalid");
    expect(await codeOf(() => decideReview(reviewer, { revisionId, decision: "returned", notes: [badSheet] }, { deliver: noDelivery }))).toBe("invalid");
  });

  it("returns with a note on a check: the revision and project are returned, the note is kept, the designer is e-mailed it", async () => {
    const check = firstFailingResult(revisionId);
    const text = "Show the conductor sizing for this circuit against NEC 310.16 with the rooftop adder.";
    const decided = await decideReview(
      reviewer,
      { revisionId, decision: "returned", notes: [{ targetKind: "check", targetId: check.id, text }, { targetKind: "sheet", targetId: "E-004", text: "Schedule row missing." }] },
      { deliver: noDelivery },
    );
    expect(decided).toMatchObject({ decision: "returned", noteCount: 2, approvedSha256: null, restamping: false });
    expect(revisionRow(revisionId).reviewState).toBe("returned");
    expect(db.select().from(projects).where(eq(projects.id, projectId)).get()!.status).toBe("returned");
    const stored = db.select().from(reviewNotes).where(eq(reviewNotes.reviewId, decided.reviewId)).all();
    expect(stored.map((n) => [n.targetKind, n.targetId])).toEqual([
      ["check", check.id],
      ["sheet", "E-004"],
    ]);
    const mail = mailTo(designer.user.email, "returned");
    expect(mail).toHaveLength(1);
    expect(mail[0]!.bodyText).toContain(text);
    expect(mail[0]!.bodyText).toContain(check.title);
    expect(mail[0]!.bodyText).toContain("Sheet E-004");
    // The designer reads the same notes on their side.
    const history = listProjectReviews(designer, projectId);
    expect(history[0]).toMatchObject({ decision: "returned", revisionNumber: 1, reviewerName: reviewer.user.name });
    expect(history[0]!.notes[0]).toMatchObject({ targetKind: "check", targetId: check.id, text });
    expect(history[0]!.notes[0]!.targetLabel).toContain(check.title);
    expect(await codeOf(() => decideReview(reviewer, { revisionId, decision: "returned", generalNotes: "again" }, { deliver: noDelivery }))).toBe("conflict");
  });

  it("lets the designer send a returned revision again unchanged", async () => {
    await sendForReview(designer, revisionId, { deliver: noDelivery, message: HUT_MESSAGE });
    expect(revisionRow(revisionId).reviewState).toBe("in-review");
    expect(mailTo(reviewer.user.email, "sent-for-review")).toHaveLength(2);
  });
});

describe("the reviewer's licence and stamp", () => {
  it("is kept by reviewers only", async () => {
    expect(await codeOf(() => saveOwnLicence(designer, { licenceNumber: "PE-1", region: "Westmark", discipline: "Electrical", expiresOn: "2030-01-01" }))).toBe("forbidden");
    expect(await codeOf(() => getOwnLicence(office))).toBe("forbidden");
  });

  it("refuses an expiry in the past, a date that does not exist and a stale version", async () => {
    const base = { licenceNumber: "PE-E-771020", region: "Westmark", discipline: "Electrical" };
    const past = await Promise.resolve()
      .then(() => saveOwnLicence(reviewer, { ...base, expiresOn: "2026-11-30" }, { now: NOW }))
      .catch((e: unknown) => e as ServiceError);
    expect((past as ServiceError).issues[0]).toMatchObject({ path: "expiresOn" });
    expect(await codeOf(() => saveOwnLicence(reviewer, { ...base, expiresOn: "2027-02-30" }, { now: NOW }))).toBe("invalid");
    expect(await codeOf(() => saveOwnLicence(reviewer, { ...base, licenceNumber: "", expiresOn: "2028-01-01" }, { now: NOW }))).toBe("invalid");
    const saved = saveOwnLicence(reviewer, { ...base, expiresOn: "2028-06-30" }, { now: NOW });
    expect(saved).toMatchObject({ licenceNumber: "PE-E-771020", standing: "valid", version: 1, stamp: null });
    expect(saved.blockers).toContain("no stamp image is on file");
    expect(await codeOf(() => saveOwnLicence(reviewer, { ...base, expiresOn: "2028-07-31" }, { now: NOW }))).toBe("conflict");
    expect(saveOwnLicence(reviewer, { ...base, expiresOn: "2028-07-31", version: 1 }, { now: NOW }).version).toBe(2);
  });

  it("refuses a stamp that is not an image, or too small to print sharply", async () => {
    const doc = await PDFDocument.create();
    doc.addPage().drawText("stamp", { font: await doc.embedFont(StandardFonts.Helvetica) });
    const pdfBytes = await doc.save();
    expect(await codeOf(() => uploadStampImage(reviewer, { fileName: "stamp.pdf", bytes: pdfBytes }))).toBe("upload:wrong-kind");
    expect(await codeOf(() => uploadStampImage(reviewer, { fileName: "stamp.png", bytes: makePng(40, 40, [160, 20, 30]) }))).toMatch(/^upload:/);
    expect(getOwnLicence(reviewer)!.stamp).toBeNull();
  });
});

describe("approving", () => {
  let stallProjectId = "";
  let approvable = "";
  beforeAll(async () => {
    ({ projectId: stallProjectId, revisionId: approvable } = await completeRevision("Market stall review copy"));
    await sendForReview(designer, approvable, { deliver: noDelivery });
  }, 90_000);

  it("refuses without a licence on file, with an expired licence, without a stamp, or unconfirmed", async () => {
    const attempt = (ctx: ServiceContext, extra: Record<string, unknown> = {}, now = NOW) =>
      codeOf(() => decideReview(ctx, { revisionId: approvable, decision: "approved", confirmStamp: true, ...extra }, { deliver: noDelivery, dispatch: render, now }));
    // secondReviewer has no licence record.
    expect(await attempt(secondReviewer)).toBe("invalid");
    // reviewer has a licence but no stamp yet.
    expect(await attempt(reviewer)).toBe("invalid");
    await uploadStampImage(reviewer, { fileName: "ines-stamp.png", bytes: makePng(240, 240, [150, 20, 30]) });
    expect(getOwnLicence(reviewer)!.stamp?.fileName).toBe("ines-stamp.png");
    expect(await attempt(reviewer, { confirmStamp: false })).toBe("invalid");
    // Expired: the same licence (good through 2028-07-31) read a few years on.
    expect(await attempt(reviewer, {}, new Date("2029-01-01T00:00:00Z"))).toBe("invalid");
    expect(revisionRow(approvable).reviewState).toBe("in-review");
  });

  it("refuses an approval until every attest item has a disposition: accepted with a note, not returned", async () => {
    const all = acceptAll(approvable);
    expect(all.length, "the stall's checks carry attest items").toBeGreaterThan(0);
    const attempt = (dispositions: unknown[]) =>
      decideReview(reviewer, { revisionId: approvable, decision: "approved", confirmStamp: true, dispositions }, { deliver: noDelivery, dispatch: render, now: NOW }).then(
        () => {
          throw new Error("expected a refusal");
        },
        (e: unknown) => e as ServiceError,
      );
    const none = await attempt([]);
    expect(none.code).toBe("invalid");
    expect(none.message).toMatch(/Give each attest item a disposition/);
    expect(none.issues.map((i) => i.path)).toEqual(all.map((d) => `dispositions.${d.resultId}`));
    const noNote = await attempt(all.map((d) => ({ ...d, note: "" })));
    expect(noNote.issues[0]).toMatchObject({ path: "dispositions.0.note" });
    const returned = await attempt(all.map((d, i) => (i === 0 ? { ...d, disposition: "returned" } : d)));
    expect(returned.message).toMatch(/return the revision instead/);
    const stray = await attempt([...all, { resultId: "no-such-check:X", disposition: "accepted", note: "n" }]);
    expect(stray.issues.at(-1)!.message).toMatch(/names no attest item/);
    expect(revisionRow(approvable).reviewState).toBe("in-review");
  });

  it("refuses to stamp a draft: its cover says it is not complete for submittal", async () => {
    expect(revisionRow(revisionId)).toMatchObject({ isDraft: true, reviewState: "in-review" });
    const error = await decideReview(reviewer, { revisionId, decision: "approved", confirmStamp: true }, { deliver: noDelivery, dispatch: render, now: NOW }).catch((e: unknown) => e);
    expect((error as ServiceError).code).toBe("invalid");
    expect((error as ServiceError).issues[0]).toMatchObject({ path: "revision", message: "is a draft" });
    expect(revisionRow(revisionId).reviewState).toBe("in-review");
  });

  it("refuses a revision whose frozen record no longer matches its SHA-256", async () => {
    const { revisionId: tampered } = await completeRevision("Market stall tampered copy");
    await sendForReview(designer, tampered, { deliver: noDelivery });
    const row = revisionRow(tampered);
    db.update(packetRevisions)
      .set({ recordSnapshot: { ...row.recordSnapshot, client: "someone else" } })
      .where(eq(packetRevisions.id, tampered))
      .run();
    expect(getReviewWorkspace(reviewer, tampered).snapshotIntact).toBe(false);
    expect(await codeOf(() => decideReview(reviewer, { revisionId: tampered, decision: "approved", confirmStamp: true }, { deliver: noDelivery, dispatch: render, now: NOW }))).toBe("conflict");
    expect(revisionRow(tampered).reviewState).toBe("in-review");
  }, 90_000);

  it("snapshots the licence, binds the approval to the record hash and stamps every page, even after the project changed", async () => {
    // The designer keeps working after sending: the approval is of the snapshot that was reviewed.
    const stored = getProjectRecord(designer, stallProjectId);
    saveProjectRecord(designer, stallProjectId, { ...stored.record, client: `${stored.record.client} (changed)` }, stored.version);
    const before = getReviewWorkspace(reviewer, approvable);
    expect(before.recordChangedSince).toBe(true);
    expect(before.mayDecide).toBe(true);
    const pdfBefore = revisionRow(approvable).pdfSha256;
    const unstamped = (await getRevisionFile(designer, approvable, "pdf", { packetsDir })).bytes;
    expect(Buffer.from(unstamped).toString("latin1")).not.toMatch(/\/Subtype\s*\/Image/);

    const decided = await decideReview(
      reviewer,
      { revisionId: approvable, decision: "approved", generalNotes: "Reviewed.", confirmStamp: true, dispositions: acceptAll(approvable) },
      { deliver: noDelivery, dispatch: render, now: NOW },
    );
    const row = revisionRow(approvable);
    expect(decided.approvedSha256).toBe(row.recordSha256);
    expect(row.reviewState).toBe("approved");
    expect(row.state).toBe("ready");
    expect(row.pdfSha256).not.toBe(pdfBefore);

    const review = db.select().from(reviews).where(eq(reviews.id, decided.reviewId)).get()!;
    const licence = db.select().from(reviewerLicences).where(eq(reviewerLicences.userId, reviewer.user.id)).get()!;
    expect(review.licenceSnapshot).toEqual({
      reviewerName: reviewer.user.name,
      licenceNumber: licence.licenceNumber,
      region: licence.region,
      discipline: licence.discipline,
      expiresOn: licence.expiresOn,
    });
    expect(review.approvedSha256).toBe(row.recordSha256);
    expect(db.select().from(projects).where(eq(projects.id, stallProjectId)).get()!.status).toBe("approved");

    const stamped = (await getRevisionFile(designer, approvable, "pdf", { packetsDir })).bytes;
    // The stamp image is the packet's only raster: none of the sheets or merged test PDFs draw one.
    expect(Buffer.from(stamped).toString("latin1")).toMatch(/\/Subtype\s*\/Image/);
    const text = await readPdfText(stamped);
    // The review record prints the dispositions given with the approval.
    expect(text.pages.join("\n")).toMatch(/Dispositions of the attest items/i);
    expect(text.pages.join("\n")).toMatch(/Accepted Seen on the site photos/);
    text.pages.forEach((page, i) => {
      expect(page, `page ${i + 1}`).toContain(licence.licenceNumber);
      expect(page, `page ${i + 1}`).toContain(reviewer.user.name);
      expect(page, `page ${i + 1}`).toContain("2026-12-01");
      expect(page, `page ${i + 1}`).toContain(AHJ_FOOTER);
      expect(page, `page ${i + 1}`).not.toContain(REVIEW_MARKING);
    });

    const mail = mailTo(designer.user.email, "approved");
    expect(mail).toHaveLength(1);
    expect(mail[0]!.bodyText).toContain(licence.licenceNumber);
    expect(db.select().from(auditLog).where(and(eq(auditLog.action, "review.approved"), eq(auditLog.entityId, approvable))).all()).toHaveLength(1);

    // A later licence edit does not rewrite what was stamped.
    saveOwnLicence(reviewer, { licenceNumber: "PE-E-999999", region: "Westmark", discipline: "Electrical", expiresOn: "2031-01-01", version: licence.version }, { now: NOW });
    expect(db.select().from(reviews).where(eq(reviews.id, decided.reviewId)).get()!.licenceSnapshot?.licenceNumber).toBe(licence.licenceNumber);

    expect(await codeOf(() => sendForReview(designer, approvable, { deliver: noDelivery }))).toBe("conflict");
    expect(await codeOf(() => decideReview(reviewer, { revisionId: approvable, decision: "returned", generalNotes: "late" }, { deliver: noDelivery }))).toBe("conflict");
  }, 90_000);

  it("renders the stamped packet again after a failed rendering, keeping the approval", async () => {
    db.update(packetRevisions).set({ state: "failed", error: "Step \"sheets\": test" }).where(eq(packetRevisions.id, approvable)).run();
    expect(await codeOf(() => renderStampedPacketAgain(office, approvable, { dispatch: render }))).toBe("forbidden");
    await renderStampedPacketAgain(reviewer, approvable, { dispatch: render });
    expect(revisionRow(approvable)).toMatchObject({ state: "ready", reviewState: "approved" });
    expect(await codeOf(() => renderStampedPacketAgain(reviewer, approvable, { dispatch: render }))).toBe("conflict");
  }, 90_000);
});
