import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { parseProjectFile, runChecks } from "../../../lib/compliance";
import { requiredLabels } from "../../../lib/compliance/labels";
import { missingDocuments as packetMissing } from "../../../lib/packet/model";
import { missingDocuments as preflightMissing } from "../../../lib/services/revisions/documents";

function example(file: string) {
  const parsed = parseProjectFile(JSON.parse(fs.readFileSync(`examples/${file}`, "utf8")));
  if (!parsed.ok) throw new Error(file);
  return parsed.record;
}

describe("missing documents say the same in the check, the preflight and the packet cover", () => {
  it.each(["ferncliff-farmhouse.json", "tamarack-hut.json", "market-stall.json"])("%s with nothing attached", (file) => {
    const record = { ...example(file), attachments: [] };
    const run = runChecks(record);
    const check = run.results.find((r) => r.checkId === "submittal-completeness")!;
    const preflight = preflightMissing(record, [], record.jurisdiction.requiredDocuments);
    const cover = packetMissing({
      record,
      run,
      labels: requiredLabels(record),
      revision: { number: 1, createdAt: "2026-01-01T00:00:00Z", preparedBy: "x", organisation: "y" },
      datasheets: [],
    });
    expect(preflight.length).toBeGreaterThan(0);
    expect(cover).toEqual(preflight);
    expect(check.status).toBe("fail");
    expect(check.reason).toBe(preflight.join("; "));
  });

  it("asks a roof mount, not a ground mount, for the structural letter (the farmhouse is on a roof)", () => {
    const roof = { ...example("ferncliff-farmhouse.json"), attachments: [] };
    expect(preflightMissing(roof, [], ["structural-letter"])).toEqual(["no structural letter for the roof mount"]);
    const ground = { ...roof, site: { ...roof.site, mounting: "ground" as const } };
    expect(preflightMissing(ground, [], ["structural-letter"])).toEqual([]);
  });

  it("names each battery without its listing; a listing counts only when linked to that battery", () => {
    const record = example("ferncliff-farmhouse.json");
    const batteries = record.equipment.filter((e) => e.kind === "battery").map((e) => `no storage listing for ${e.tag}`);
    expect(batteries.length).toBeGreaterThan(0);
    expect(preflightMissing(record, [], ["storage-listing"])).toEqual(batteries);
    // Filed against nothing, or against the inverter, it shows no reviewer which battery is listed.
    expect(preflightMissing(record, [{ kind: "storage-listing", equipmentTag: null } as never], ["storage-listing"])).toEqual(batteries);
    expect(preflightMissing(record, [{ kind: "storage-listing", equipmentTag: "INV-1" } as never], ["storage-listing"])).toEqual(batteries);
    expect(preflightMissing(record, [{ kind: "storage-listing", equipmentTag: "BAT-1" } as never], ["storage-listing"])).toEqual([]);
  });
});
