import fs from "node:fs";
import { afterAll, describe, expect, it } from "vitest";
import { attachments, packetRevisions } from "../../db/schema";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import { confirmOnSite, getApprovedSet, unconfirmOnSite } from "../../lib/services/install/approved-set";
import { makeContext, makeOrg, makeProject, tempDatabase, codeOf } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/market-stall.json", "utf8")));

function revision(orgId: string, projectId: string, reviewState: "approved" | "in-review") {
  return db
    .insert(packetRevisions)
    .values({ orgId, projectId, number: reviewState === "approved" ? 1 : 2, state: "ready", reviewState, recordSnapshot: record as never, resultsSnapshot: {}, recordSha256: "0".repeat(64) })
    .returning()
    .get();
}


describe("approved sets for the installer", () => {
  const org = makeOrg(db);
  const other = makeOrg(db);
  const project = makeProject(db, org.id);
  const approved = revision(org.id, project.id, "approved");
  const inReview = revision(org.id, project.id, "in-review");
  const installer = makeContext(db, org.id, ["installer"]);

  it("computes the labels from the stamped snapshot", () => {
    const set = getApprovedSet(installer, approved.id);
    expect(set.labels.length).toBeGreaterThan(0);
    expect(set.labels.every((l) => l.codeRef.startsWith("NEC 2020"))).toBe(true);
  });

  it("does not open a revision still in review, nor another organisation's", () => {
    expect(codeOf(() => getApprovedSet(installer, inReview.id))).toBe("not-found");
    expect(codeOf(() => getApprovedSet(makeContext(db, other.id, ["installer"]), approved.id))).toBe("not-found");
  });

  it("records a placed label once, and can undo it", () => {
    const label = getApprovedSet(installer, approved.id).labels[0]!;
    confirmOnSite(installer, { revisionId: approved.id, itemKind: "label", itemId: label.id });
    confirmOnSite(installer, { revisionId: approved.id, itemKind: "label", itemId: label.id });
    expect(getApprovedSet(installer, approved.id).confirmations.filter((c) => c.itemId === label.id)).toHaveLength(1);
    unconfirmOnSite(installer, { revisionId: approved.id, itemKind: "label", itemId: label.id });
    expect(getApprovedSet(installer, approved.id).confirmations).toHaveLength(0);
  });

  it("records a photo of this project with the item, and refuses one of another project", () => {
    const photoRow = (projectId: string) =>
      db
        .insert(attachments)
        .values({ orgId: org.id, projectId, kind: "photo", fileName: "p.png", mimeType: "image/png", sizeBytes: 10, sha256: "a".repeat(64) })
        .returning()
        .get();
    const mine = photoRow(project.id);
    const elsewhere = photoRow(makeProject(db, org.id).id);
    confirmOnSite(installer, { revisionId: approved.id, itemKind: "equipment", itemId: "INV-1" });
    confirmOnSite(installer, { revisionId: approved.id, itemKind: "equipment", itemId: "INV-1", photoAttachmentId: mine.id });
    expect(getApprovedSet(installer, approved.id).confirmations.find((c) => c.itemId === "INV-1")?.photoAttachmentId).toBe(mine.id);
    expect(codeOf(() => confirmOnSite(installer, { revisionId: approved.id, itemKind: "equipment", itemId: "CB-1", photoAttachmentId: elsewhere.id }))).toBe("invalid");
    expect(getApprovedSet(installer, approved.id).confirmations.find((c) => c.itemId === "CB-1")).toBeUndefined();
  });

  it("refuses an item that is not in the approved set, and a role that may not confirm", () => {
    expect(codeOf(() => confirmOnSite(installer, { revisionId: approved.id, itemKind: "equipment", itemId: "NOPE-9" }))).toBe("invalid");
    const office = makeContext(db, org.id, ["office"]);
    expect(codeOf(() => confirmOnSite(office, { revisionId: approved.id, itemKind: "equipment", itemId: "INV-1" }))).toBe("forbidden");
    expect(codeOf(() => getApprovedSet(makeContext(db, org.id, ["designer"]), approved.id))).toBe("forbidden");
  });
});
