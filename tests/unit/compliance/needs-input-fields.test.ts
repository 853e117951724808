/**
 * A needs-input result must name the record field that clears it: for every demo record with one field
 * removed, each missing path a result names is filled with a valid value, and that result's missing
 * list must change. A path the computation never reads would leave it unchanged, and the designer who
 * fills it in would see nothing happen.
 */
import { describe, expect, it } from "vitest";
import { parseProjectFile, runChecks, type CheckRun } from "@/lib/compliance";
import { exampleJson, type ExampleName, type Json } from "./fixtures";

/** Valid values for fields the demo records leave empty (ranges from lib/schemas/project-record.ts). */
const SAMPLE: Record<string, unknown> = {
  designCurrentA: 20,
  nominalVoltageV: 48,
  loadCurrentA: 10,
  acOutput: "120/240",
  acOutputVoltageV: 240,
  entersBuilding: false,
  rapidShutdownMethod: "module-level",
  rapidShutdownInsideBoundary: "listed-hazard-control",
  neutralBusRatingA: 100,
  maxAcOutputCurrentA: 20,
  efficiencyPct: 95,
  idleW: 20,
  maxSeriesFuseA: 20,
  tempCoeffVocPctPerC: -0.3,
  ocpdTag: undefined,
};

function getPath(obj: Json, path: string[]): unknown {
  return path.reduce<Json>((o, k) => (o === undefined || o === null ? undefined : o[k]), obj);
}
function setPath(obj: Json, path: string[], value: unknown): void {
  const parent = getPath(obj, path.slice(0, -1)) as Json;
  if (parent && typeof parent === "object") parent[path[path.length - 1]!] = value;
}
function deletePath(obj: Json, path: string[]): void {
  const parent = getPath(obj, path.slice(0, -1)) as Json;
  if (parent && typeof parent === "object" && !Array.isArray(parent)) delete parent[path[path.length - 1]!];
}

/** Every optional scalar leaf of a record (one that can be removed and still parse). */
function leaves(obj: Json, prefix: string[] = []): string[][] {
  const out: string[][] = [];
  for (const [k, val] of Object.entries(obj)) {
    const p = [...prefix, k];
    if (Array.isArray(val)) {
      val.forEach((item, i) => {
        if (item && typeof item === "object") out.push(...leaves(item, [...p, String(i)]));
      });
    } else if (val && typeof val === "object") out.push(...leaves(val, p));
    else if (prefix[0] !== "attachments") out.push(p);
  }
  return out;
}

function tryRun(json: Json): CheckRun | undefined {
  const parsed = parseProjectFile(json);
  return parsed.ok ? runChecks(parsed.record) : undefined;
}

function missingOf(run: CheckRun | undefined, id: string): string | undefined {
  const r = run?.results.find((x) => x.id === id);
  return r ? JSON.stringify(r.missing) : undefined;
}

describe.each<ExampleName>(["market-stall", "tamarack-hut", "ferncliff-farmhouse"])("needs input names the clearing field: %s", (name) => {
  it("every named missing field, filled in, changes that result", () => {
    const original = exampleJson(name);
    const problems: string[] = [];
    let checked = 0;
    for (const leaf of leaves(original)) {
      const removed = exampleJson(name);
      deletePath(removed, leaf);
      const before = tryRun(removed);
      if (!before) continue;
      for (const r of before.results) {
        for (const missing of r.missing) {
          const path = missing.split(".");
          const last = path[path.length - 1]!;
          const fromOriginal = getPath(original, path);
          const value = fromOriginal !== undefined && typeof fromOriginal !== "object" ? fromOriginal : SAMPLE[last];
          // Whole collections ("loads", "equipment") are filled by adding rows, not one value.
          if (value === undefined) continue;
          const filled = structuredClone(removed);
          setPath(filled, path, value);
          const after = tryRun(filled);
          checked++;
          if (after && missingOf(after, r.id) === JSON.stringify(r.missing)) {
            problems.push(`without ${leaf.join(".")}: ${r.id} names ${missing}, but filling it (${JSON.stringify(value)}) leaves ${JSON.stringify(r.missing)}`);
          }
        }
      }
    }
    expect(checked).toBeGreaterThan(10);
    expect(problems).toEqual([]);
  });
});

describe("the known cases, by name", () => {
  it("a PV circuit's voltage drop asks for the module's Imp and Vmp, not a design current or nominal voltage", () => {
    const j = exampleJson("tamarack-hut");
    delete j.equipment[0].impA;
    delete j.equipment[0].vmpV;
    const r = tryRun(j)!.results.find((x) => x.id === "voltage-drop:C-1")!;
    expect(r.missing).toEqual(["equipment.0.impA", "equipment.0.vmpV"]);
  });

  it("a device rating on a PV circuit asks for the design low temperature, not a nominal voltage", () => {
    const j = exampleJson("market-stall");
    delete j.site.designLowTempC;
    const r = tryRun(j)!.results.find((x) => x.id === "device-ratings:DS-1")!;
    expect(r.missing).toContain("site.designLowTempC");
    expect(r.missing).not.toContain("circuits.0.nominalVoltageV");
  });
});
