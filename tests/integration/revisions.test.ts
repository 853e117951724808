import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { PDFDocument, StandardFonts } from "pdf-lib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { jobs, organisations, packetRevisions } from "../../db/schema";
import { runChecks } from "../../lib/compliance";
import { formatNumber } from "../../lib/packet/format";
import { REVIEW_MARKING, SHEET_PLAN } from "../../lib/packet/model";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import { uploadAttachment } from "../../lib/services/attachments";
import type { ServiceContext } from "../../lib/services/context";
import { ServiceError } from "../../lib/services/errors";
import { createProject } from "../../lib/services/projects/create";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { generateRevisionArtifacts, getRevision, getRevisionFile, listProjectRevisions, preflightPacket, startRevision } from "../../lib/services/revisions";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { readPdfText, type PdfText } from "../unit/packet/pdf-text";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-revisions-"));
const uploadsDir = path.join(scratch, "uploads");
const packetsDir = path.join(scratch, "packets");
const store = new DiskFileStore(uploadsDir);
setFileStore(store);
afterAll(() => {
  setFileStore(undefined);
  env.cleanup();
  fs.rmSync(scratch, { recursive: true, force: true });
});

const noDispatch = () => undefined;

async function codeOf(fn: () => unknown): Promise<string | undefined> {
  try {
    await fn();
  } catch (error) {
    if (error instanceof ServiceError) return error.code;
    throw error;
  }
  return undefined;
}

/** A plain PDF standing in for a manufacturer's datasheet, each page saying which it is. */
async function datasheetPdf(label: string, pages: number): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let i = 1; i <= pages; i += 1) {
    const page = doc.addPage([612, 792]);
    page.drawText(`${label} datasheet page ${i} of ${pages}`, { x: 72, y: 700, size: 14, font });
  }
  return doc.save();
}

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((d) => d.isFile()).map((d) => path.join(d.parentPath, d.name)).sort();
}

const org = makeOrg(db, "Revision Test Firm");
// The contractor's licence and contact as an office records them on the organisation (invented values).
db.update(organisations).set({ licenceNumber: "EC-555021", licenceClassification: "Electrical contractor", phone: "555-0190", email: "permits@revision-test.test" }).where(eq(organisations.id, org.id)).run();
const otherOrg = makeOrg(db, "Other Firm");
const designer = makeContext(db, org.id, ["designer"]);
const outsider = makeContext(db, otherOrg.id, ["designer"]);
const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
const jurisdiction = makeJurisdiction(db, org.id, record.jurisdiction.necEdition);
let projectId = "";
const DATASHEET_PAGES = 3;

function project(ctx: ServiceContext, name: string) {
  const { id } = createProject(ctx, { name, client: record.client, systemKind: record.systemKind, jurisdictionId: jurisdiction.id, address: record.site.address });
  saveProjectRecord(ctx, id, { ...record, name }, getProjectRecord(ctx, id).version);
  return id;
}

beforeAll(async () => {
  projectId = project(designer, "Tamarack hut test copy");
  await uploadAttachment(designer, { projectId, kind: "datasheet", equipmentTag: "INV-1", fileName: "inv-1-datasheet.pdf", bytes: await datasheetPdf("Inverter-charger INV-1", DATASHEET_PAGES) });
});

describe("preflight", () => {
  it("names each missing datasheet, the missing site plan and storage listing, and counts the failing checks", () => {
    const pre = preflightPacket(designer, projectId);
    // The jurisdiction row defaults to datasheets, storage listing and site plan.
    expect(pre.missingDocuments).toContain("no datasheet for CC-1");
    expect(pre.missingDocuments).toContain("no datasheet for MOD-1");
    expect(pre.missingDocuments).not.toContain("no datasheet for INV-1");
    expect(pre.missingDocuments).toContain("no site plan");
    expect(pre.missingDocuments).toContain("no storage listing for BAT-1");
    const run = runChecks(getProjectRecord(designer, projectId).record);
    expect(pre.failingChecks.length).toBe(run.counts.fail + run.counts["needs-input"]);
    expect(pre.isDraft).toBe(true);
    expect(pre.documents.map((d) => d.fileName)).toEqual(["inv-1-datasheet.pdf"]);
  });
});

