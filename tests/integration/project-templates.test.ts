import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { demoTemplates } from "../../db/demo-templates";
import { projects, projectTemplates } from "../../db/schema";
import { runChecks } from "../../lib/compliance";
import { createProject } from "../../lib/services/projects/create";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { listTemplates } from "../../lib/services/templates/list";
import { createTemplate, deleteTemplate, renameTemplate, saveTemplateFromProject } from "../../lib/services/templates/save";
import { codeOf, makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const org = makeOrg(db);
const designer = makeContext(db, org.id, ["designer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const jurisdiction = makeJurisdiction(db, org.id, "2020");
const ids = demoTemplates().map((t) => createTemplate(designer, t).id);
const projectCount = () => db.select().from(projects).where(eq(projects.orgId, org.id)).all().length;

describe("project templates", () => {
  it("holds the firm's three standard kits, listed by name", () => {
    const listed = listTemplates(designer);
    expect(listed.map((t) => t.systemKind).sort()).toEqual(["hybrid", "stand-alone", "stand-alone-generator"]);
    const hybrid = listed.find((t) => t.systemKind === "hybrid")!;
    expect(hybrid.circuitCount).toBe(5);
  });

  it("a project from the cabin template has the kit's equipment and topology and only the site to enter", () => {
    const cabin = listTemplates(designer).find((t) => t.systemKind === "stand-alone-generator")!;
    const { id } = createProject(designer, { name: "Lakeside cabin", systemKind: "stand-alone", jurisdictionId: jurisdiction.id, address: "12 Reed Lane", templateId: cabin.id });
    const { record } = getProjectRecord(designer, id);
    // The kind comes from the template, not from the form's default.
    expect(record.systemKind).toBe("stand-alone-generator");
    expect(record.site.address).toBe("12 Reed Lane");
    expect(record.jurisdiction.necEdition).toBe("2020");
    expect(record.equipment.map((e) => e.tag)).toEqual(["MOD-1", "CC-1", "BAT-1", "INV-1", "GEN-1", "P-1", "CB-1", "F-1", "CB-2", "CB-3"]);
    expect(record.circuits.map((c) => `${c.fromTag}>${c.toTag}`)).toEqual(["PV-1>CC-1", "CC-1>BAT-1", "BAT-1>INV-1", "GEN-1>INV-1", "INV-1>P-1"]);
    // Lengths and design temperatures belong to the site: a missing one is asked for, never passed.
    expect(record.circuits.every((c) => c.lengthFt === undefined)).toBe(true);
    const run = runChecks(record);
    const asked = run.results.filter((r) => r.status === "needs-input").flatMap((r) => r.missing);
    expect(asked).toContain("circuits.0.lengthFt");
    expect(asked).toContain("site.designLowTempC");
    expect(run.results.some((r) => r.status === "pass" && /voltage drop/i.test(r.title ?? ""))).toBe(false);
  });

  it("saves a project's design as a new template, without its site, and can replace an existing one", () => {
    const { id } = createProject(designer, { name: "Stall two", systemKind: "stand-alone", jurisdictionId: jurisdiction.id, address: "Stall 9", templateId: ids[0] });
    const stored = getProjectRecord(designer, id);
    saveProjectRecord(designer, id, { ...stored.record, site: { ...stored.record.site, designLowTempC: -12 }, equipment: stored.record.equipment.map((e) => (e.tag === "BAT-1" ? { ...e, quantity: 4 } : e)) }, stored.version);
    const saved = saveTemplateFromProject(designer, id, { name: "Stall with four batteries" });
    const row = db.select().from(projectTemplates).where(eq(projectTemplates.id, saved.id)).get()!;
    expect(row.design.equipment.find((e) => e.tag === "BAT-1")?.quantity).toBe(4);
    expect(JSON.stringify(row.design)).not.toContain("Stall 9");
    expect(row.design).not.toHaveProperty("site");

    const replaced = saveTemplateFromProject(designer, id, { replaceTemplateId: ids[0] });
    expect(replaced).toEqual({ id: ids[0], replaced: true });
    const kit = db.select().from(projectTemplates).where(eq(projectTemplates.id, ids[0]!)).get()!;
    expect(kit.design.equipment.find((e) => e.tag === "BAT-1")?.quantity).toBe(4);
    expect(kit.version).toBe(2);
  });

  it("renames with the version read; a stale rename is refused and changes nothing", () => {
    const before = listTemplates(designer).find((t) => t.id === ids[2])!;
    renameTemplate(designer, ids[2]!, { name: "Farm hybrid" }, before.version);
    expect(codeOf(() => renameTemplate(designer, ids[2]!, { name: "Other name" }, before.version))).toBe("conflict");
    expect(codeOf(() => renameTemplate(designer, ids[2]!, { name: "  " }, before.version + 1))).toBe("invalid");
    expect(listTemplates(designer).find((t) => t.id === ids[2])!.name).toBe("Farm hybrid");
  });

  it("refuses a design whose circuit ends at equipment that does not exist, naming the field", () => {
    const design = demoTemplates()[1]!.design;
    const broken = { ...design, circuits: design.circuits.map((c, i) => (i === 0 ? { ...c, toTag: "CC-9" } : c)) };
    const before = listTemplates(designer).length;
    let issues: { path: string }[] = [];
    try {
      createTemplate(designer, { name: "Broken", design: broken });
    } catch (error) {
      issues = (error as { issues: { path: string }[] }).issues;
    }
    expect(issues.map((i) => i.path)).toContain("circuits.0.toTag");
    expect(listTemplates(designer)).toHaveLength(before);
  });

  it("keeps templates to their organisation and to designers", () => {
    const other = makeOrg(db);
    const outsider = makeContext(db, other.id, ["designer"]);
    const otherJurisdiction = makeJurisdiction(db, other.id);
    expect(listTemplates(outsider)).toEqual([]);
    const before = projectCount();
    expect(codeOf(() => createProject(outsider, { name: "X", systemKind: "stand-alone", jurisdictionId: otherJurisdiction.id, templateId: ids[1] }))).toBe("not-found");
    expect(codeOf(() => deleteTemplate(outsider, ids[1]!))).toBe("not-found");
    expect(codeOf(() => createTemplate(reviewer, demoTemplates()[0]!))).toBe("forbidden");
    expect(codeOf(() => deleteTemplate(reviewer, ids[1]!))).toBe("forbidden");
    expect(projectCount()).toBe(before);
    deleteTemplate(designer, ids[1]!);
    expect(listTemplates(designer).some((t) => t.id === ids[1])).toBe(false);
  });
});
