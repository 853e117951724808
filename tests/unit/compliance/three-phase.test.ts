/**
 * Three-phase AC circuits: line current from power is P ÷ (√3 × V line to line) and the drop is
 * √3 × I × R × L, not the single-phase 2 × I × R × L. Source for both relations: the balanced
 * three-phase power and drop formulas of any electrical handbook (common practice); resistances
 * from NEC Chapter 9 Table 8 (uncoated stranded copper, 75 °C).
 */
import { describe, expect, it } from "vitest";
import { circuit, equipment, exampleJson, result, run, value, type Json } from "./fixtures";

/** The hut with a three-phase 208 V inverter-charger and generator, output currents left to the engine. */
function threePhaseHut(): Json {
  const j = exampleJson("tamarack-hut");
  const inv = equipment(j, "INV-1");
  Object.assign(inv, { acOutput: "208", acOutputVoltageV: 208, acOutputPhases: 3 });
  delete inv.maxAcOutputCurrentA;
  Object.assign(equipment(j, "GEN-1"), { output: "208", voltageV: 208, phases: 3 });
  return j;
}

describe("three-phase inverter output", () => {
  it("takes the current from power as P ÷ (√3 × V line to line)", () => {
    const r = result(run(threePhaseHut()), "circuit-current:C-5");
    // 3000 W ÷ (1.732 × 208 V) = 8.33 A (a single-phase reading would give 14.42 A)
    expect(value(r, "currentA")).toBeCloseTo(8.327, 2);
    expect(r.formula).toContain("√3");
  });

  it("takes the drop as √3 × I × R × L over the line-to-line voltage", () => {
    const r = result(run(threePhaseHut()), "voltage-drop:C-5");
    // NEC Chapter 9 Table 8: 8 AWG Cu 0.778 Ω/kft; 1.732 × 25 ft × 0.778 × 8.327 A ÷ 1000 = 0.2805 V; ÷ 208 V = 0.135 %
    expect(value(r, "dropV")).toBeCloseTo(0.2805, 2);
    expect(value(r, "dropPct")).toBeCloseTo(0.135, 3);
  });

  it("keeps the single-phase figures on a single-phase output", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "INV-1").maxAcOutputCurrentA;
    // 3000 W ÷ 120 V = 25 A; Table 8: 2 × 25 ft × 0.778 × 25 A ÷ 1000 = 0.9725 V
    expect(value(result(run(j), "circuit-current:C-5"), "currentA")).toBeCloseTo(25, 5);
    expect(value(result(run(j), "voltage-drop:C-5"), "dropV")).toBeCloseTo(0.9725, 2);
  });
});

describe("three-phase generator output", () => {
  it("takes the nameplate current as kW × 1000 ÷ (√3 × V line to line)", () => {
    const r = result(run(threePhaseHut()), "circuit-current:C-4");
    // 3600 W ÷ (1.732 × 208 V) = 9.99 A (single phase would give 17.31 A)
    expect(value(r, "currentA")).toBeCloseTo(9.993, 2);
  });

  it("takes the generator's drop with the three-phase factor", () => {
    const r = result(run(threePhaseHut()), "voltage-drop:C-4");
    // Table 8: 1.732 × 40 ft × 0.778 Ω/kft × 9.993 A ÷ 1000 = 0.5387 V
    expect(value(r, "dropV")).toBeCloseTo(0.5387, 3);
  });
});

describe("three-phase branch circuit", () => {
  function withBranch(phases?: 1 | 3): Json {
    const j = exampleJson("tamarack-hut");
    j.equipment.push({ tag: "P-2", kind: "ac-panel", voltage: "208", busRatingA: 100 });
    j.equipment.push({ tag: "CB-9", kind: "breaker", ratingA: 25, voltageRatingV: 240, currentType: "ac" });
    const branch: Json = {
      tag: "C-9", fromTag: "P-1", toTag: "P-2", kind: "ac-branch", loadCurrentA: 20, nominalVoltageV: 208,
      material: "cu", size: "12", lengthFt: 100, ocpdTag: "CB-9",
    };
    if (phases !== undefined) branch.phases = phases;
    j.circuits.push(branch);
    return j;
  }

  it("uses √3 for a circuit marked three phase", () => {
    const r = result(run(withBranch(3)), "voltage-drop:C-9");
    // Table 8: 12 AWG Cu 1.98 Ω/kft; 1.732 × 100 ft × 1.98 × 20 A ÷ 1000 = 6.859 V; ÷ 208 V = 3.30 %
    expect(value(r, "dropV")).toBeCloseTo(6.859, 2);
    expect(value(r, "dropPct")).toBeCloseTo(3.298, 2);
  });

  it("takes a circuit with no phases and no three-phase source as single phase, the larger drop", () => {
    const r = result(run(withBranch()), "voltage-drop:C-9");
    // 2 × 100 ft × 1.98 × 20 A ÷ 1000 = 7.92 V
    expect(value(r, "dropV")).toBeCloseTo(7.92, 3);
    expect(r.inputs.map((i) => i.path)).toContain(`circuits.${5}.phases`);
  });

  it("refuses a phase count other than 1, 2 (split phase) or 3", () => {
    const j = withBranch();
    circuit(j, "C-9").phases = 4;
    expect(() => run(j)).toThrow(/phases/);
    circuit(j, "C-9").phases = 2;
    expect(() => run(j)).not.toThrow();
  });
});
