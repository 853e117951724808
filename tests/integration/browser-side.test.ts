import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { attachments, equipmentLibrary, packetRevisions, projectEquipment, projects } from "../../db/schema";
import { renderEmail } from "../../lib/email/render";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import type { ServiceContext } from "../../lib/services/context";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { makePdf, makePng } from "../unit/uploads/fixtures";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

/**
 * What a hostile page in the user's browser, or a user of a narrower role,
 * must not be able to do through the route handlers.
 */

let acting: ServiceContext | null = null;
vi.mock("server-only", () => ({}));
vi.mock("@/lib/auth/session", () => ({
  requireContext: async () => {
    if (!acting) throw new Error("no actor set");
    return acting;
  },
}));
process.env.APP_URL = "http://localhost:3000";

const projectsRoute = await import("../../app/api/projects/route");
const uploadsRoute = await import("../../app/api/uploads/route");
const attachmentRoute = await import("../../app/api/attachments/[id]/route");
const labelsRoute = await import("../../app/api/install/[revisionId]/labels/route");

const t = tempDatabase();
const storeDir = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-browser-side-"));
beforeAll(() => setFileStore(new DiskFileStore(storeDir)));
afterAll(() => {
  setFileStore(undefined);
  t.cleanup();
  fs.rmSync(storeDir, { recursive: true, force: true });
});

const org = makeOrg(t.db);
const designer = makeContext(t.db, org.id, ["designer"]);
const installer = makeContext(t.db, org.id, ["installer"]);
const jurisdiction = makeJurisdiction(t.db, org.id);
const projectCount = () => t.db.select().from(projects).all().length;
const newProject = { name: "Larkspur cabin", client: "R. Okafor", systemKind: "stand-alone", jurisdictionId: jurisdiction.id, address: "12 Fenwick Lane" };

describe("origin check on data-changing route handlers", () => {
  it("refuses a POST whose Origin is another site, changing nothing", async () => {
    acting = designer;
    const before = projectCount();
    const response = await projectsRoute.POST(
      new Request("http://localhost:3000/api/projects", { method: "POST", body: JSON.stringify(newProject), headers: { "content-type": "application/json", origin: "https://evil.example" } }),
    );
    expect(response.status).toBe(403);
    expect(projectCount()).toBe(before);
  });

  it("refuses a request the browser marks cross-site, even without an Origin", async () => {
    acting = designer;
    const response = await projectsRoute.POST(
      new Request("http://localhost:3000/api/projects", { method: "POST", body: JSON.stringify(newProject), headers: { "content-type": "application/json", "sec-fetch-site": "cross-site" } }),
    );
    expect(response.status).toBe(403);
  });

  it("refuses a cross-site upload before reading it", async () => {
    acting = designer;
    const form = new FormData();
    form.set("file", new File([makePng() as Uint8Array<ArrayBuffer>], "a.png", { type: "image/png" }));
    const response = await uploadsRoute.POST(new Request("http://localhost:3000/api/uploads", { method: "POST", body: form, headers: { origin: "https://evil.example" } }));
    expect(response.status).toBe(403);
  });

  it("takes the same POST from the app's own origin", async () => {
    acting = designer;
    const before = projectCount();
    const response = await projectsRoute.POST(
      new Request("http://localhost:3000/api/projects", { method: "POST", body: JSON.stringify(newProject), headers: { "content-type": "application/json", origin: "http://localhost:3000", "sec-fetch-site": "same-origin" } }),
    );
    expect(response.status).toBe(201);
    expect(projectCount()).toBe(before + 1);
  });
});

describe("the JSON reader takes JSON only", () => {
  it("answers 415 to a text/plain body, as an HTML form can send without CORS, changing nothing", async () => {
    acting = designer;
    const before = projectCount();
    const response = await projectsRoute.POST(new Request("http://localhost:3000/api/projects", { method: "POST", body: JSON.stringify(newProject), headers: { "content-type": "text/plain" } }));
    expect(response.status).toBe(415);
    expect(projectCount()).toBe(before);
  });

  it("answers 415 to a urlencoded form post", async () => {
    acting = designer;
    const response = await projectsRoute.POST(new Request("http://localhost:3000/api/projects", { method: "POST", body: new URLSearchParams({ name: "x" }) }));
    expect(response.status).toBe(415);
  });
});

