/**
 * Stand-alone output conductors and back-fed breakers, and generator and building disconnects.
 * Sources: 710.15(B) (conductors sized on the sum of the stand-alone sources' output ratings), 215.2(A)(1) (125 % of
 * continuous current), 408.36(D) (back-fed plug-in devices secured by an additional fastener; text as quoted in trade
 * forums), 710.15(E) (the same for stand-alone inverters, from memory), 705.12(D)(5) in 2017 / 705.12(E) from 2020
 * (listed interactive inverters may omit it, from memory), 445.18(A) (generators other than cord-and-plug-connected
 * portable ones have a disconnect, from memory), 225.31/225.32 (225.31(A)/(B) from 2020, from memory).
 * Ampacities: NEC 2017 Table 310.15(B)(16), 75 °C copper: 8 AWG 50 A, 6 AWG 65 A, 12 AWG 25 A, 10 AWG 35 A.
 */
import { describe, expect, it } from "vitest";
import { circuit, equipment, exampleJson, result, run, value } from "./fixtures";

describe("710.15(B): output conductors carry the sum of the sources", () => {
  it("passes the hut's C-5: 8 AWG (50 A) ≥ 1.25 × 25 A = 31.25 A", () => {
    const r = result(run(exampleJson("tamarack-hut")), "stand-alone-output:C-5");
    expect(r.status).toBe("pass");
    expect(value(r, "sourcesSumA")).toBe(25);
    expect(value(r, "requiredTerminalA")).toBeCloseTo(31.25, 6);
    expect(value(r, "terminalA")).toBe(50);
  });

  it("fails two stacked 25 A inverters on 8 AWG (1.25 × 50 A = 62.5 A > 50 A); 6 AWG (65 A) passes", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "INV-1").quantity = 2;
    const r = result(run(j), "stand-alone-output:C-5");
    expect(r.status).toBe("fail");
    expect(value(r, "sourcesSumA")).toBe(50);
    expect(r.remedy?.changes).toEqual([{ path: "circuits.4.size", value: "6" }]);
    circuit(j, "C-5").size = "6";
    expect(result(run(j), "stand-alone-output:C-5").status).toBe("pass");
  });

  it("sizes a feeder from the panel onward on the sum of every source into the panel", () => {
    const j = exampleJson("tamarack-hut");
    j.equipment.push({ tag: "P-2", kind: "ac-panel", busRatingA: 100, voltage: "120/240", listing: "UL 67" });
    j.circuits.push({
      tag: "C-6", fromTag: "P-1", toTag: "P-2", kind: "ac-branch", loadCurrentA: 10, nominalVoltageV: 120,
      material: "cu", size: "12", insulation: "THWN-2", insulationTempRatingC: 90, currentCarryingConductors: 2,
      lengthFt: 30, ambientTempC: 30, terminalTempRatingC: 75, egcSize: "12",
    });
    // 12 AWG: 25 A at 75 °C < 31.25 A → fail; 10 AWG: 35 A ≥ 31.25 A → pass
    expect(result(run(j), "stand-alone-output:C-6").status).toBe("fail");
    circuit(j, "C-6").size = "10";
    expect(result(run(j), "stand-alone-output:C-6").status).toBe("pass");
  });

  it("does not apply 710.15(B) to a grid-interactive system", () => {
    const r = run(exampleJson("ferncliff-farmhouse"));
    expect(r.results.some((x) => x.id === "stand-alone-output:C-6")).toBe(false);
  });
});

