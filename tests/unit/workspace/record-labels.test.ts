/**
 * Messages name fields as the designer sees them on the form: the item's tag
 * and the field's label, rows counted from 1, never a record path.
 */
import { describe, expect, it } from "vitest";
import { describePath, groupIssues, humaniseText } from "../../../components/workspace/record-labels";
import { CIRCUIT_KIND_WORDS, plural, pluralNoun, withArticle } from "../../../lib/schemas/vocabulary";

const record = {
  name: "Cabin",
  equipment: [
    { tag: "MOD-1", kind: "pv-module" },
    { tag: "INV-1", kind: "inverter-charger", mpptInputs: [{ id: "A" }] },
    { tag: "", kind: "battery" },
  ],
  arrays: [{ tag: "PV-1" }],
  circuits: [{ tag: "C-1" }, { tag: "C-2" }, { tag: "C-3" }, { tag: "C-4" }, { tag: "C-5" }, { tag: "C-6" }],
  loads: [{ name: "Fridge" }],
};

describe("record paths in the designer's words", () => {
  it("names the item by its tag and the field by its form label", () => {
    expect(describePath(record, "equipment.0.maxSystemVoltageV")).toBe("MOD-1 · max system voltage");
    expect(describePath(record, "circuits.5.toTag")).toBe("C-6 · to");
    expect(describePath(record, "equipment.1.mpptInputs.0.maxVoltageV")).toBe("INV-1 · MPPT input A · max voltage");
    expect(describePath(record, "loads.0.watts")).toBe("Fridge · power");
  });

  it("counts rows from 1 where an item has no tag yet", () => {
    expect(describePath(record, "equipment.2.nominalVoltageV")).toBe("Equipment row 3 · nominal voltage");
    expect(describePath(record, "circuits.9")).toBe("Circuit row 10");
  });

  it("names project and site fields by their labels", () => {
    expect(describePath(record, "site.designLowTempC")).toBe("Design low temperature");
    expect(describePath(record, "name")).toBe("Project name");
  });

  it("leaves no record path inside a message", () => {
    const text = humaniseText(record, "Needs input: equipment.0.vocV, site.designHighTempC.");
    expect(text).toBe("Needs input: MOD-1 · Voc, Design high temperature.");
    expect(text).not.toMatch(/\b(equipment|circuits|site)\.\w/);
  });

  it("gives a half-filled row one entry and each field one problem", () => {
    const groups = groupIssues(record, [
      { path: "circuits.0.fromTag", message: "is required" },
      { path: "circuits.0.fromTag", message: "may hold letters, digits and . _ - / only, starting with a letter or digit" },
      { path: "circuits.0.toTag", message: "is required" },
      { path: "site.designLowTempC", message: "must be between -60 and 70 °C" },
    ]);
    expect(groups).toHaveLength(2);
    expect(groups[0]).toMatchObject({ title: "C-1", problems: ["from is required", "to is required"] });
  });
});

describe("the product's vocabulary", () => {
  // Articles by the sound of the next word (common English usage): "an inverter", "a PV source", "an AC panel".
  it("puts the right article before a circuit kind", () => {
    expect(`${withArticle(CIRCUIT_KIND_WORDS["inverter-dc-input"])} circuit`).toBe("an inverter DC input circuit");
    expect(withArticle(CIRCUIT_KIND_WORDS["pv-source"])).toBe("a PV source");
    expect(withArticle(CIRCUIT_KIND_WORDS["ac-branch"])).toBe("an AC branch");
    expect(withArticle(CIRCUIT_KIND_WORDS.battery)).toBe("a battery");
  });

  it("counts in proper plurals", () => {
    expect(plural(1, "field")).toBe("1 field");
    expect(plural(3, "field")).toBe("3 fields");
    expect(pluralNoun("equipment")).toBe("equipment");
    expect(pluralNoun("battery")).toBe("batteries");
    expect(pluralNoun("circuit")).toBe("circuits");
  });
});
