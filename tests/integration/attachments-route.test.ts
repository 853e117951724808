import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { packetRevisions, projectEquipment } from "../../db/schema";
import type { ServiceContext } from "../../lib/services/context";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { makeEncryptedLookingPdf, makePdf, makePng } from "../unit/uploads/fixtures";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

// A small limit so the 413 path is reached with a file made in the test; read once, on first use.
const LIMIT_BYTES = 8 * 1024;
process.env.UPLOAD_MAX_BYTES = String(LIMIT_BYTES);

let acting: ServiceContext | null = null;
vi.mock("server-only", () => ({}));
vi.mock("@/lib/auth/session", () => ({
  requireContext: async () => {
    if (!acting) throw new Error("no actor set");
    return acting;
  },
}));

const { POST } = await import("../../app/api/uploads/route");
const attachmentRoute = await import("../../app/api/attachments/[id]/route");

const t = tempDatabase();
const storeDir = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-route-uploads-"));
beforeAll(() => setFileStore(new DiskFileStore(storeDir)));
afterAll(() => {
  setFileStore(undefined);
  t.cleanup();
  fs.rmSync(storeDir, { recursive: true, force: true });
});

const org = makeOrg(t.db);
const designer = makeContext(t.db, org.id, ["designer"]);
const outsider = makeContext(t.db, makeOrg(t.db).id, ["designer"]);
const project = makeProject(t.db, org.id, makeJurisdiction(t.db, org.id).id);
t.db.insert(projectEquipment).values({ projectId: project.id, tag: "CC-1", kind: "charge-controller", data: {} }).run();

function uploadRequest(file: { name: string; type: string; bytes: Uint8Array } | null, fields: Record<string, string>) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  if (file) form.set("file", new File([file.bytes as Uint8Array<ArrayBuffer>], file.name, { type: file.type }));
  return new Request("http://localhost/api/uploads", { method: "POST", body: form });
}

const params = (id: string) => ({ params: Promise.resolve({ id }) });

describe("POST /api/uploads", () => {
  it("answers 201 with the attachment, then 200 for the same bytes again", async () => {
    acting = designer;
    const bytes = await makePdf(2, "Controller");
    const fields = { projectId: project.id, kind: "datasheet", equipmentTag: "CC-1" };
    const first = await POST(uploadRequest({ name: "kv-100-30.pdf", type: "application/pdf", bytes }, fields));
    expect(first.status).toBe(201);
    const body = (await first.json()) as { attachment: { id: string; pageCount: number }; url: string; duplicate: boolean };
    expect(body.attachment.pageCount).toBe(2);
    expect(body.url).toBe(`/api/attachments/${body.attachment.id}`);

    const again = await POST(uploadRequest({ name: "kv-100-30 (1).pdf", type: "application/pdf", bytes }, fields));
    expect(again.status).toBe(200);
    expect(await again.json()).toMatchObject({ duplicate: true, attachment: { id: body.attachment.id } });
  });

  it("answers 415 for a PNG renamed .pdf, with the message for the uploader", async () => {
    acting = designer;
    const response = await POST(uploadRequest({ name: "kv-100-30.pdf", type: "application/pdf", bytes: makePng() }, { projectId: project.id, kind: "datasheet", equipmentTag: "CC-1" }));
    expect(response.status).toBe(415);
    expect(await response.json()).toMatchObject({ code: "upload-refused", reason: "wrong-kind", error: expect.stringContaining("is a PNG image") });
  });

  it("answers 413 over the configured limit", async () => {
    acting = designer;
    const big = new Uint8Array(LIMIT_BYTES + 1).fill(0x20);
    big.set(new TextEncoder().encode("%PDF-1.7\n"));
    const response = await POST(uploadRequest({ name: "scan.pdf", type: "application/pdf", bytes: big }, { projectId: project.id, kind: "site-plan" }));
    expect(response.status).toBe(413);
    expect((await response.json()).error).toContain("8 KB");
  });

  it("answers 400 for an encrypted PDF, a missing file and an unknown kind", async () => {
    acting = designer;
    const encrypted = await POST(uploadRequest({ name: "locked.pdf", type: "application/pdf", bytes: await makeEncryptedLookingPdf() }, { projectId: project.id, kind: "site-plan" }));
    expect(encrypted.status).toBe(400);
    expect((await encrypted.json()).reason).toBe("encrypted");

    const missing = await POST(uploadRequest(null, { projectId: project.id, kind: "site-plan" }));
    expect(missing.status).toBe(400);
    expect((await missing.json()).error).toContain("No file was sent");

    const kind = await POST(uploadRequest({ name: "a.pdf", type: "application/pdf", bytes: await makePdf(1) }, { projectId: project.id, kind: "drawing" }));
    expect(kind.status).toBe(400);
    expect((await kind.json()).issues[0].path).toBe("kind");
  });

  it("answers 404 for another organisation's project", async () => {
    acting = outsider;
    const response = await POST(uploadRequest({ name: "a.pdf", type: "application/pdf", bytes: await makePdf(1) }, { projectId: project.id, kind: "other" }));
    expect(response.status).toBe(404);
  });
});

describe("GET and DELETE /api/attachments/[id]", () => {
  it("downloads with the stored content type and the file's name, and refuses to delete a merged file", async () => {
    acting = designer;
    const bytes = makePng(3, 3);
    const created = await POST(uploadRequest({ name: "Nameplate CC-1 ☀.png", type: "image/png", bytes }, { projectId: project.id, kind: "photo", equipmentTag: "CC-1" }));
    const { attachment } = (await created.json()) as { attachment: { id: string } };

    const download = await attachmentRoute.GET(new Request(`http://localhost/api/attachments/${attachment.id}`), params(attachment.id));
    expect(download.status).toBe(200);
    expect(download.headers.get("content-type")).toBe("image/png");
    expect(download.headers.get("x-content-type-options")).toBe("nosniff");
    expect(download.headers.get("content-disposition")).toContain(`filename*=UTF-8''${encodeURIComponent("Nameplate CC-1 ☀.png")}`);
    expect(Buffer.from(await download.arrayBuffer()).equals(Buffer.from(bytes))).toBe(true);

    t.db
      .insert(packetRevisions)
      .values({ orgId: org.id, projectId: project.id, number: 1, recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "1".repeat(64), attachmentIds: [attachment.id] })
      .run();
    const refused = await attachmentRoute.DELETE(new Request("http://localhost", { method: "DELETE" }), params(attachment.id));
    expect(refused.status).toBe(409);
    expect((await refused.json()).error).toContain("Rev 1");

    acting = outsider;
    const hidden = await attachmentRoute.GET(new Request("http://localhost"), params(attachment.id));
    expect(hidden.status).toBe(404);
  });
});
