import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseLenient } from "../../../components/workspace/lenient-record";
import { formatValue, parseInput } from "../../../components/workspace/field-values";
import { runChecks } from "../../../lib/compliance";

type Row = Record<string, unknown>;
interface LooseRecord {
  name: string;
  site: Row;
  equipment: Row[];
  circuits: Row[];
}
const hut = () => JSON.parse(fs.readFileSync(path.join(__dirname, "../../../examples/tamarack-hut.json"), "utf8")) as LooseRecord;

describe("the record the live checks run on", () => {
  it("is the record itself when it parses", () => {
    const r = parseLenient(hut());
    expect(r.issues).toEqual([]);
    expect(r.omitted).toEqual([]);
    expect(r.record?.circuits).toHaveLength(5);
  });

  it("leaves out a half-entered circuit row, names it, and checks the rest", () => {
    const json = hut();
    json.circuits.push({ tag: "C-9", fromTag: "", toTag: "", kind: "pv-source" });
    const r = parseLenient(json);
    expect(r.issues.map((i) => i.path)).toEqual(expect.arrayContaining(["circuits.5.fromTag", "circuits.5.toTag"]));
    expect(r.omitted).toEqual(["circuits.5"]);
    expect(r.record?.circuits.map((c) => c.tag)).toEqual(["C-1", "C-2", "C-3", "C-4", "C-5"]);
    expect(runChecks(r.record!).results.length).toBeGreaterThan(0);
  });

  it("drops the rows that depend on a dropped row, naming each by its place in the designer's record", () => {
    const json = hut();
    // The module's Voc out of range (0.5 … 150 V) drops MOD-1; PV-1 then names no module and goes too, and C-1 with it.
    json.equipment[0]!.vocV = 900;
    const r = parseLenient(json);
    expect(r.issues.map((i) => i.path)).toEqual(["equipment.0.vocV"]);
    expect(r.omitted).toEqual(expect.arrayContaining(["equipment.0", "arrays.0"]));
    expect(r.record?.equipment.some((e) => e.tag === "MOD-1")).toBe(false);
    expect(r.record?.arrays).toEqual([]);
  });

  it("leaves out an optional site figure outside its range (−60 … +70 °C)", () => {
    const json = hut();
    json.site.designLowTempC = -75;
    const r = parseLenient(json);
    expect(r.issues).toEqual([{ path: "site.designLowTempC", message: "must be between -60 and 70 °C" }]);
    expect(r.omitted).toEqual(["site.designLowTempC"]);
    expect(r.record?.site.designLowTempC).toBeUndefined();
  });

  it("gives no record when a required field is wrong, rather than guessing", () => {
    const json = hut();
    json.site.occupancy = "castle";
    expect(parseLenient(json).record).toBeNull();
    const unnamed = hut();
    unnamed.name = "";
    expect(parseLenient(unnamed).record).toBeNull();
  });
});

describe("typed values", () => {
  it("reads numbers, leaving an empty cell unset and keeping nonsense for the schema to refuse", () => {
    expect(parseInput("number", "-20")).toBe(-20);
    expect(parseInput("number", " 48.6 ")).toBe(48.6);
    expect(parseInput("number", "")).toBeUndefined();
    expect(Number.isNaN(parseInput("number", "abc"))).toBe(true);
  });

  it("reads selects, yes/no/unstated and tag lists", () => {
    expect(parseInput("select", "")).toBeUndefined();
    expect(parseInput("select", "", true)).toBe("");
    expect(parseInput("number-select", "75")).toBe(75);
    expect(parseInput("tri-state", "yes")).toBe(true);
    expect(parseInput("tri-state", "no")).toBe(false);
    expect(parseInput("tri-state", "")).toBeUndefined();
    expect(parseInput("tags", "DS-1, DS-2  DS-3")).toEqual(["DS-1", "DS-2", "DS-3"]);
    expect(parseInput("numbers", "12, 24,48")).toEqual([12, 24, 48]);
  });

  it("writes values back as they were typed", () => {
    expect(formatValue("number", -20)).toBe("-20");
    expect(formatValue("number", undefined)).toBe("");
    expect(formatValue("tags", ["DS-1", "DS-2"])).toBe("DS-1, DS-2");
    expect(formatValue("tri-state", false)).toBe("no");
  });
});
