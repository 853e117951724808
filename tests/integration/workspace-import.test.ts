import fs from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { auditLog, circuits, jurisdictions, projects } from "../../db/schema";
import { parseProjectFile } from "../../lib/compliance";
import { ServiceError } from "../../lib/services/errors";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { importProject } from "../../lib/services/projects/import";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const example = (name: string) => JSON.parse(fs.readFileSync(path.join(__dirname, "../../examples", name), "utf8")) as Record<string, unknown>;

function refusal(fn: () => unknown): ServiceError {
  try {
    fn();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

const projectCount = (orgId: string) => db.select().from(projects).where(eq(projects.orgId, orgId)).all().length;

describe("importing a project file", () => {
  const org = makeOrg(db);
  const designer = makeContext(db, org.id, ["designer"]);
  const reviewer = makeContext(db, org.id, ["reviewer"]);

  it.each(["tamarack-hut.json", "ferncliff-farmhouse.json", "market-stall.json"])(
    "creates a project whose record equals the file (%s), in the jurisdiction of the same name",
    (file) => {
      const json = example(file);
      const expected = parseProjectFile(json);
      if (!expected.ok) throw new Error(`example ${file} does not parse`);
      const jurisdiction = makeJurisdiction(db, org.id, expected.record.jurisdiction.necEdition);
      // The organisation's jurisdiction carries the file's name and rules, so the stored record reads back the same.
      db.update(jurisdictions)
        .set({
          name: expected.record.jurisdiction.name.toUpperCase(),
          residentialCode: expected.record.jurisdiction.residentialCode,
          voltageDropLimitPct: expected.record.jurisdiction.voltageDropLimitPct ?? null,
          storageAggregateLimitKWh: expected.record.jurisdiction.storageAggregateLimitKWh ?? null,
          requiredDocuments: expected.record.jurisdiction.requiredDocuments,
        })
        .where(eq(jurisdictions.id, jurisdiction.id))
        .run();
      const result = importProject(designer, json);
      expect(result.jurisdictionId).toBe(jurisdiction.id);
      const stored = getProjectRecord(designer, result.id);
      expect(stored.version).toBe(1);
      const strip = (r: typeof expected.record) => ({
        ...r,
        jurisdiction: { ...r.jurisdiction, name: r.jurisdiction.name.toLowerCase() },
        // Attachment entries name documents the file does not carry; they are not imported.
        attachments: [],
      });
      expect(strip(stored.record)).toEqual(strip(expected.record));
      expect(result.attachmentsNotImported).toBe(expected.record.attachments.length);
      const audited = db.select().from(auditLog).where(eq(auditLog.entityId, result.id)).all();
      expect(audited.map((a) => a.action)).toContain("project.imported");
    },
  );

  it("refuses an invalid file field by field and creates nothing", () => {
    const json = example("tamarack-hut.json");
    const site = json.site as Record<string, unknown>;
    site.designLowTempC = -80;
    const circuitRows = json.circuits as Record<string, unknown>[];
    circuitRows[0]!.lengthFt = -5;
    circuitRows[1]!.toTag = circuitRows[1]!.fromTag;
    const before = projectCount(org.id);
    const circuitsBefore = db.select().from(circuits).all().length;
    const error = refusal(() => importProject(designer, json));
    expect(error.code).toBe("invalid");
    const paths = error.issues.map((i) => i.path);
    expect(paths).toContain("site.designLowTempC");
    expect(paths).toContain("circuits.0.lengthFt");
    expect(error.issues.find((i) => i.path === "site.designLowTempC")?.message).toMatch(/between -60 and 70 °C/);
    expect(projectCount(org.id)).toBe(before);
    expect(db.select().from(circuits).all().length).toBe(circuitsBefore);
  });

  it("refuses a file that is not a project file at all", () => {
    const before = projectCount(org.id);
    expect(refusal(() => importProject(designer, { hello: "world" })).code).toBe("invalid");
    expect(refusal(() => importProject(designer, "not json")).code).toBe("invalid");
    expect(projectCount(org.id)).toBe(before);
  });

  it("asks for a jurisdiction when none has the file's name, and takes the one chosen", () => {
    const json = example("market-stall.json");
    (json.jurisdiction as Record<string, unknown>).name = "Nowhere Township";
    const before = projectCount(org.id);
    const error = refusal(() => importProject(designer, json));
    expect(error.code).toBe("invalid");
    expect(error.issues).toEqual([expect.objectContaining({ path: "jurisdiction" })]);
    expect(projectCount(org.id)).toBe(before);
    const chosen = makeJurisdiction(db, org.id, "2020");
    const result = importProject(designer, json, chosen.id);
    expect(result.jurisdictionId).toBe(chosen.id);
    expect(projectCount(org.id)).toBe(before + 1);
  });

  it("refuses another organisation's jurisdiction as not found", () => {
    const otherOrg = makeOrg(db);
    const foreign = makeJurisdiction(db, otherOrg.id);
    expect(refusal(() => importProject(designer, example("market-stall.json"), foreign.id)).code).toBe("not-found");
  });

  it("refuses the wrong role", () => {
    expect(refusal(() => importProject(reviewer, example("market-stall.json"))).code).toBe("forbidden");
  });
});
