/**
 * Renaming a tag follows it everywhere it is used; deleting an item can name
 * every field that points at it first, and remove or re-point them.
 */
import { describe, expect, it } from "vitest";
import { referrersOf, repointReferences } from "../../../components/workspace/record-refs";

const record = {
  equipment: [
    { tag: "MOD-1", kind: "pv-module" },
    { tag: "CC-1", kind: "charge-controller" },
    { tag: "DS-1", kind: "disconnect" },
    { tag: "DS-2", kind: "disconnect" },
  ],
  arrays: [{ tag: "PV-1", moduleTag: "MOD-1", feedsTag: "CC-1" }],
  circuits: [
    { tag: "C-1", fromTag: "PV-1", toTag: "CC-1", arrayTag: "PV-1", disconnectTags: ["DS-1"] },
    { tag: "C-2", fromTag: "CC-1", toTag: "BAT-1", disconnectTags: ["DS-1", "DS-2"] },
  ],
  attachments: [{ kind: "datasheet", equipmentTag: "CC-1" }],
  grounding: { electrodes: [], neutralGroundBondTag: "CC-1" },
};

describe("references to a tag", () => {
  it("names every field that points at an item, in the designer's words", () => {
    expect(referrersOf(record, "CC-1").map((r) => r.label)).toEqual([
      "PV-1 · feeds",
      "C-1 · to",
      "C-2 · from",
      "Attachment 1 · equipment",
      "Neutral-to-ground bond at",
    ]);
    expect(referrersOf(record, "DS-1").map((r) => r.path)).toEqual(["circuits.0.disconnectTags", "circuits.1.disconnectTags"]);
    expect(referrersOf(record, "nothing")).toEqual([]);
  });

  it("renames a tag wherever it is used and leaves the rest alone", () => {
    const next = repointReferences(record, "CC-1", "CC-A") as typeof record;
    expect(next.arrays[0]!.feedsTag).toBe("CC-A");
    expect(next.circuits[0]!.toTag).toBe("CC-A");
    expect(next.circuits[1]!.fromTag).toBe("CC-A");
    expect(next.attachments[0]!.equipmentTag).toBe("CC-A");
    expect(next.grounding.neutralGroundBondTag).toBe("CC-A");
    expect(referrersOf(next, "CC-1")).toEqual([]);
    expect(next.arrays[0]!.moduleTag).toBe("MOD-1");
    expect(record.circuits[0]!.toTag).toBe("CC-1");
  });

  it("removes references: a list entry is dropped, a required end is left for the designer to choose", () => {
    const next = repointReferences(record, "DS-1", undefined) as typeof record;
    expect(next.circuits[0]!.disconnectTags).toEqual([]);
    expect(next.circuits[1]!.disconnectTags).toEqual(["DS-2"]);
    const noArray = repointReferences(record, "PV-1", undefined) as typeof record;
    expect(noArray.circuits[0]!.fromTag).toBe("");
    expect(noArray.circuits[0]!.arrayTag).toBeUndefined();
  });

  it("re-points a list entry without doubling it", () => {
    const next = repointReferences(record, "DS-1", "DS-2") as typeof record;
    expect(next.circuits[1]!.disconnectTags).toEqual(["DS-2"]);
  });
});
