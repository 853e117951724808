import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseProjectFile } from "@/lib/compliance";
import { projectFileJsonSchemaText, SCHEMA_PATH } from "@/scripts/gen-project-schema";
import { array, circuit, equipment, exampleJson } from "./fixtures";

const ROOT = path.resolve(__dirname, "../../..");

function issues(json: unknown): { path: string; message: string }[] {
  const p = parseProjectFile(json);
  return p.ok ? [] : p.issues;
}

describe("project file parsing", () => {
  it.each(["market-stall", "tamarack-hut", "ferncliff-farmhouse"] as const)("parses examples/%s.json", (name) => {
    expect(issues(exampleJson(name))).toEqual([]);
  });

  it("names every invalid field with its allowed range", () => {
    const j = exampleJson("tamarack-hut");
    j.site.designLowTempC = -80;
    equipment(j, "MOD-1").vocV = "48";
    circuit(j, "C-1").size = "11";
    const found = issues(j);
    expect(found).toEqual(
      expect.arrayContaining([
        { path: "site.designLowTempC", message: "must be between -60 and 70 °C" },
        expect.objectContaining({ path: "equipment.0.vocV" }),
        expect.objectContaining({ path: "circuits.0.size" }),
      ]),
    );
  });

  it("refuses non-objects and bad JSON shapes with a path", () => {
    expect(issues(null)[0]?.path).toBe("(record)");
    expect(issues([])[0]?.path).toBe("(record)");
  });
});

describe("record references", () => {
  const cases: [string, (j: ReturnType<typeof exampleJson>) => void, string, RegExp][] = [
    ["duplicate tags", (j) => (equipment(j, "CB-1").tag = "DS-1"), "equipment.7.tag", /duplicate tag "DS-1"/],
    ["a tag shared by an array and a circuit", (j) => (circuit(j, "C-1").tag = "PV-1"), "circuits.0.tag", /duplicate tag/],
    ["a circuit end naming nothing", (j) => (circuit(j, "C-2").toTag = "BAT-9"), "circuits.1.toTag", /names no equipment: "BAT-9"/],
    ["a non-PV circuit ending at an array", (j) => (circuit(j, "C-2").fromTag = "PV-1"), "circuits.1.fromTag", /is a PV array/],
    ["arrayTag that is not an array", (j) => (circuit(j, "C-1").arrayTag = "CC-1"), "circuits.0.arrayTag", /not an array/],
    ["array.moduleTag that is not a module", (j) => (array(j, "PV-1").moduleTag = "BAT-1"), "arrays.0.moduleTag", /not a pv-module/],
    ["array.feedsTag that is not a controller or inverter", (j) => (array(j, "PV-1").feedsTag = "BAT-1"), "arrays.0.feedsTag", /not a charge controller or inverter/],
    ["ocpdTag that is not a fuse or breaker", (j) => (circuit(j, "C-2").ocpdTag = "DS-1"), "circuits.1.ocpdTag", /not a fuse or breaker/],
    ["disconnectTags naming a battery", (j) => (circuit(j, "C-1").disconnectTags = ["BAT-1"]), "circuits.0.disconnectTags.0", /not a disconnect, breaker or fuse/],
  ];
  it.each(cases)("refuses %s", (_label, mutate, pathName, message) => {
    const j = exampleJson("tamarack-hut");
    mutate(j);
    const found = issues(j);
    expect(found.map((i) => i.path)).toContain(pathName);
    expect(found.find((i) => i.path === pathName)?.message).toMatch(message);
  });

  it("refuses a string on an MPPT input that does not exist", () => {
    const j = exampleJson("ferncliff-farmhouse");
    array(j, "PV-2").mpptInputId = "C";
    const found = issues(j).find((i) => i.path === "arrays.1.mpptInputId");
    expect(found?.message).toMatch(/string on an MPPT input that does not exist/);
    expect(found?.message).toMatch(/it has A, B/);
  });
});

describe("JSON Schema of the project file", () => {
  it("is current: the committed file equals freshly generated output", () => {
    const committed = readFileSync(path.join(ROOT, SCHEMA_PATH), "utf8");
    expect(committed).toBe(projectFileJsonSchemaText());
  });

  it("carries the ranges and enums", () => {
    const schema = JSON.parse(projectFileJsonSchemaText());
    const low = schema.properties.site.properties.designLowTempC;
    expect(low.minimum).toBe(-60);
    expect(low.maximum).toBe(70);
    expect(schema.properties.jurisdiction.properties.necEdition.enum).toEqual(["2017", "2020", "2023"]);
  });
});

describe("the engine stays pure", () => {
  function files(dir: string): string[] {
    return readdirSync(dir).flatMap((f) => {
      const p = path.join(dir, f);
      return statSync(p).isDirectory() ? files(p) : p.endsWith(".ts") ? [p] : [];
    });
  }
  const sources = files(path.join(ROOT, "lib/compliance"));

  it("imports nothing but zod and relative files", () => {
    const offenders: string[] = [];
    for (const f of sources) {
      const text = readFileSync(f, "utf8");
      for (const m of text.matchAll(/(?:import|export)\s[^;]*?from\s+["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)|require\(\s*["']([^"']+)["']\s*\)/g)) {
        const spec = m[1] ?? m[2] ?? m[3]!;
        if (spec !== "zod" && !spec.startsWith("./") && !spec.startsWith("../")) offenders.push(`${path.relative(ROOT, f)}: ${spec}`);
        if (spec.startsWith("../")) {
          const target = path.resolve(path.dirname(f), spec);
          const inside = target.startsWith(path.join(ROOT, "lib/compliance")) || target.startsWith(path.join(ROOT, "lib/schemas"));
          if (!inside) offenders.push(`${path.relative(ROOT, f)}: ${spec}`);
        }
      }
    }
    expect(offenders).toEqual([]);
  });

  it("reads no clock and no randomness", () => {
    const offenders = sources.filter((f) => /\b(Date\.now|new Date|Math\.random|performance\.now|process\.)/.test(readFileSync(f, "utf8")));
    expect(offenders.map((f) => path.relative(ROOT, f))).toEqual([]);
  });

  it("the schemas it reads import zod and relative files only", () => {
    for (const f of ["lib/schemas/project-record.ts", "lib/schemas/fields.ts"]) {
      const text = readFileSync(path.join(ROOT, f), "utf8");
      const specs = [...text.matchAll(/from\s+["']([^"']+)["']/g)].map((m) => m[1]!);
      expect(specs.every((s) => s === "zod" || s.startsWith("./"))).toBe(true);
    }
  });
});
