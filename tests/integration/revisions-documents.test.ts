import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import { documentTitle, missingDocuments, selectPacketDocuments, type DocumentRef } from "../../lib/services/revisions/documents";

/** The farmhouse example: roof-mounted, hybrid inverter, battery, generator, rapid shutdown. */
const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/ferncliff-farmhouse.json", "utf8")));
const ALL = ["equipment-datasheets", "storage-listing", "site-plan", "structural-letter"] as const;

let n = 0;
function doc(kind: string, equipmentTag: string | null, mimeType = "application/pdf"): DocumentRef {
  n += 1;
  return { id: `a${n}`, kind, equipmentTag, fileName: `${kind}-${equipmentTag ?? "x"}-${n}.pdf`, mimeType, createdAt: `2026-11-0${(n % 9) + 1}T10:00:00.000Z` };
}

describe("the documents a packet carries", () => {
  it("merges the site plan first, then datasheets in the equipment schedule's order, then listings and letters; images are not merged", () => {
    const battery = doc("datasheet", "BAT-1");
    const module = doc("datasheet", "MOD-1");
    const letter = doc("structural-letter", null);
    const listing = doc("storage-listing", "BAT-1");
    const photo = doc("photo", null, "image/jpeg");
    const plan = doc("site-plan", null, "image/png");
    const inverter = doc("datasheet", "INV-1");
    const picked = selectPacketDocuments(record, [battery, module, letter, listing, photo, plan, inverter]);
    expect(picked.sitePlan?.id).toBe(plan.id);
    // examples/ferncliff-farmhouse.json lists MOD-1, INV-1, BAT-1 in that order.
    expect(picked.merged.map((d) => d.id)).toEqual([module.id, inverter.id, battery.id, listing.id, letter.id]);
    expect(picked.attachmentIds).toEqual([plan.id, module.id, inverter.id, battery.id, listing.id, letter.id]);
  });

  it("takes the newest of several site plans", () => {
    const older = { ...doc("site-plan", null), createdAt: "2026-10-01T00:00:00.000Z" };
    const newer = { ...doc("site-plan", null), createdAt: "2026-11-20T00:00:00.000Z" };
    expect(selectPacketDocuments(record, [newer, older]).sitePlan?.id).toBe(newer.id);
  });

  it("names every missing document, per equipment tag", () => {
    expect(missingDocuments(record, [], ALL)).toEqual([
      "no datasheet for MOD-1",
      "no datasheet for INV-1",
      "no datasheet for BAT-1",
      "no datasheet for GEN-1",
      "no datasheet for RSD-1",
      "no storage listing for BAT-1",
      "no site plan",
      "no structural letter for the roof mount",
    ]);
  });

  it("counts a listing only for the battery it is linked to, and asks for nothing the jurisdiction does not require", () => {
    expect(missingDocuments(record, [doc("storage-listing", null)], ["storage-listing"])).toContain("no storage listing for BAT-1");
    const missing = missingDocuments(record, [doc("storage-listing", "BAT-1"), doc("datasheet", "INV-1")], ["equipment-datasheets", "storage-listing"]);
    expect(missing).not.toContain("no storage listing for BAT-1");
    expect(missing).not.toContain("no datasheet for INV-1");
    expect(missing).not.toContain("no site plan");
    expect(missingDocuments(record, [], [])).toEqual([]);
  });

  it("asks for a structural letter only for a roof mount", () => {
    const ground = { ...record, site: { ...record.site, mounting: "ground" as const } };
    expect(missingDocuments(ground, [], ["structural-letter"])).toEqual([]);
  });

  it("titles a datasheet by its equipment's make and model, a listing so the index reads as one", () => {
    const inverter = record.equipment.find((e) => e.tag === "INV-1")!;
    expect(documentTitle(record, { kind: "datasheet", equipmentTag: "INV-1", fileName: "x.pdf" })).toBe(`${inverter.manufacturer} ${inverter.model} datasheet`);
    expect(documentTitle(record, { kind: "storage-listing", equipmentTag: null, fileName: "ul.pdf" })).toBe("Storage listing, ul.pdf");
  });
});
