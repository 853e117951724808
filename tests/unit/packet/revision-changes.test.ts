import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { describeRecordChanges } from "@/lib/packet/revision-changes";
import { projectRecordSchema } from "@/lib/schemas/project-record";

const hut = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));

describe("what changed between revisions, for the cover's history", () => {
  it("calls the first revision the first issue", () => {
    expect(describeRecordChanges(null, hut)).toBe("First issue");
  });

  it("names the circuit a designer resized and the equipment added, by tag", () => {
    const circuits = hut.circuits.map((c, i) => (i === 0 ? { ...c, size: "8" as const } : c));
    const extra = { ...hut.equipment.find((e) => e.kind === "breaker")!, tag: "CB-9" };
    const after = { ...hut, circuits, equipment: [...hut.equipment, extra] };
    const text = describeRecordChanges(hut, after);
    expect(text).toContain(`circuits: changed ${hut.circuits[0]!.tag}`);
    expect(text).toContain("equipment: added CB-9");
    expect(text).not.toContain("site");
  });

  it("says so when nothing in the record moved", () => {
    expect(describeRecordChanges(hut, structuredClone(hut))).toBe("Regenerated without changes to the design record");
  });
});