describe("back-fed breakers are held down", () => {
  it("passes the hut's plug-in CB-4 with its hold-down, citing 408.36(D) and 710.15(E)", () => {
    const r = result(run(exampleJson("tamarack-hut")), "stand-alone-output:CB-4");
    expect(r.status).toBe("pass");
    expect(r.codeRefs).toEqual(["NEC 2017 408.36(D)", "NEC 2017 710.15(E)"]);
  });

  it("fails a back-fed plug-in breaker without a hold-down; the remedy passes", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "CB-4").hasHoldDown = false;
    const r = result(run(j), "stand-alone-output:CB-4");
    expect(r.status).toBe("fail");
    expect(r.remedy?.changes).toEqual([{ path: "equipment.11.hasHoldDown", value: true }]);
    equipment(j, "CB-4").hasHoldDown = true;
    expect(result(run(j), "stand-alone-output:CB-4").status).toBe("pass");
  });

  it("asks how the breaker mounts; a bolt-on breaker passes", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "CB-4").breakerMounting;
    expect(result(run(j), "stand-alone-output:CB-4").missing).toEqual(["equipment.11.breakerMounting"]);
    equipment(j, "CB-4").breakerMounting = "bolt-on";
    expect(result(run(j), "stand-alone-output:CB-4").status).toBe("pass");
  });

  it("lets a breaker back-fed from an interactive-only inverter omit the fastener, in each edition's numbering", () => {
    const j = exampleJson("ferncliff-farmhouse");
    equipment(j, "INV-1").listedMode = "interactive";
    equipment(j, "CB-2").hasHoldDown = false;
    expect(result(run(j, "2017"), "stand-alone-output:CB-2").codeRefs).toContain("NEC 2017 705.12(D)(5)");
    const r = result(run(j, "2023"), "stand-alone-output:CB-2");
    expect(r.status).toBe("pass");
    expect(r.codeRefs).toContain("NEC 2023 705.12(E)");
  });
});

describe("generator and building disconnects", () => {
  it("passes the hut's portable generator on an inlet (listed UL 2201): the plug disconnects it", () => {
    const r = result(run(exampleJson("tamarack-hut")), "generator-disconnects:GEN-1");
    expect(r.status).toBe("pass");
    expect(r.values.find((x) => x.key === "installation")?.value).toBe("portable");
  });

  it("fails a wired-in portable generator without a disconnect at it; one standing at it passes", () => {
    const j = exampleJson("tamarack-hut");
    Object.assign(equipment(j, "GEN-1"), { connectedByInlet: false, hasOutputDisconnect: false });
    expect(result(run(j), "generator-disconnects:GEN-1").status).toBe("fail");
    j.equipment.push({ tag: "DS-9", kind: "disconnect", ratingA: 30, voltageRatingV: 240, currentType: "ac", locatedAtTag: "GEN-1" });
    expect(result(run(j), "generator-disconnects:GEN-1").status).toBe("pass");
  });

  it("reads the farmhouse standby set as stationary from its UL 2200 listing", () => {
    const r = result(run(exampleJson("ferncliff-farmhouse")), "generator-disconnects:GEN-1");
    expect(r.values.find((x) => x.key === "installation")?.value).toBe("stationary");
    expect(r.status).toBe("pass");
  });

  it("asks portable or stationary when the listing does not say", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "GEN-1").listing = "";
    expect(result(run(j), "generator-disconnects:GEN-1").missing).toEqual(["equipment.4.installation"]);
  });

  it("fails a generator feeder entering another building with no disconnect there; asks when not stated", () => {
    const j = exampleJson("tamarack-hut");
    delete circuit(j, "C-4").buildingDisconnectTag;
    expect(result(run(j), "generator-disconnects:C-4").status).toBe("fail");
    delete circuit(j, "C-4").feedsOtherBuilding;
    expect(result(run(j), "generator-disconnects:C-4").missing).toEqual(["circuits.3.feedsOtherBuilding"]);
  });

  it("cites 225.31 and 225.32 in 2017, 225.31(A) and (B) from 2020", () => {
    expect(result(run(exampleJson("tamarack-hut"), "2017"), "generator-disconnects:C-4").codeRefs).toEqual(["NEC 2017 225.31", "NEC 2017 225.32"]);
    expect(result(run(exampleJson("tamarack-hut"), "2020"), "generator-disconnects:C-4").codeRefs).toEqual(["NEC 2020 225.31(A)", "NEC 2020 225.31(B)"]);
  });
});
