import { describe, expect, it } from "vitest";
import { describeChange, designOf, diffResults, diffValues, groupChanges } from "../../../lib/record-diff";

const before = {
  name: "Hut",
  site: { address: "1 Lane", designLowTempC: -10 },
  circuits: [
    { tag: "C-1", size: "10" },
    { tag: "C-2", size: "10", conditions: { ambientC: 30 } },
  ],
  attachments: [{ kind: "datasheet", fileName: "controller.pdf", sha256: "a".repeat(64) }],
};

describe("record diff", () => {
  it("reads a conductor resize as one field of one circuit, old → new", () => {
    const after = { ...before, circuits: [before.circuits[0], { ...before.circuits[1], size: "8" }] };
    expect(diffValues(before, after).map(describeChange)).toEqual(["Circuit C-2 size: 10 → 8"]);
  });

  it("matches list items by tag, so a circuit inserted first does not read as every circuit changing", () => {
    const after = { ...before, circuits: [{ tag: "C-0", size: "6" }, ...before.circuits] };
    const changes = diffValues(before, after);
    expect(changes).toHaveLength(1);
    expect(changes[0]).toMatchObject({ group: "Circuit C-0", field: "", kind: "added" });
  });

  it("groups fields under their item and names attachments added and removed by file", () => {
    const after = {
      ...before,
      site: { ...before.site, designLowTempC: -12 },
      circuits: [before.circuits[0], { tag: "C-2", size: "8", conditions: { ambientC: 40 } }],
      attachments: [{ kind: "site-plan", fileName: "site.pdf", sha256: "b".repeat(64) }],
    };
    const groups = groupChanges(diffValues(before, after));
    expect(groups.map((g) => g.group)).toEqual(["Site", "Circuit C-2", "Attachment site.pdf", "Attachment controller.pdf"]);
    expect(groups[1]!.changes.map(describeChange)).toEqual(["Circuit C-2 size: 10 → 8", "Circuit C-2 conditions.ambientC: 30 → 40"]);
    expect(groups[2]!.changes[0]!.kind).toBe("added");
    expect(groups[3]!.changes[0]!.kind).toBe("removed");
  });

  it("finds nothing between equal records", () => {
    expect(diffValues(before, structuredClone(before))).toEqual([]);
  });

  it("an installer's photo is not part of the design an approval covers", () => {
    const withPhoto = { ...before, attachments: [...before.attachments, { kind: "photo", fileName: "label.jpg" }] };
    expect(diffValues(designOf(before), designOf(withPhoto))).toEqual([]);
    expect(diffValues(before, withPhoto)).toHaveLength(1);
  });
});

describe("check result diff", () => {
  const r = (id: string, status: string, values: [string, number][] = []) => ({
    id,
    title: id.split(":")[0]!,
    subject: id.split(":")[1] ?? null,
    status,
    values: values.map(([key, value]) => ({ key, label: key, value, unit: "A" })),
  });
  it("lists a result whose status changed with its changed figures, and leaves unchanged ones out", () => {
    const before = [r("ampacity:C-2", "fail", [["allowed", 30], ["required", 40]]), r("ampacity:C-1", "pass", [["allowed", 55]])];
    const after = [r("ampacity:C-2", "pass", [["allowed", 40], ["required", 40]]), r("ampacity:C-1", "pass", [["allowed", 55]])];
    expect(diffResults(before, after)).toEqual([
      { id: "ampacity:C-2", title: "ampacity", subject: "C-2", kind: "changed", statusBefore: "fail", statusAfter: "pass", values: [{ label: "allowed", before: "30 A", after: "40 A" }] },
    ]);
  });
  it("lists results that appear and disappear", () => {
    const changes = diffResults([r("vd:C-3", "pass")], [r("vd:C-4", "warning")]);
    expect(changes.map((c) => [c.id, c.kind])).toEqual([
      ["vd:C-4", "added"],
      ["vd:C-3", "removed"],
    ]);
  });
});
