/**
 * Split-phase (120/240 V) outputs: the power is carried between the two lines, so the line current is
 * single phase at the 240 V line-to-line voltage, P ÷ 240 V, and the drop is 2 × I × R × L over 240 V.
 * Source: the single-phase power and drop relations of any electrical handbook (common practice);
 * resistances from NEC Chapter 9 Table 8 (uncoated stranded copper, 75 °C).
 */
import { describe, expect, it } from "vitest";
import { parseProjectFile } from "../../../lib/compliance";
import { equipment, exampleJson, result, run, value, type Json } from "./fixtures";

/** The hut's inverter-charger as a split-phase output recorded at 120 V line to neutral, current left to the engine. */
function splitPhaseHut(): Json {
  const j = exampleJson("tamarack-hut");
  const inv = equipment(j, "INV-1");
  Object.assign(inv, { acOutputVoltageV: 120, acOutputPhases: 2 });
  delete inv.acOutput;
  delete inv.maxAcOutputCurrentA;
  return j;
}

describe("split-phase outputs", () => {
  it("are accepted as 2 on inverters, generators and circuits, and 4 is refused", () => {
    const j = splitPhaseHut();
    equipment(j, "GEN-1").phases = 2;
    expect(parseProjectFile(j).ok).toBe(true);
    equipment(j, "GEN-1").phases = 4;
    const refused = parseProjectFile(j);
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.issues.some((i) => i.path.endsWith(".phases") && /split phase/.test(i.message))).toBe(true);
  });

  it("take the inverter's current from power at the line-to-line voltage, P ÷ 240 V", () => {
    const r = result(run(splitPhaseHut()), "circuit-current:C-5");
    // 3000 W ÷ 240 V = 12.5 A (read as 120 V single phase it would be 25 A)
    expect(value(r, "currentA")).toBeCloseTo(12.5, 5);
    expect(r.formula).toContain("240 V");
  });

  it("take the drop as 2 × I × R × L over 240 V", () => {
    const r = result(run(splitPhaseHut()), "voltage-drop:C-5");
    // Table 8: 8 AWG Cu 0.778 Ω/kft; 2 × 25 ft × 0.778 × 12.5 A ÷ 1000 = 0.4863 V; ÷ 240 V = 0.203 %
    expect(value(r, "dropV")).toBeCloseTo(0.4863, 3);
    expect(value(r, "dropPct")).toBeCloseTo(0.2026, 3);
  });

  it("take a split-phase generator's nameplate current at 240 V line to line", () => {
    const j = exampleJson("tamarack-hut");
    Object.assign(equipment(j, "GEN-1"), { voltageV: 120, phases: 2 });
    // 3.6 kW ÷ 240 V = 15 A (read as 120 V it would be 30 A)
    expect(value(result(run(j), "circuit-current:C-4"), "currentA")).toBeCloseTo(15, 5);
  });

  it("are not a 120 V-only supply on a 120/240 V panel (710.15(C))", () => {
    // The hut's 120 V inverter-charger on its 120/240 V panel needs the single-supply warning; a split-phase one does not.
    const single = run(exampleJson("tamarack-hut")).results.filter((r) => r.checkId === "stand-alone-supply" && /single 120-volt supply/.test(r.message));
    const split = run(splitPhaseHut()).results.filter((r) => r.checkId === "stand-alone-supply" && /single 120-volt supply/.test(r.message));
    expect(single.length).toBeGreaterThan(0);
    expect(split).toHaveLength(0);
  });
});
