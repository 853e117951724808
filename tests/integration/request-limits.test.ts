import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { attachments, equipmentLibrary } from "../../db/schema";
import type { ServiceContext } from "../../lib/services/context";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

/**
 * A signed-in user must not be able to exhaust the server's memory through a
 * request body: the permission is checked before a byte is read, and the size
 * is counted on the stream, whatever Content-Length says or omits.
 */

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

const uploads = await import("../../app/api/uploads/route");
const stamp = await import("../../app/api/reviews/licence/stamp/route");
const csvImport = await import("../../app/api/library/import/route");
const checks = await import("../../app/api/checks/route");

const t = tempDatabase();
const storeDir = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-limits-"));
beforeAll(() => setFileStore(new DiskFileStore(storeDir)));
afterAll(() => {
  setFileStore(undefined);
  t.cleanup();
  fs.rmSync(storeDir, { recursive: true, force: true });
});

const org = makeOrg(t.db);
const designer = makeContext(t.db, org.id, ["designer"]);
const reviewer = makeContext(t.db, org.id, ["reviewer"]);
const office = makeContext(t.db, org.id, ["office"]);
const installer = makeContext(t.db, org.id, ["installer"]);
const project = makeProject(t.db, org.id, makeJurisdiction(t.db, org.id).id);

const MB = 1024 * 1024;

/**
 * A body sent in chunks with no Content-Length, that counts how many chunks the
 * server pulled. Its first chunk opens a multipart form, so a server that reads
 * it at all sees an upload in progress.
 */
function chunkedBody(url: string, contentType: string, chunkBytes = 1024, totalBytes = 256 * MB) {
  const counter = { reads: 0 };
  const head = new TextEncoder().encode(`--b\r\ncontent-disposition: form-data; name="file"; filename="x.pdf"\r\ncontent-type: application/pdf\r\n\r\n%PDF-1.7\n`);
  const stream = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        counter.reads += 1;
        if (counter.reads === 1) controller.enqueue(head);
        else if (counter.reads * chunkBytes > totalBytes) controller.close();
        else controller.enqueue(new Uint8Array(chunkBytes).fill(0x20));
      },
    },
    { highWaterMark: 0 },
  );
  const request = new Request(url, { method: "POST", body: stream, duplex: "half", headers: { "content-type": contentType } } as RequestInit);
  return { request, counter };
}

const multipart = "multipart/form-data; boundary=b";

describe("uploads: permission first, size on the stream", () => {
  it("refuses a role that may not upload without reading the body", async () => {
    acting = office;
    const { request, counter } = chunkedBody("http://localhost/api/uploads", multipart);
    const response = await uploads.POST(request);
    expect(response.status).toBe(403);
    expect(counter.reads).toBe(0);
  });

  it("answers 413 to a chunked upload past the limit, having read little more than the limit", async () => {
    acting = designer;
    const before = t.db.select().from(attachments).all().length;
    const { request, counter } = chunkedBody("http://localhost/api/uploads", multipart);
    expect(request.headers.get("content-length")).toBeNull();
    const response = await uploads.POST(request);
    expect(response.status).toBe(413);
    expect(await response.json()).toMatchObject({ code: "upload-refused", reason: "too-large" });
    // The limit plus the multipart allowance is 72 KB: about 73 one-kilobyte reads, not 256 MB of them.
    expect(counter.reads).toBeLessThan(100);
    expect(t.db.select().from(attachments).all().length).toBe(before);
  });

  it("still takes an ordinary upload", async () => {
    acting = designer;
    const { makePdf } = await import("../unit/uploads/fixtures");
    const form = new FormData();
    form.set("projectId", project.id);
    form.set("kind", "other");
    form.set("file", new File([(await makePdf(1)) as Uint8Array<ArrayBuffer>], "note.pdf", { type: "application/pdf" }));
    const response = await uploads.POST(new Request("http://localhost/api/uploads", { method: "POST", body: form }));
    expect(response.status).toBe(201);
  });
});

describe("stamp image: permission first, size on the stream", () => {
  it("refuses a designer without reading the body", async () => {
    acting = designer;
    const { request, counter } = chunkedBody("http://localhost/api/reviews/licence/stamp", multipart);
    expect((await stamp.POST(request)).status).toBe(403);
    expect(counter.reads).toBe(0);
  });

  it("answers 413 to a chunked stamp past the limit", async () => {
    acting = reviewer;
    const { request, counter } = chunkedBody("http://localhost/api/reviews/licence/stamp", multipart);
    expect((await stamp.POST(request)).status).toBe(413);
    expect(counter.reads).toBeLessThan(100);
  });
});

describe("equipment CSV import: permission first, size on the stream", () => {
  it("refuses an installer without reading the body", async () => {
    acting = installer;
    const { request, counter } = chunkedBody("http://localhost/api/library/import", "text/csv");
    expect((await csvImport.POST(request)).status).toBe(403);
    expect(counter.reads).toBe(0);
  });

  it("answers 413 to a chunked CSV past 2 MB, adding nothing", async () => {
    acting = designer;
    const before = t.db.select().from(equipmentLibrary).all().length;
    const { request, counter } = chunkedBody("http://localhost/api/library/import", "text/csv", 64 * 1024);
    const response = await csvImport.POST(request);
    expect(response.status).toBe(413);
    // 2 MB in 64 KB reads is 32; a server that read the whole 256 MB would pull 4096.
    expect(counter.reads).toBeLessThan(40);
    expect(t.db.select().from(equipmentLibrary).all().length).toBe(before);
  });
});

describe("/api/checks", () => {
  it("refuses an installer, who reads no projects", async () => {
    acting = installer;
    const response = await checks.POST(new Request("http://localhost/api/checks", { method: "POST", body: "{}", headers: { "content-type": "application/json" } }));
    expect(response.status).toBe(403);
  });

  it("answers 413 to a record past the JSON bound, counted on the stream", async () => {
    acting = designer;
    const { request, counter } = chunkedBody("http://localhost/api/checks", "application/json", 64 * 1024);
    const response = await checks.POST(request);
    expect(response.status).toBe(413);
    expect(counter.reads).toBeLessThan(40);
  });
});
