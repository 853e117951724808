import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditLog, packetRevisions, projectEquipment } from "../../db/schema";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import {
  deleteAttachment,
  getAttachment,
  getAttachmentFile,
  getAttachmentFiles,
  linkAttachmentToEquipment,
  listProjectAttachments,
  uploadAttachment,
} from "../../lib/services/attachments";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { ServiceError } from "../../lib/services/errors";
import { UploadRefusedError } from "../../lib/uploads/refusal";
import { makePdf, makePng } from "../unit/uploads/fixtures";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const t = tempDatabase();
const storeDir = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-uploads-"));
const store = new DiskFileStore(storeDir);
beforeAll(() => setFileStore(store));
afterAll(() => {
  setFileStore(undefined);
  t.cleanup();
  fs.rmSync(storeDir, { recursive: true, force: true });
});

const org = makeOrg(t.db);
const otherOrg = makeOrg(t.db);
const jurisdiction = makeJurisdiction(t.db, org.id, "2023");
const designer = makeContext(t.db, org.id, ["designer"]);
const installer = makeContext(t.db, org.id, ["installer"]);
const reviewer = makeContext(t.db, org.id, ["reviewer"]);
const office = makeContext(t.db, org.id, ["office"]);
const outsider = makeContext(t.db, otherOrg.id, ["designer"]);

function projectWithEquipment() {
  const project = makeProject(t.db, org.id, jurisdiction.id);
  t.db
    .insert(projectEquipment)
    .values([
      { projectId: project.id, tag: "INV-1", kind: "inverter", position: 0, data: {} },
      { projectId: project.id, tag: "BAT-1", kind: "battery", position: 1, data: {} },
    ])
    .run();
  return project;
}

async function caught(promise: Promise<unknown> | (() => unknown)): Promise<ServiceError> {
  try {
    await (typeof promise === "function" ? promise() : promise);
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a service error");
}

describe("upload", () => {
  it("records kind, equipment, page count and SHA-256, stores the bytes by hash, and feeds the project record", async () => {
    const project = projectWithEquipment();
    const bytes = await makePdf(4, "Inverter datasheet");
    const result = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "hx-8048.pdf", bytes });
    expect(result.duplicate).toBe(false);
    expect(result.message).toContain("4 pages");
    const a = result.attachment;
    expect(a).toMatchObject({ kind: "datasheet", equipmentTag: "INV-1", fileName: "hx-8048.pdf", mimeType: "application/pdf", pageCount: 4, sizeBytes: bytes.length });
    expect(a.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(fs.existsSync(path.join(storeDir, a.sha256.slice(0, 2), `${a.sha256}.pdf`))).toBe(true);

    const { bytes: back } = await getAttachmentFile(designer, a.id);
    expect(Buffer.from(back).equals(Buffer.from(bytes))).toBe(true);

    const record = getProjectRecord(designer, project.id).record;
    expect(record.attachments).toEqual([{ id: a.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "hx-8048.pdf", pageCount: 4, sha256: a.sha256 }]);

    const audited = t.db.select().from(auditLog).where(eq(auditLog.entityId, a.id)).all();
    expect(audited.map((r) => r.action)).toEqual(["attachment.uploaded"]);
  });

  it("recognises the same bytes uploaded again to the same project and answers the existing attachment", async () => {
    const project = projectWithEquipment();
    const bytes = await makePdf(2, "Battery datasheet");
    const first = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "BAT-1", fileName: "oc-48100r.pdf", bytes });
    const again = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "BAT-1", fileName: "copy of oc-48100r.pdf", bytes: new Uint8Array(bytes) });
    expect(again.duplicate).toBe(true);
    expect(again.attachment.id).toBe(first.attachment.id);
    expect(again.message).toContain("already attached as “oc-48100r.pdf” (datasheet for BAT-1)");
    expect(listProjectAttachments(designer, project.id)).toHaveLength(1);
  });

  it("attaches the same bytes to another project as a new row sharing the stored file", async () => {
    const bytes = await makePdf(1, "Shared listing");
    const a = await uploadAttachment(designer, { projectId: projectWithEquipment().id, kind: "storage-listing", equipmentTag: "BAT-1", fileName: "listing.pdf", bytes });
    const b = await uploadAttachment(designer, { projectId: projectWithEquipment().id, kind: "storage-listing", equipmentTag: "BAT-1", fileName: "listing.pdf", bytes });
    expect(b.duplicate).toBe(false);
    expect(b.attachment.id).not.toBe(a.attachment.id);
    expect(b.attachment.sha256).toBe(a.attachment.sha256);
  });

  it("links a storage listing to a battery only, and refuses it unlinked or on other equipment, attaching nothing", async () => {
    const project = projectWithEquipment();
    const bytes = await makePdf(1, "Battery listing");
    const unlinked = await caught(uploadAttachment(designer, { projectId: project.id, kind: "storage-listing", fileName: "l.pdf", bytes }));
    expect(unlinked.issues).toEqual([{ path: "equipmentTag", message: "is required for a storage listing" }]);
    const onInverter = await caught(uploadAttachment(designer, { projectId: project.id, kind: "storage-listing", equipmentTag: "INV-1", fileName: "l.pdf", bytes }));
    expect(onInverter.message).toBe("A storage listing is linked to a battery; INV-1 is an inverter.");
    expect(listProjectAttachments(designer, project.id)).toHaveLength(0);
    const ok = await uploadAttachment(designer, { projectId: project.id, kind: "storage-listing", equipmentTag: "BAT-1", fileName: "l.pdf", bytes });
    expect(ok.attachment.equipmentTag).toBe("BAT-1");
  });

  it("requires an equipment tag of the project for a datasheet", async () => {
    const project = projectWithEquipment();
    const bytes = await makePdf(1);
    const missing = await caught(uploadAttachment(designer, { projectId: project.id, kind: "datasheet", fileName: "x.pdf", bytes }));
    expect(missing.code).toBe("invalid");
    expect(missing.issues[0]?.path).toBe("equipmentTag");
    const unknown = await caught(uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "CC-9", fileName: "x.pdf", bytes }));
    expect(unknown.message).toContain("no equipment tagged “CC-9”");
    expect(unknown.issues[0]?.message).toContain("INV-1, BAT-1");
  });

  it("refuses by content with the upload refusal, and stores nothing", async () => {
    const project = projectWithEquipment();
    const error = await caught(uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "datasheet.pdf", bytes: makePng() }));
    expect(error).toBeInstanceOf(UploadRefusedError);
    expect((error as UploadRefusedError).httpStatus).toBe(415);
    expect(listProjectAttachments(designer, project.id)).toHaveLength(0);
  });

  it("applies the configured size limit", async () => {
    const project = projectWithEquipment();
    const bytes = await makePdf(3);
    const error = await caught(uploadAttachment(designer, { projectId: project.id, kind: "site-plan", fileName: "plan.pdf", bytes }, { maxBytes: 1024 }));
    expect((error as UploadRefusedError).reason).toBe("too-large");
  });
});

