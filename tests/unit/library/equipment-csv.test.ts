import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseEquipmentCsv, readNumberCell, type ParsedRow } from "@/lib/equipment-csv/parse";
import { equipmentFromLibraryItem, splitLibraryItem } from "@/lib/schemas/library-item";
import { equipmentSchema } from "@/lib/schemas/project-record";

const EXAMPLE = fs.readFileSync(path.join(__dirname, "../../../examples/equipment-library.csv"), "utf8");

function rowsOf(csv: string): ParsedRow[] {
  const result = parseEquipmentCsv(csv);
  if (!result.ok) throw new Error(`refused: ${result.message} ${JSON.stringify(result.columnProblems)}`);
  return result.rows;
}

const MODULE_HEADER = "kind,manufacturer,model,vocV,iscA,tempCoeffVocPctPerC";

describe("a file with missing required columns is refused whole", () => {
  it("names every missing column", () => {
    const result = parseEquipmentCsv("manufacturer,vocV\nBrightfell,49.5\n");
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.missingColumns).toEqual(["kind", "model"]);
    expect(result.message).toContain("missing columns kind, model");
    expect(result.message).toContain("Nothing was added");
  });

  it("refuses an empty file", () => {
    const result = parseEquipmentCsv("");
    expect(result.ok).toBe(false);
  });
});

describe("units go in the column name, not in the header text or the value", () => {
  it("refuses a header like `Voc (V)` and suggests the field name", () => {
    const result = parseEquipmentCsv("kind,manufacturer,model,Voc (V),Isc [A]\npv-module,Brightfell,BF-1,49.5,13.8\n");
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.missingColumns).toEqual([]);
    expect(result.columnProblems).toEqual([
      { column: "Voc (V)", message: "the unit goes in the column name, not beside it: write vocV" },
      { column: "Isc [A]", message: "the unit goes in the column name, not beside it: write iscA" },
    ]);
  });

  it("refuses a column it does not know rather than drop it unseen", () => {
    const result = parseEquipmentCsv("kind,manufacturer,model,notes\npv-module,Brightfell,BF-1,spare\n");
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.columnProblems[0]?.column).toBe("notes");
  });

  it("refuses `49.5 V` in a numeric column, naming the row, the column and the expected form", () => {
    const csv = [MODULE_HEADER, "pv-module,Brightfell,BF-1,49.5,13.8,-0.27", "pv-module,Brightfell,BF-2,49.5,13.8,-0.27", "pv-module,Brightfell,BF-3,49.5 V,13.8,-0.27"].join("\n");
    const rows = rowsOf(csv);
    expect(rows.map((r) => r.row)).toEqual([2, 3, 4]);
    expect(rows[2]?.item).toBeUndefined();
    expect(rows[2]?.problems.map((p) => p.text)).toEqual(["row 4, vocV: write the number only, in volts"]);
  });

  it("names the unit in words for each suffix", () => {
    const rows = rowsOf([MODULE_HEADER, "pv-module,Brightfell,BF-1,49.5,13.8 A,-0.27%"].join("\n"));
    expect(rows[0]?.problems.map((p) => p.text)).toEqual([
      "row 2, iscA: write the number only, in amperes",
      "row 2, tempCoeffVocPctPerC: write the number only, in percent per °C",
    ]);
  });

  it("asks for a decimal point where a comma was written", () => {
    const rows = rowsOf([MODULE_HEADER, 'pv-module,Brightfell,BF-1,"49,5",13.8,-0.27'].join("\n"));
    expect(rows[0]?.problems[0]?.message).toMatch(/^write the number with a decimal point/);
  });

  it("reads plain, signed and exponent numbers and a typographic minus", () => {
    expect(readNumberCell("49.5", "volts")).toEqual({ ok: true, value: 49.5 });
    expect(readNumberCell(" -0.27 ", "")).toEqual({ ok: true, value: -0.27 });
    expect(readNumberCell("\u22120.27", "")).toEqual({ ok: true, value: -0.27 });
    expect(readNumberCell("1e3", "watts")).toEqual({ ok: true, value: 1000 });
    expect(readNumberCell("forty", "volts")).toEqual({ ok: false, message: "must be a number, in volts" });
  });
});