describe("generating a revision", () => {
  let revisionId = "";
  let pdfBytes: Uint8Array;
  let text: PdfText;

  beforeAll(async () => {
    const started = startRevision(designer, projectId, { dispatch: noDispatch });
    revisionId = started.revisionId;
    expect(getRevision(designer, revisionId)).toMatchObject({ state: "generating", number: 1 });
    const row = await generateRevisionArtifacts(db, revisionId, { packetsDir });
    expect(row.error).toBeNull();
    pdfBytes = (await getRevisionFile(designer, revisionId, "pdf", { packetsDir })).bytes;
    text = await readPdfText(pdfBytes);
  }, 60_000);

  it("ends ready, at the last step, as a draft (checks fail and documents are missing)", () => {
    const view = getRevision(designer, revisionId);
    expect(view).toMatchObject({ state: "ready", progressStep: "done", isDraft: true, error: null });
    expect(view.pdfUrl).toBe(`/api/revisions/${revisionId}/pdf`);
  });

  it("carries the review marking on every page", () => {
    expect(text.pages.length).toBeGreaterThan(SHEET_PLAN.length);
    text.pages.forEach((page, i) => expect(page, `page ${i + 1}`).toContain(REVIEW_MARKING));
  });

  it("keeps a blank AHJ approval stamp box and the contractor's licence and contact on every sheet", () => {
    const row = db.select().from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get()!;
    const sheetPages = (row.pageCount ?? 0) - DATASHEET_PAGES;
    expect(sheetPages).toBeGreaterThan(SHEET_PLAN.length - 1);
    for (let i = 0; i < sheetPages; i += 1) {
      expect(text.pages[i], `page ${i + 1}`).toContain("AHJ APPROVAL STAMP");
      expect(text.pages[i], `page ${i + 1}`).toContain("Licence EC-555021 · Electrical contractor");
      expect(text.pages[i], `page ${i + 1}`).toContain("555-0190 · permits@revision-test.test");
    }
  });

  it("lists the revision history on the cover: number, date, what changed, who", () => {
    const row = db.select().from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get()!;
    expect(text.pages[0]).toContain("REVISION HISTORY Rev Date What changed By");
    expect(text.pages[0]).toContain(`1 ${row.createdAt.slice(0, 10)} First issue ${designer.user.name}`);
  });

  it("prints the maximum PV voltage the engine computed", () => {
    const run = runChecks(getProjectRecord(designer, projectId).record);
    const figure = run.results.find((r) => r.checkId === "max-pv-voltage")?.values.find((v) => v.key === "maxVoltageV");
    expect(typeof figure?.value).toBe("number");
    expect(text.pages.join(" ")).toContain(`${formatNumber(figure!.value as number)} V`);
  });

  it("counts its pages as the sheets' pages plus the datasheet's", async () => {
    const row = db.select().from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get()!;
    const datasheetPages = text.pages.filter((p) => p.includes("Inverter-charger INV-1 datasheet page")).length;
    expect(datasheetPages).toBe(DATASHEET_PAGES);
    const sheetPages = text.pages.filter((p) => SHEET_PLAN.some((s) => p.includes(s.code)) && !p.includes("datasheet page")).length;
    expect(row.pageCount).toBe(sheetPages + DATASHEET_PAGES);
    expect((await PDFDocument.load(pdfBytes)).getPageCount()).toBe(row.pageCount);
  });

  it("records the SHA-256 of the PDF and the DOCX it stored, by that hash", async () => {
    const row = db.select().from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get()!;
    const pdfOnDisk = fs.readFileSync(path.join(packetsDir, row.pdfPath!));
    const docxOnDisk = fs.readFileSync(path.join(packetsDir, row.docxPath!));
    expect(createHash("sha256").update(pdfOnDisk).digest("hex")).toBe(row.pdfSha256);
    expect(createHash("sha256").update(docxOnDisk).digest("hex")).toBe(row.docxSha256);
    expect(row.pdfPath).toContain(row.pdfSha256!);
    const docx = await getRevisionFile(designer, revisionId, "docx", { packetsDir });
    expect(Buffer.from(docx.bytes.subarray(0, 2)).toString("latin1")).toBe("PK");
    expect(docx.fileName).toBe("tamarack-hut-test-copy-rev1.docx");
    expect(docx.contentType).toContain("wordprocessingml");
  });

  it("keeps the attachment ids it merged", () => {
    const row = db.select().from(packetRevisions).where(eq(packetRevisions.id, revisionId)).get()!;
    expect(row.attachmentIds).toHaveLength(1);
  });

  it("is not found from another organisation, by id, by file or by project", async () => {
    expect(await codeOf(() => getRevision(outsider, revisionId))).toBe("not-found");
    expect(await codeOf(() => getRevisionFile(outsider, revisionId, "pdf", { packetsDir }))).toBe("not-found");
    expect(await codeOf(() => listProjectRevisions(outsider, projectId))).toBe("not-found");
    expect(await codeOf(() => startRevision(outsider, projectId, { dispatch: noDispatch }))).toBe("not-found");
  });
});