describe("installers read only approved sets", () => {
  const project = makeProject(t.db, org.id, jurisdiction.id);
  let datasheetId = "";
  let draftOnlyId = "";

  beforeAll(async () => {
    acting = designer;
    const upload = async (name: string, kind: string, bytes: Uint8Array, type: string) => {
      const form = new FormData();
      form.set("projectId", project.id);
      form.set("kind", kind);
      form.set("file", new File([bytes as Uint8Array<ArrayBuffer>], name, { type }));
      const response = await uploadsRoute.POST(new Request("http://localhost:3000/api/uploads", { method: "POST", body: form }));
      return ((await response.json()) as { attachment: { id: string } }).attachment.id;
    };
    datasheetId = await upload("inverter.pdf", "other", await makePdf(1, "Inverter"), "application/pdf");
    draftOnlyId = await upload("draft-notes.pdf", "other", await makePdf(1, "Draft"), "application/pdf");
    t.db
      .insert(packetRevisions)
      .values({ orgId: org.id, projectId: project.id, number: 1, recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "2".repeat(64), attachmentIds: [datasheetId], reviewState: "approved" })
      .run();
  });

  const params = (id: string) => ({ params: Promise.resolve({ id }) });

  it("reads a file the approved revision merged", async () => {
    acting = installer;
    const response = await attachmentRoute.GET(new Request(`http://localhost:3000/api/attachments/${datasheetId}?inline=1`), params(datasheetId));
    expect(response.status).toBe(200);
  });

  it("does not read a file no approved revision merged (not found, so its existence does not show)", async () => {
    acting = installer;
    const response = await attachmentRoute.GET(new Request(`http://localhost:3000/api/attachments/${draftOnlyId}`), params(draftOnlyId));
    expect(response.status).toBe(404);
  });

  it("the designer still reads both", async () => {
    acting = designer;
    expect((await attachmentRoute.GET(new Request("http://localhost:3000"), params(draftOnlyId))).status).toBe(200);
  });

  it("serves files inline in a sandbox, so script in a PDF cannot act as the app", async () => {
    acting = designer;
    const response = await attachmentRoute.GET(new Request(`http://localhost:3000/api/attachments/${datasheetId}?inline=1`), params(datasheetId));
    expect(response.headers.get("content-security-policy")).toMatch(/(^|;\s*)sandbox(;|$)/);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(t.db.select().from(attachments).all().length).toBeGreaterThanOrEqual(2);
  });
});

describe("prototype keys in user input", () => {
  it("answers 400, not 500, for a label stock named after an Object property", async () => {
    acting = installer;
    const response = await labelsRoute.GET(new Request("http://localhost:3000/api/install/x/labels?stock=constructor"), { params: Promise.resolve({ revisionId: "x" }) });
    expect(response.status).toBe(400);
  });
});

describe("a project save keeps library links of the organisation only", () => {
  it("drops a link to another organisation's library item", () => {
    const foreignOrg = makeOrg(t.db);
    const foreign = t.db.insert(equipmentLibrary).values({ orgId: foreignOrg.id, kind: "inverter", manufacturer: "Other", model: "Secret 9000" }).returning().get();
    const own = t.db.insert(equipmentLibrary).values({ orgId: org.id, kind: "inverter", manufacturer: "Ours", model: "Own 100" }).returning().get();
    const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
    const project = makeProject(t.db, org.id, jurisdiction.id);
    const [first, second] = record.equipment;
    const equipment = [{ ...first!, libraryItemId: foreign.id }, { ...second!, libraryItemId: own.id }, ...record.equipment.slice(2)];
    saveProjectRecord(designer, project.id, { ...record, equipment }, getProjectRecord(designer, project.id).version);
    const stored = t.db.select().from(projectEquipment).all().filter((e) => e.projectId === project.id);
    expect(stored.find((e) => e.tag === first!.tag)?.libraryItemId).toBeNull();
    expect(stored.find((e) => e.tag === second!.tag)?.libraryItemId).toBe(own.id);
  });
});

describe("e-mail subjects", () => {
  it("keep to one line whatever a project name holds", () => {
    const { subject, text } = renderEmail("sent-for-review", {
      appUrl: "http://localhost:3000",
      projectName: "Hut\r\nBcc: everyone@example.test\n\nHello",
      revisionNumber: 2,
      reviewerName: "Ines",
      designerName: "Dara",
      address: "12 Fenwick Lane",
      failCount: 0,
      warningCount: 1,
      needsInputCount: 0,
      attestCount: 2,
      revisionId: "x",
    });
    expect(subject).not.toMatch(/[\r\n]/);
    expect(subject).toContain("Hut Bcc: everyone@example.test Hello");
    expect(text.length).toBeGreaterThan(0);
  });
});