describe("row refusals", () => {
  it("refuses an unknown kind and lists the kinds", () => {
    const rows = rowsOf("kind,manufacturer,model\nsolar panel,Brightfell,BF-1\n");
    expect(rows[0]?.problems[0]?.text).toMatch(/^row 2, kind: "solar panel" is not a kind; write one of pv-module, charge-controller, /);
  });

  it("refuses an out-of-range value with the allowed range from the schema", () => {
    // Voc above 150 V for one module is outside the schema's bound (0.5…150 V).
    const rows = rowsOf([MODULE_HEADER, "pv-module,Brightfell,BF-1,200,13.8,-0.27"].join("\n"));
    expect(rows[0]?.problems.map((p) => p.text)).toEqual(["row 2, vocV: must be between 0.5 and 150 V"]);
  });

  it("refuses a positive Voc coefficient (crystalline modules lose voltage as they warm)", () => {
    const rows = rowsOf([MODULE_HEADER, "pv-module,Brightfell,BF-1,49.5,13.8,0.27"].join("\n"));
    expect(rows[0]?.problems[0]?.text).toBe("row 2, tempCoeffVocPctPerC: must be between -1 and 0 %/°C");
  });

  it("refuses a fractional count where a whole number is required", () => {
    const rows = rowsOf("kind,manufacturer,model,maxConnectionsPerTerminal\nbattery,Ostin Cells,OC-1,2.5\n");
    expect(rows[0]?.problems[0]?.text).toBe("row 2, maxConnectionsPerTerminal: must be a whole number between 1 and 12");
  });

  it("refuses a rating that belongs to another kind instead of dropping it", () => {
    const rows = rowsOf("kind,manufacturer,model,vocV\nbattery,Ostin Cells,OC-1,49.5\n");
    expect(rows[0]?.problems[0]?.text).toBe("row 2, vocV: not a rating of a battery; leave it empty for this kind");
  });

  it("requires maker and model on every row", () => {
    const rows = rowsOf("kind,manufacturer,model\npv-module,,BF-1\n");
    expect(rows[0]?.problems.map((p) => p.text)).toEqual(["row 2, manufacturer: is required"]);
  });

  it("refuses an enum value outside its list and a yes/no that is neither", () => {
    const rows = rowsOf("kind,manufacturer,model,controllerType,hasPvDisconnect\ncharge-controller,Korvane,KV-1,pulse,maybe\n");
    expect(rows[0]?.problems.map((p) => p.text)).toEqual([
      'row 2, controllerType: "pulse" is not one of pwm, mppt',
      "row 2, hasPvDisconnect: write yes or no",
    ]);
  });

  it("refuses units inside a list of battery voltages", () => {
    const rows = rowsOf("kind,manufacturer,model,batteryVoltagesV\ncharge-controller,Korvane,KV-1,12 V;24 V\n");
    expect(rows[0]?.problems[0]?.text).toBe("row 2, batteryVoltagesV: write the numbers only, separated by semicolons, in volts (e.g. 12;24;48)");
  });

  it("refuses MPPT columns on a kind without MPPT inputs", () => {
    const rows = rowsOf("kind,manufacturer,model,mpptInputs.1.maxVoltageV\nbattery,Ostin Cells,OC-1,500\n");
    expect(rows[0]?.problems[0]?.text).toBe("row 2, mpptInputs.1.maxVoltageV: a battery has no MPPT inputs; leave it empty for this kind");
  });

  it("names the MPPT input column of an out-of-range value", () => {
    const rows = rowsOf("kind,manufacturer,model,mpptInputs.1.maxVoltageV,mpptInputs.2.maxVoltageV\nhybrid-inverter,Halden Power,HX-1,500,5000\n");
    expect(rows[0]?.problems.map((p) => p.text)).toEqual(["row 2, mpptInputs.2.maxVoltageV: must be between 10 and 1500 V"]);
  });
});

describe("good rows", () => {
  it("reads a good row with case-insensitive headers, yes/no, lists and a byte-order mark", () => {
    const csv = "\uFEFFKind,Manufacturer,Model,controllerType,maxPvInputVoltageV,batteryVoltagesV,hasPvDisconnect\ncharge-controller,Korvane,KV-150/30,MPPT,150,12;24;48,no\n";
    const rows = rowsOf(csv);
    expect(rows[0]?.problems).toEqual([]);
    expect(rows[0]?.item).toMatchObject({
      kind: "charge-controller",
      manufacturer: "Korvane",
      model: "KV-150/30",
      controllerType: "mppt",
      maxPvInputVoltageV: 150,
      batteryVoltagesV: [12, 24, 48],
      hasPvDisconnect: false,
    });
  });

  it("skips blank lines but keeps the spreadsheet row numbers", () => {
    const rows = rowsOf([MODULE_HEADER, "pv-module,Brightfell,BF-1,49.5,13.8,-0.27", "", ",,,,,", "pv-module,Brightfell,BF-2,500,13.8,-0.27"].join("\n"));
    expect(rows.map((r) => r.row)).toEqual([2, 5]);
    expect(rows[1]?.problems[0]?.text).toBe("row 5, vocV: must be between 0.5 and 150 V");
  });

  it("takes every row of the shipped example file, one of every kind at least", () => {
    const rows = rowsOf(EXAMPLE);
    expect(rows.length).toBeGreaterThanOrEqual(13);
    expect(rows.filter((r) => r.problems.length)).toEqual([]);
    const kinds = new Set(rows.map((r) => r.item?.kind));
    for (const k of ["pv-module", "charge-controller", "inverter", "inverter-charger", "hybrid-inverter", "battery", "generator", "disconnect", "fuse", "breaker", "rapid-shutdown", "ac-panel", "busbar"]) {
      expect(kinds.has(k as never)).toBe(true);
    }
  });

  it("gives back the demo project's hybrid inverter exactly, MPPT inputs and all, once placed in a project", () => {
    const project = JSON.parse(fs.readFileSync(path.join(__dirname, "../../../examples/ferncliff-farmhouse.json"), "utf8")) as { equipment: Record<string, unknown>[] };
    const demo = project.equipment.find((e) => e.model === "HX-8048");
    const row = rowsOf(EXAMPLE).find((r) => r.model === "HX-8048");
    expect(row?.item).toBeDefined();
    const equipment = equipmentSchema.parse(equipmentFromLibraryItem({ id: "lib-1", ...splitLibraryItem(row!.item!) }, "INV-1", 1));
    // Whether the unit's neutral bonding jumper is fitted is a fact of the installation, not of the datasheet.
    const { neutralBonded: _installed, ...rated } = equipmentSchema.parse(demo) as Record<string, unknown>;
    expect(equipment).toEqual({ ...rated, libraryItemId: "lib-1" });
  });
});
