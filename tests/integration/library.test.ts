import fs from "node:fs";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { auditLog, equipmentLibrary } from "../../db/schema";
import { ServiceError } from "../../lib/services/errors";
import { createLibraryItem } from "../../lib/services/library/create";
import { getLibraryItem } from "../../lib/services/library/get";
import { importLibraryCsv } from "../../lib/services/library/import-csv";
import { listLibraryItems } from "../../lib/services/library/list";
import { restoreLibraryItem } from "../../lib/services/library/restore";
import { retireLibraryItem } from "../../lib/services/library/retire";
import { updateLibraryItem } from "../../lib/services/library/update";
import { makeContext, makeOrg, tempDatabase, codeOf } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());


const MODULE = {
  kind: "pv-module",
  manufacturer: "Brightfell",
  model: "BF-540H",
  listing: "UL 61730",
  pmaxW: 540,
  vocV: 49.5,
  iscA: 13.85,
  tempCoeffVocPctPerC: -0.27,
};

describe("equipment library services", () => {
  const orgA = makeOrg(db);
  const orgB = makeOrg(db);
  const designerA = makeContext(db, orgA.id, ["designer"]);
  const reviewerA = makeContext(db, orgA.id, ["reviewer"]);
  const installerA = makeContext(db, orgA.id, ["installer"]);
  const designerB = makeContext(db, orgB.id, ["designer"]);

  it("creates an item, serves it with its ratings, and writes the audit row", () => {
    const item = createLibraryItem(designerA, MODULE);
    expect(item).toMatchObject({ kind: "pv-module", manufacturer: "Brightfell", model: "BF-540H", retiredAt: null, version: 1 });
    expect(item.ratings).toMatchObject({ vocV: 49.5, iscA: 13.85, listing: "UL 61730" });
    expect(item.ratings).not.toHaveProperty("kind");
    expect(getLibraryItem(reviewerA, item.id)).toEqual(item);
    const rows = db.select().from(auditLog).where(and(eq(auditLog.entityId, item.id), eq(auditLog.action, "library.created"))).all();
    expect(rows).toHaveLength(1);
  });

  it("refuses an invalid rating with the field and the allowed range, and stores nothing", () => {
    const before = listLibraryItems(designerA, { includeRetired: true }).length;
    let issues: { path: string; message: string }[] = [];
    try {
      createLibraryItem(designerA, { ...MODULE, model: "BF-999", vocV: 200 });
    } catch (error) {
      if (error instanceof ServiceError) issues = error.issues;
    }
    expect(issues).toEqual([{ path: "vocV", message: "must be between 0.5 and 150 V" }]);
    expect(listLibraryItems(designerA, { includeRetired: true })).toHaveLength(before);
  });

  it("refuses the same maker and model twice", () => {
    expect(codeOf(() => createLibraryItem(designerA, { ...MODULE, model: " bf-540h " }))).toBe("conflict");
  });

  it("keeps another organisation's item out of sight: not found, not listed, not changeable", () => {
    const mine = createLibraryItem(designerA, { ...MODULE, model: "BF-410M" });
    expect(codeOf(() => getLibraryItem(designerB, mine.id))).toBe("not-found");
    expect(codeOf(() => updateLibraryItem(designerB, mine.id, { ...MODULE, model: "Taken" }, mine.version))).toBe("not-found");
    expect(codeOf(() => retireLibraryItem(designerB, mine.id))).toBe("not-found");
    expect(listLibraryItems(designerB, { includeRetired: true }).map((i) => i.id)).not.toContain(mine.id);
    // Organisation B may hold the same model independently.
    expect(createLibraryItem(designerB, MODULE).id).not.toBe(mine.id);
    expect(getLibraryItem(designerA, mine.id).model).toBe("BF-410M");
  });

  it("refuses the wrong role: reading needs library:read, writing needs library:edit", () => {
    expect(codeOf(() => listLibraryItems(installerA))).toBe("forbidden");
    expect(codeOf(() => createLibraryItem(reviewerA, { ...MODULE, model: "R-1" }))).toBe("forbidden");
    const item = listLibraryItems(reviewerA)[0]!;
    expect(codeOf(() => updateLibraryItem(reviewerA, item.id, { ...MODULE, model: "R-2" }, item.version))).toBe("forbidden");
    expect(codeOf(() => retireLibraryItem(reviewerA, item.id))).toBe("forbidden");
    expect(codeOf(() => importLibraryCsv(reviewerA, "kind,manufacturer,model\n"))).toBe("forbidden");
  });

  it("refuses a stale version and leaves the item as the other person saved it", () => {
    const item = createLibraryItem(designerA, { ...MODULE, model: "BF-400T" });
    const otherDesigner = makeContext(db, orgA.id, ["designer"]);
    const saved = updateLibraryItem(otherDesigner, item.id, { ...MODULE, model: "BF-400T", vocV: 48.6 }, item.version);
    expect(saved.version).toBe(item.version + 1);
    expect(codeOf(() => updateLibraryItem(designerA, item.id, { ...MODULE, model: "BF-400T", vocV: 40 }, item.version))).toBe("conflict");
    expect(getLibraryItem(designerA, item.id).ratings.vocV).toBe(48.6);
  });

  it("refuses changing an item's kind", () => {
    const item = createLibraryItem(designerA, { ...MODULE, model: "BF-KIND" });
    expect(codeOf(() => updateLibraryItem(designerA, item.id, { kind: "battery", manufacturer: "Brightfell", model: "BF-KIND" }, item.version))).toBe("invalid");
  });

  it("retires an item out of the picker but keeps it readable, and restores it", () => {
    const item = createLibraryItem(designerA, { ...MODULE, model: "BF-OLD" });
    const retired = retireLibraryItem(designerA, item.id, item.version);
    expect(retired.retiredAt).not.toBeNull();
    expect(listLibraryItems(designerA, { kind: "pv-module" }).map((i) => i.id)).not.toContain(item.id);
    expect(listLibraryItems(designerA, { kind: "pv-module", includeRetired: true }).map((i) => i.id)).toContain(item.id);
    expect(getLibraryItem(reviewerA, item.id).ratings.vocV).toBe(49.5);
    expect(codeOf(() => retireLibraryItem(designerA, item.id, item.version))).toBeUndefined(); // already retired: no change
    const back = restoreLibraryItem(designerA, item.id, retired.version);
    expect(back.retiredAt).toBeNull();
    expect(listLibraryItems(designerA, { kind: "pv-module" }).map((i) => i.id)).toContain(item.id);
  });

  it("filters by kind, or several kinds, and refuses an unknown kind", () => {
    expect(listLibraryItems(designerA, { kind: "battery" })).toEqual([]);
    createLibraryItem(designerA, { kind: "battery", manufacturer: "Ostin Cells", model: "OC-12100", capacityKWh: 1.28 });
    const kinds = listLibraryItems(designerA, { kind: "battery, pv-module" }).map((i) => i.kind);
    expect(new Set(kinds)).toEqual(new Set(["battery", "pv-module"]));
    expect(kinds.length).toBe(listLibraryItems(designerA).length);
    expect(codeOf(() => listLibraryItems(designerA, { kind: "battery,solar-panel" }))).toBe("invalid");
    expect(codeOf(() => listLibraryItems(designerA, { kind: "solar-panel" }))).toBe("invalid");
  });
});

