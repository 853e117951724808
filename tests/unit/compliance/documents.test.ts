import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { parseProjectFile, runChecks } from "../../../lib/compliance";
import { documentChecklist } from "../../../lib/compliance/documents";
import { requiredLabels } from "../../../lib/compliance/labels";
import { packetDraftReasons } from "../../../lib/packet/draft";
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

  it("lists on the attachments page exactly the items the check counts: a listing filed for one battery leaves the other's open", () => {
    const record = example("ferncliff-farmhouse.json");
    const batteries = record.equipment.filter((e) => e.kind === "battery");
    const [first] = batteries;
    const docs = [{ kind: "storage-listing", equipmentTag: first!.tag }];
    const items = documentChecklist(record, docs, ["storage-listing"]);
    expect(items.map((i) => i.tag)).toEqual(batteries.map((b) => b.tag));
    expect(items.filter((i) => !i.attached).map((i) => i.missing)).toEqual(preflightMissing(record, docs as never, ["storage-listing"]));
    if (batteries.length > 1) expect(items.filter((i) => !i.attached).length).toBe(batteries.length - 1);
  });
});

describe("the draft verdict is one rule for the preflight and the packet cover", () => {
  it("is a draft while a check fails or needs input, a label cannot print or a document is missing, and says so in counted words", () => {
    const record = { ...example("tamarack-hut.json"), attachments: [] };
    const run = runChecks(record);
    const labels = requiredLabels(record);
    const missing = preflightMissing(record, [], record.jurisdiction.requiredDocuments);
    const reasons = packetDraftReasons(record, run, labels, missing);
    if (run.counts.fail) expect(reasons).toContain(`${run.counts.fail} check${run.counts.fail === 1 ? " fails" : "s fail"}`);
    for (const m of missing) expect(reasons).toContain(m);
    const clean = { ...run, counts: { ...run.counts, fail: 0, "needs-input": 0 } };
    const printable = labels.map((l) => ({ ...l, missing: [] }));
    expect(packetDraftReasons(record, clean, printable, [])).toEqual([]);
    expect(packetDraftReasons(record, { counts: { ...clean.counts, "needs-input": 2 } }, printable, [])).toEqual(["2 checks need input"]);
    expect(packetDraftReasons(record, clean, [{ ...printable[0]!, lines: [] }], [])).toEqual([`label ${printable[0]!.id} (${printable[0]!.title}) has no wording`]);
  });
});
