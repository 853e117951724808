/**
 * Every value of the three demo project files can be shown in the editor's
 * controls and read back unchanged, so a designer who types those values in
 * gets the record the command line checks — and the same check results.
 */
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { EQUIPMENT_COLUMNS, MPPT_INPUT_COLUMNS } from "../../../components/workspace/equipment-section";
import { RATING_FIELDS } from "../../../components/workspace/equipment-fields";
import type { GridColumn } from "../../../components/workspace/editable-grid";
import { formatValue, parseInput, type FieldType, type Option } from "../../../components/workspace/field-values";
import { arrayColumns, circuitColumns, LOAD_COLUMNS } from "../../../components/workspace/row-sections";
import { GROUNDING_FIELDS, PROJECT_FIELDS, SITE_FIELDS } from "../../../components/workspace/site-section";
import { tagLists, type Row } from "../../../components/workspace/use-record-tags";
import { parseProjectFile, runChecks } from "../../../lib/compliance";
import type { EquipmentKind, ProjectRecord } from "../../../lib/schemas/project-record";

interface Control {
  type: FieldType;
  required?: boolean;
  options?: Option[];
}

/** What a designer's keystrokes produce for a value shown in a control; also says whether a select offers it. */
function throughControl(value: unknown, control: Control, where: string): unknown {
  const shown = formatValue(control.type, value);
  if (control.options && (control.type === "select" || control.type === "number-select") && shown !== "") {
    expect(control.options.map((o) => o.value), `${where} offers ${shown}`).toContain(shown);
  }
  return parseInput(control.type, control.type === "checkbox" ? Boolean(value) : shown, control.required);
}

function rowThrough(row: Record<string, unknown>, columns: Map<string, Control>, where: string, skip: string[] = []) {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(row)) {
    if (skip.includes(key)) {
      out[key] = value;
      continue;
    }
    const control = columns.get(key);
    expect(control, `${where}.${key} has a control`).toBeDefined();
    const back = throughControl(value, control!, `${where}.${key}`);
    // The schema gives an empty text field its default "", which a cleared control also gives.
    if (back !== undefined) out[key] = back;
  }
  return out;
}

const byKey = (columns: GridColumn[], rowIndex = 0) =>
  new Map(columns.map((c) => [c.key, { ...c, options: typeof c.options === "function" ? c.options(rowIndex) : c.options }]));

function entered(record: ProjectRecord): unknown {
  const tags = tagLists(record.equipment as Row[], record.arrays as Row[], record.circuits as Row[]);
  const top = new Map(PROJECT_FIELDS.map((f) => [f.path, f]));
  const site = new Map(SITE_FIELDS.map((f) => [f.path.replace(/^site\./, ""), f]));
  const project = rowThrough(
    { name: record.name, client: record.client, systemKind: record.systemKind, daysOfAutonomy: record.daysOfAutonomy, rapidShutdownMethod: record.rapidShutdownMethod, rapidShutdownInsideBoundary: record.rapidShutdownInsideBoundary, pvGroundingConfiguration: record.pvGroundingConfiguration },
    top,
    "record",
  );
  return {
    ...project,
    site: rowThrough(record.site, site, "site"),
    grounding: rowThrough(record.grounding, new Map(GROUNDING_FIELDS.map((f) => [f.path.replace(/^grounding\./, ""), f])), "grounding"),
    jurisdiction: record.jurisdiction,
    equipment: record.equipment.map((e, i) => {
      const controls = new Map<string, Control>([...byKey(EQUIPMENT_COLUMNS), ...RATING_FIELDS[e.kind as EquipmentKind].map((f) => [f.key, f] as const)]);
      const row = rowThrough(e, controls, `equipment.${i}`, ["libraryItemId", "mpptInputs"]);
      if ("mpptInputs" in e) row.mpptInputs = e.mpptInputs.map((m, j) => rowThrough(m, byKey(MPPT_INPUT_COLUMNS), `equipment.${i}.mpptInputs.${j}`));
      return row;
    }),
    arrays: record.arrays.map((a, i) => rowThrough(a, byKey(arrayColumns(tags), i), `arrays.${i}`)),
    circuits: record.circuits.map((c, i) => rowThrough(c, byKey(circuitColumns(tags), i), `circuits.${i}`)),
    loads: record.loads.map((l, i) => rowThrough(l, byKey(LOAD_COLUMNS), `loads.${i}`)),
    attachments: record.attachments,
  };
}

describe.each(["tamarack-hut.json", "ferncliff-farmhouse.json", "market-stall.json"])("%s entered through the editor's controls", (file) => {
  const parsed = parseProjectFile(JSON.parse(fs.readFileSync(path.join(__dirname, "../../../examples", file), "utf8")));
  if (!parsed.ok) throw new Error(`${file} does not parse`);
  const original = parsed.record;

  it("reads back as the same record", () => {
    const again = parseProjectFile(entered(original));
    expect(again.ok ? [] : again.issues).toEqual([]);
    if (again.ok) expect(again.record).toEqual(original);
  });

  it("gives the same check results as the command line", () => {
    const again = parseProjectFile(entered(original));
    if (!again.ok) throw new Error("did not parse");
    expect(runChecks(again.record)).toEqual(runChecks(original));
  });
});