describe("roles", () => {
  it("lets an installer upload a photo, but not a datasheet, and not delete", async () => {
    const project = projectWithEquipment();
    const photo = await uploadAttachment(installer, { projectId: project.id, kind: "photo", equipmentTag: "INV-1", fileName: "nameplate.png", bytes: makePng(8, 6) });
    expect(photo.attachment).toMatchObject({ kind: "photo", mimeType: "image/png", pageCount: null, equipmentTag: "INV-1" });
    const datasheet = await caught(uploadAttachment(installer, { projectId: project.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "d.pdf", bytes: await makePdf(1) }));
    expect(datasheet.code).toBe("forbidden");
    const del = await caught(deleteAttachment(installer, photo.attachment.id));
    expect(del.code).toBe("forbidden");
    // An installer reads approved sets only: until the project has an approved revision, not even their own photo.
    const read = await caught(() => getAttachment(installer, photo.attachment.id));
    expect(read.code).toBe("not-found");
    expect(getAttachment(designer, photo.attachment.id).id).toBe(photo.attachment.id);
  });

  it("refuses the permit office an upload, and lets it read the list", async () => {
    const project = projectWithEquipment();
    const error = await caught(uploadAttachment(office, { projectId: project.id, kind: "other", fileName: "n.pdf", bytes: await makePdf(1) }));
    expect(error.code).toBe("forbidden");
    expect(listProjectAttachments(office, project.id)).toEqual([]);
  });

  it("lets a reviewer attach a stamp image", async () => {
    const project = projectWithEquipment();
    const stamp = await uploadAttachment(reviewer, { projectId: project.id, kind: "stamp", fileName: "stamp.png", bytes: makePng(5, 5) });
    expect(stamp.attachment.kind).toBe("stamp");
  });
});

describe("organisation scoping", () => {
  it("does not find another organisation's attachment or project", async () => {
    const project = projectWithEquipment();
    const mine = await uploadAttachment(designer, { projectId: project.id, kind: "site-plan", fileName: "plan.png", bytes: makePng(9, 9) });
    for (const attempt of [
      () => getAttachment(outsider, mine.attachment.id),
      () => getAttachmentFile(outsider, mine.attachment.id),
      () => deleteAttachment(outsider, mine.attachment.id),
      () => linkAttachmentToEquipment(outsider, mine.attachment.id, "INV-1"),
      () => listProjectAttachments(outsider, project.id),
    ]) {
      const error = await caught(attempt);
      expect(error.code).toBe("not-found");
    }
    const upload = await caught(uploadAttachment(outsider, { projectId: project.id, kind: "other", fileName: "x.pdf", bytes: await makePdf(1) }));
    expect(upload.code).toBe("not-found");
    expect(listProjectAttachments(designer, project.id)).toHaveLength(1);
  });
});