describe("CSV import into the library", () => {
  const org = makeOrg(db);
  const designer = makeContext(db, org.id, ["designer"]);
  const example = fs.readFileSync(path.join(__dirname, "../../examples/equipment-library.csv"), "utf8");

  it("imports the example file whole, scoped to the organisation, with one audit row", () => {
    const report = importLibraryCsv(designer, example);
    expect(report.refused).toEqual([]);
    expect(report.taken.length).toBe(report.rowsRead);
    const stored = db.select().from(equipmentLibrary).where(eq(equipmentLibrary.orgId, org.id)).all();
    expect(stored).toHaveLength(report.taken.length);
    const audits = db.select().from(auditLog).where(and(eq(auditLog.orgId, org.id), eq(auditLog.action, "library.imported"))).all();
    expect(audits).toHaveLength(1);
  });

  it("refuses rows already in the library on a second import, adding nothing", () => {
    const before = listLibraryItems(designer).length;
    const report = importLibraryCsv(designer, example);
    expect(report.taken).toEqual([]);
    expect(report.refused[0]?.problems[0]?.text).toMatch(/^row 2, model: already in the library/);
    expect(listLibraryItems(designer)).toHaveLength(before);
  });

  it("takes the good rows and reports the bad one by row and column", () => {
    const csv = [
      "kind,manufacturer,model,vocV,iscA",
      "pv-module,Brightfell,BF-NEW-1,49.5,13.8",
      "pv-module,Brightfell,BF-NEW-2,49.5 V,13.8",
      "pv-module,Brightfell,BF-NEW-3,41.2,11.1",
      "pv-module,Brightfell,BF-NEW-1,49.5,13.8",
    ].join("\n");
    const report = importLibraryCsv(designer, csv);
    expect(report.taken.map((t) => t.row)).toEqual([2, 4]);
    expect(report.refused.map((r) => r.problems.map((p) => p.text))).toEqual([
      ["row 3, vocV: write the number only, in volts"],
      ["row 5, model: the same item as row 2"],
    ]);
    const models = listLibraryItems(designer, { kind: "pv-module" }).map((i) => i.model);
    expect(models).toContain("BF-NEW-1");
    expect(models).toContain("BF-NEW-3");
    expect(models).not.toContain("BF-NEW-2");
  });

  it("refuses a file with missing columns whole, naming them, and adds nothing", () => {
    const before = listLibraryItems(designer).length;
    let error: ServiceError | undefined;
    try {
      importLibraryCsv(designer, "manufacturer,vocV\nBrightfell,49.5\n");
    } catch (e) {
      if (e instanceof ServiceError) error = e;
    }
    expect(error?.code).toBe("invalid");
    expect(error?.issues.map((i) => i.path)).toEqual(["kind", "model"]);
    expect(listLibraryItems(designer)).toHaveLength(before);
  });
});
