import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { jurisdictions } from "../../db/schema";
import { loadTemplateSource } from "../../lib/packet/templates";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import { ServiceError } from "../../lib/services/errors";
import { getJurisdiction } from "../../lib/services/jurisdictions/get";
import { listSheetTemplates, previewSheetTemplate, saveSheetTemplate } from "../../lib/services/jurisdictions/templates";
import { createProject } from "../../lib/services/projects/create";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { generateRevisionArtifacts, getRevisionFile, startRevision } from "../../lib/services/revisions";
import { readPdfText } from "../unit/packet/pdf-text";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
const packetsDir = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-templates-"));
afterAll(() => {
  env.cleanup();
  fs.rmSync(packetsDir, { recursive: true, force: true });
});

async function refusal(fn: () => unknown): Promise<ServiceError> {
  try {
    await fn();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

const org = makeOrg(db);
const office = makeContext(db, org.id, ["office"]);
const designer = makeContext(db, org.id, ["designer"]);
const outsider = makeContext(db, makeOrg(db).id, ["office"]);
const jurisdiction = makeJurisdiction(db, org.id, "2020");
const version = () => getJurisdiction(office, jurisdiction.id).version;
const NOTE = "Quarry Hollow building division asks for the battery room door to be labelled from the hallway side.";
const shipped = loadTemplateSource("general-notes");
const good = `${shipped}\n${NOTE}\n`;

describe("jurisdiction sheet templates", () => {
  it("lists every sheet template, cover and general notes first, none overridden at first", () => {
    const list = listSheetTemplates(office, jurisdiction.id);
    expect(list.slice(0, 2).map((t) => t.name)).toEqual(["cover", "general-notes"]);
    expect(list.every((t) => !t.overridden && t.source === t.shippedSource)).toBe(true);
    expect(list.find((t) => t.name === "schedules")?.sheets.map((s) => s.code)).toEqual(["E-004", "E-005"]);
  });

  it("refuses an unknown variable with its line and name, and saves nothing", async () => {
    const before = version();
    const source = "# General notes\n1. Per {{jurisdiction.name}}.\n2. Client {{project.clientName}} signs here.\n";
    const error = await refusal(() => saveSheetTemplate(office, jurisdiction.id, "general-notes", source, before));
    expect(error.code).toBe("invalid");
    expect(error.message).toContain("Line 3");
    expect(error.message).toContain("project.clientName");
    expect(error.issues).toContainEqual({ path: "variable", message: "project.clientName" });
    expect(version()).toBe(before);
    expect(db.select().from(jurisdictions).where(eq(jurisdictions.id, jurisdiction.id)).get()!.templateOverrides).toEqual({});
  });

  it("refuses a syntax error with its line", async () => {
    const error = await refusal(() => saveSheetTemplate(office, jurisdiction.id, "cover", "# Cover\n{{#if flags.hasPv}}\nPV\n", version()));
    expect(error.code).toBe("invalid");
    expect(error.message).toMatch(/^Line \d+: syntax error/);
  });

  it("saves a good override, refuses a stale save, and clears it again with a blank source", async () => {
    const v = version();
    expect(saveSheetTemplate(office, jurisdiction.id, "general-notes", good, v)).toEqual({ version: v + 1, overridden: true });
    expect(listSheetTemplates(office, jurisdiction.id).find((t) => t.name === "general-notes")).toMatchObject({ overridden: true, source: good });
    expect((await refusal(() => saveSheetTemplate(office, jurisdiction.id, "general-notes", shipped, v))).code).toBe("conflict");
    saveSheetTemplate(office, jurisdiction.id, "general-notes", "  ", v + 1);
    expect(listSheetTemplates(office, jurisdiction.id).find((t) => t.name === "general-notes")?.overridden).toBe(false);
  });

  it("lets only the office edit, and hides another organisation's jurisdiction", async () => {
    expect((await refusal(() => saveSheetTemplate(designer, jurisdiction.id, "general-notes", good, version()))).code).toBe("forbidden");
    expect((await refusal(() => saveSheetTemplate(outsider, jurisdiction.id, "general-notes", good, version()))).code).toBe("not-found");
    expect((await refusal(() => listSheetTemplates(outsider, jurisdiction.id))).code).toBe("not-found");
    expect((await refusal(() => saveSheetTemplate(office, jurisdiction.id, "no-such-sheet", good, version()))).code).toBe("not-found");
  });
});

describe("the override in a packet", () => {
  const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/market-stall.json", "utf8")));
  const { id: projectId } = createProject(designer, { name: record.name, client: record.client, systemKind: record.systemKind, jurisdictionId: jurisdiction.id, address: record.site.address });
  saveProjectRecord(designer, projectId, record, getProjectRecord(designer, projectId).version);

  it("previews the sheet as one PDF page carrying the new wording, and refuses a bad one with its line", async () => {
    const preview = await previewSheetTemplate(office, jurisdiction.id, "general-notes", good);
    expect(preview.ok).toBe(true);
    if (!preview.ok) return;
    const text = await readPdfText(new Uint8Array(Buffer.from(preview.pdfBase64, "base64")));
    expect(text.pages).toHaveLength(1);
    expect(text.pages[0]).toContain("G-002");
    expect(text.pages[0]).toContain(NOTE);
    const bad = await previewSheetTemplate(office, jurisdiction.id, "general-notes", "# Notes\n{{nope}}\n");
    expect(bad).toMatchObject({ ok: false, line: 2, name: "nope" });
  }, 60_000);

  it("prints a saved override in the next generated packet", async () => {
    saveSheetTemplate(office, jurisdiction.id, "general-notes", good, version());
    const started = startRevision(designer, projectId, { dispatch: () => undefined });
    const row = await generateRevisionArtifacts(db, started.revisionId, { packetsDir });
    expect(row.state).toBe("ready");
    const pdf = await getRevisionFile(designer, started.revisionId, "pdf", { packetsDir });
    const text = await readPdfText(pdf.bytes);
    expect(text.pages.find((p) => p.startsWith("G-002"))).toContain(NOTE);
  }, 60_000);
});