describe("delete", () => {
  it("is refused while a packet revision merges the attachment, naming the revision", async () => {
    const project = projectWithEquipment();
    const up = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "inv.pdf", bytes: await makePdf(2, "Merged") });
    t.db
      .insert(packetRevisions)
      .values({ orgId: org.id, projectId: project.id, number: 2, state: "ready", recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "0".repeat(64), attachmentIds: [up.attachment.id] })
      .run();
    const error = await caught(deleteAttachment(designer, up.attachment.id));
    expect(error.code).toBe("conflict");
    expect(error.message).toContain("merged into Rev 2 of the packet");
    expect(error.message).toContain("“inv.pdf” (datasheet for INV-1)");
    expect(listProjectAttachments(designer, project.id)[0]?.usedByRevisions).toEqual([2]);
    expect(await store.exists(`${up.attachment.sha256.slice(0, 2)}/${up.attachment.sha256}.pdf`)).toBe(true);
  });

  it("is not held by a draft whose generation failed, but is by a failed re-render of a reviewed revision", async () => {
    const project = projectWithEquipment();
    const up = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "held.pdf", bytes: await makePdf(1, "Held") });
    const revision = (number: number, reviewState: "draft" | "approved") =>
      t.db
        .insert(packetRevisions)
        .values({ orgId: org.id, projectId: project.id, number, state: "failed", reviewState, recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "0".repeat(64), attachmentIds: [up.attachment.id] })
        .run();
    revision(1, "draft");
    expect(listProjectAttachments(designer, project.id)[0]?.usedByRevisions).toEqual([]);
    revision(2, "approved");
    expect((await caught(deleteAttachment(designer, up.attachment.id))).code).toBe("conflict");
  });

  it("deletes an unused attachment and its bytes once no row uses them", async () => {
    const bytes = await makePdf(1, "Letter");
    const p1 = projectWithEquipment();
    const p2 = projectWithEquipment();
    const a = await uploadAttachment(designer, { projectId: p1.id, kind: "structural-letter", fileName: "letter.pdf", bytes });
    const b = await uploadAttachment(designer, { projectId: p2.id, kind: "structural-letter", fileName: "letter.pdf", bytes });
    const key = `${a.attachment.sha256.slice(0, 2)}/${a.attachment.sha256}.pdf`;

    const first = await deleteAttachment(designer, a.attachment.id);
    expect(first.message).toContain("Deleted “letter.pdf”");
    expect(await store.exists(key)).toBe(true);
    await deleteAttachment(designer, b.attachment.id);
    expect(await store.exists(key)).toBe(false);
    expect((await caught(() => getAttachment(designer, a.attachment.id))).code).toBe("not-found");
  });
});

describe("linking and reading for the packet", () => {
  it("moves a datasheet to another tag but never leaves it without one", async () => {
    const project = projectWithEquipment();
    const up = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "d.pdf", bytes: await makePdf(1, "Moved") });
    expect(linkAttachmentToEquipment(designer, up.attachment.id, "BAT-1").equipmentTag).toBe("BAT-1");
    expect((await caught(() => linkAttachmentToEquipment(designer, up.attachment.id, null))).code).toBe("invalid");
    expect((await caught(() => linkAttachmentToEquipment(designer, up.attachment.id, "GEN-7"))).code).toBe("invalid");
  });

  it("reads several files in the order asked, and refuses bytes that no longer match their SHA-256", async () => {
    const project = projectWithEquipment();
    const a = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "INV-1", fileName: "a.pdf", bytes: await makePdf(2, "A") });
    const b = await uploadAttachment(designer, { projectId: project.id, kind: "datasheet", equipmentTag: "BAT-1", fileName: "b.pdf", bytes: await makePdf(3, "B") });
    const files = await getAttachmentFiles(designer, [b.attachment.id, a.attachment.id]);
    expect(files.map((f) => f.attachment.fileName)).toEqual(["b.pdf", "a.pdf"]);

    fs.writeFileSync(store.pathFor(`${a.attachment.sha256.slice(0, 2)}/${a.attachment.sha256}.pdf`), "tampered");
    expect((await caught(getAttachmentFile(designer, a.attachment.id))).code).toBe("conflict");
  });
});