describe("a failed generation", () => {
  it("names the step and the file, leaves no files, and its number is not reused", async () => {
    const id = project(designer, "Hut with a lost file");
    const upload = await uploadAttachment(designer, { projectId: id, kind: "datasheet", equipmentTag: "CC-1", fileName: "cc-1-datasheet.pdf", bytes: await datasheetPdf("Controller CC-1", 2) });
    const before = filesUnder(packetsDir);
    fs.rmSync(store.pathFor(`${upload.attachment.sha256.slice(0, 2)}/${upload.attachment.sha256}.pdf`));

    const started = startRevision(designer, id, { dispatch: noDispatch });
    const row = await generateRevisionArtifacts(db, started.revisionId, { packetsDir });
    expect(row.state).toBe("failed");
    expect(row.progressStep).toBe("datasheets");
    expect(row.error).toMatch(/^Step "datasheets": /);
    expect(row.error).toContain("cc-1-datasheet.pdf");
    expect([row.pdfPath, row.pdfSha256, row.docxPath, row.docxSha256, row.pageCount]).toEqual([null, null, null, null, null]);
    expect(filesUnder(packetsDir)).toEqual(before);
    expect(await codeOf(() => getRevisionFile(designer, started.revisionId, "pdf", { packetsDir }))).toBe("not-found");

    const next = startRevision(designer, id, { dispatch: noDispatch });
    expect(next.number).toBe(started.number + 1);
  }, 60_000);
});

describe("generation by the job worker", () => {
  it("queues the rendering as a job that a worker process picks up, while the caller carries on, and ends ready", async () => {
    const started = startRevision(designer, projectId);
    expect(getRevision(designer, started.revisionId).state).toBe("generating");
    const queued = db.select().from(jobs).where(eq(jobs.kind, "packet.generate")).all();
    expect(queued.map((j) => j.payload)).toContainEqual({ revisionId: started.revisionId });

    // The worker of `npm run worker`, on the same temporary database and folders (tsx as a loader, one process).
    const worker = spawn(process.execPath, ["--import", "tsx", path.resolve("scripts/worker.ts")], {
      env: { ...process.env, DATABASE_PATH: env.file, PACKETS_DIR: packetsDir, UPLOADS_DIR: uploadsDir, JOBS_BACKEND: "sqlite" },
      stdio: ["ignore", "ignore", "inherit"],
    });
    try {
      const seen = new Set<string>();
      let view = getRevision(designer, started.revisionId);
      for (let waited = 0; view.state === "generating" && waited < 110_000; waited += 250) {
        await new Promise((r) => setTimeout(r, 250));
        view = getRevision(designer, started.revisionId);
        seen.add(view.progressStep);
      }
      expect(view.error).toBeNull();
      expect(view).toMatchObject({ state: "ready", progressStep: "done" });
      expect(seen.size).toBeGreaterThan(1);
      const pdf = await getRevisionFile(designer, started.revisionId, "pdf", { packetsDir });
      expect(Buffer.from(pdf.bytes.subarray(0, 5)).toString("latin1")).toBe("%PDF-");
      expect(db.select().from(jobs).where(eq(jobs.id, queued.find((j) => (j.payload as { revisionId: string }).revisionId === started.revisionId)!.id)).get()).toMatchObject({ state: "done", attempts: 1 });
    } finally {
      worker.kill("SIGTERM");
    }
  }, 120_000);
});

describe("who may generate", () => {
  it.each([["reviewer"], ["office"], ["installer"], ["admin"]] as const)("refuses a %s", async (role) => {
    const ctx = makeContext(db, org.id, [role]);
    expect(await codeOf(() => startRevision(ctx, projectId, { dispatch: noDispatch }))).toBe("forbidden");
  });

  it("refuses a second generation while one is running, and closes one whose process was lost", async () => {
    const id = project(designer, "Hut generated twice");
    const first = startRevision(designer, id, { dispatch: noDispatch });
    expect(await codeOf(() => startRevision(designer, id, { dispatch: noDispatch }))).toBe("conflict");
    const later = new Date(Date.now() + 11 * 60 * 1000);
    const second = startRevision(designer, id, { dispatch: noDispatch, now: later });
    expect(second.number).toBe(first.number + 1);
    expect(getRevision(designer, first.revisionId)).toMatchObject({ state: "failed", error: 'Step "queued": the generation stopped without finishing.' });
  });
});
