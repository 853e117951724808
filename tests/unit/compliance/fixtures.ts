/** Shared builders for the engine tests: the example project files, cloned so a test can alter them. */
import { readFileSync } from "node:fs";
import path from "node:path";
import { parseProjectFile, runChecks, type CheckResult, type CheckRun } from "@/lib/compliance";
import type { NecEdition, ProjectRecord } from "@/lib/schemas/project-record";

export type ExampleName = "market-stall" | "tamarack-hut" | "ferncliff-farmhouse";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type Json = any;

const cache = new Map<ExampleName, string>();

/** A fresh, mutable copy of an example project file as written (input shape). */
export function exampleJson(name: ExampleName): Json {
  if (!cache.has(name)) cache.set(name, readFileSync(path.resolve(__dirname, "../../../examples", `${name}.json`), "utf8"));
  return JSON.parse(cache.get(name)!);
}

export function parse(json: Json): ProjectRecord {
  const p = parseProjectFile(json);
  if (!p.ok) throw new Error(`fixture does not parse:\n${p.issues.map((i) => `${i.path}: ${i.message}`).join("\n")}`);
  return p.record;
}

export function run(json: Json, edition?: NecEdition): CheckRun {
  return runChecks(parse(json), edition ? { edition } : {});
}

export function result(r: CheckRun, id: string): CheckResult {
  const found = r.results.find((x) => x.id === id);
  if (!found) throw new Error(`no result ${id}; have ${r.results.map((x) => x.id).join(", ")}`);
  return found;
}

export function value(res: CheckResult, key: string): number {
  const found = res.values.find((x) => x.key === key);
  if (!found || typeof found.value !== "number") throw new Error(`no numeric value ${key} in ${res.id}: ${JSON.stringify(res.values)}`);
  return found.value;
}

export function equipment(json: Json, tag: string): Json {
  const e = json.equipment.find((x: Json) => x.tag === tag);
  if (!e) throw new Error(`no equipment ${tag}`);
  return e;
}

export function circuit(json: Json, tag: string): Json {
  const c = json.circuits.find((x: Json) => x.tag === tag);
  if (!c) throw new Error(`no circuit ${tag}`);
  return c;
}

export function array(json: Json, tag: string): Json {
  const a = json.arrays.find((x: Json) => x.tag === tag);
  if (!a) throw new Error(`no array ${tag}`);
  return a;
}
