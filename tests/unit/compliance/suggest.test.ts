/**
 * What the record implies about a circuit: its kind from its ends, the
 * insulation rating from the type, and a size, device and EGC that pass.
 */
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseProjectFile } from "../../../lib/compliance";
import { circuitKindFromEnds, insulationRatingFor, suggestCircuit } from "../../../lib/compliance/derive/suggest";
import type { ProjectRecord } from "../../../lib/schemas/project-record";

function load(file: string): ProjectRecord {
  const parsed = parseProjectFile(JSON.parse(fs.readFileSync(path.join(__dirname, "../../../examples", file), "utf8")));
  if (!parsed.ok) throw new Error(`${file} does not parse`);
  return parsed.record;
}

describe("circuit kind from its two ends", () => {
  // The circuit names of NEC 690.2 and 706 as a stand-alone system wires them (common practice).
  it.each([
    ["array", "charge-controller", "pv-source"],
    ["charge-controller", "battery", "battery"],
    ["battery", "inverter-charger", "inverter-dc-input"],
    ["generator", "inverter-charger", "generator-output"],
    ["inverter-charger", "ac-panel", "inverter-ac-output"],
    ["inverter-charger", "battery", "inverter-dc-input"],
  ] as const)("%s → %s is %s", (a, b, kind) => {
    expect(circuitKindFromEnds(a, b)).toBe(kind);
  });

  it("says nothing while an end is missing", () => {
    expect(circuitKindFromEnds("array", undefined)).toBeUndefined();
  });
});

describe("insulation rating from the type", () => {
  // NEC 2020 Table 310.4(A): THWN-2 90 °C wet and dry; XHHW 90 °C dry, 75 °C wet; TW 60 °C. UL 4703 PV wire 90 °C wet.
  it("reads the wet-location rating where it is lower", () => {
    expect(insulationRatingFor("THWN-2")).toBe(90);
    expect(insulationRatingFor("PV wire")).toBe(90);
    expect(insulationRatingFor("XHHW")).toBe(75);
    expect(insulationRatingFor("TW")).toBe(60);
    expect(insulationRatingFor("rope")).toBeUndefined();
  });
});

describe("suggested conductor, device and EGC", () => {
  const record = load("tamarack-hut.json");

  it("sizes the battery-to-inverter circuit of the cabin", () => {
    // Inverter DC input: 3000 W ÷ (21 V × 0.92) = 155.3 A; × 1.25 = 194.1 A → 200 A (NEC 240.6(A) standard ratings).
    // 3/0 Cu: 200 A at 75 °C (NEC 2020 Table 310.16); EGC for 200 A: 6 AWG Cu (NEC 2020 Table 250.122).
    const s = suggestCircuit(record, 2);
    expect(s.ocpdA).toBe(200);
    expect(s.size).toBe("3/0");
    expect(s.egcSize).toBe("6");
    expect(s.side).toBe("dc");
  });

  it("sizes the inverter's AC output", () => {
    // 25 A × 1.25 = 31.25 A → 35 A (240.6(A)); 8 AWG Cu: 40 A at 60 °C terminals (Table 310.16); EGC 10 AWG Cu up to 60 A (Table 250.122).
    const s = suggestCircuit(record, 4);
    expect(s.ocpdA).toBe(35);
    expect(s.size).toBe("8");
    expect(s.egcSize).toBe("10");
  });

  it("names what it still needs instead of guessing", () => {
    const bare = structuredClone(record);
    const inverter = bare.equipment.find((e) => e.tag === "INV-1") as Record<string, unknown>;
    delete inverter.maxAcOutputCurrentA;
    delete inverter.continuousW;
    const s = suggestCircuit(bare, 4);
    expect(s.size).toBeUndefined();
    expect(s.missing.length).toBeGreaterThan(0);
  });
});
