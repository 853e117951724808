import { describe, expect, it } from "vitest";
import { array, circuit, equipment, exampleJson, result, run, value } from "./fixtures";

describe("circuit current (690.8(A))", () => {
  it("takes PV circuits at 125 % of Isc", () => {
    // NEC 690.8(A)(1): 1.25 × 10.45 A = 13.06 A
    expect(value(result(run(exampleJson("tamarack-hut")), "circuit-current:C-1"), "currentA")).toBeCloseTo(13.06, 2);
  });

  it("takes an inverter's DC input at rated power, lowest battery voltage and efficiency", () => {
    // NEC 2017 690.8(A)(4) (stand-alone inverter input, from memory): 3000 W ÷ (21 V × 0.92) = 155.28 A
    expect(value(result(run(exampleJson("tamarack-hut")), "circuit-current:C-3"), "currentA")).toBeCloseTo(155.28, 2);
  });

  it("takes a generator at its nameplate current, conductors at 115 % (445.13)", () => {
    const hut = run(exampleJson("tamarack-hut"));
    // 3.6 kW ÷ 120 V = 30 A; NEC 445.13(A): 1.15 × 30 A = 34.5 A
    expect(value(result(hut, "circuit-current:C-4"), "currentA")).toBeCloseTo(30, 5);
    expect(value(result(hut, "conductor-ampacity:C-4"), "requiredUnadjustedA")).toBeCloseTo(34.5, 5);
  });

  it("warns when the battery cannot supply the inverter's full draw", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "BAT-1").maxContinuousDischargeA = 100;
    expect(result(run(j), "circuit-current:C-3").status).toBe("warning");
  });

  it("says needs input when an inverter lacks its ratings", () => {
    const j = exampleJson("tamarack-hut");
    const inv = equipment(j, "INV-1");
    delete inv.minBatteryVoltageV;
    const r = result(run(j), "circuit-current:C-3");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toContain("equipment.3.minBatteryVoltageV");
  });
});

describe("conductor ampacity with conditions of use (690.8(B), 310.15)", () => {
  it("fails 10 AWG copper on a 30 A controller output: 35 A at 75 °C < 37.5 A", () => {
    const r = result(run(exampleJson("tamarack-hut")), "conductor-ampacity:C-2");
    // NEC 2017 Table 310.15(B)(16): 10 AWG Cu, 75 °C column = 35 A; 690.8(B)(1) / 706.30: 1.25 × 30 A = 37.5 A
    expect(value(r, "tableAtTerminalA")).toBe(35);
    expect(value(r, "requiredUnadjustedA")).toBeCloseTo(37.5, 5);
    expect(r.status).toBe("fail");
  });

  it("passes 8 AWG copper there: 50 A at 75 °C", () => {
    const j = exampleJson("tamarack-hut");
    circuit(j, "C-2").size = "8";
    const r = result(run(j), "conductor-ampacity:C-2");
    // NEC 2017 Table 310.15(B)(16): 8 AWG Cu 75 °C = 50 A
    expect(value(r, "tableAtTerminalA")).toBe(50);
    expect(r.status).toBe("pass");
  });

  it("applies ambient correction and the more-than-three-conductors adjustment", () => {
    const r = result(run(exampleJson("ferncliff-farmhouse")), "conductor-ampacity:C-1");
    // NEC 2023 Table 310.16: 10 AWG Cu 90 °C = 40 A; Table 310.15(B)(1)(1) 31–35 °C, 90 °C = 0.96;
    // Table 310.15(C)(1) 4–6 conductors = 0.80: 40 × 0.96 × 0.80 = 30.72 A
    expect(value(r, "correction")).toBe(0.96);
    expect(value(r, "adjustment")).toBe(0.8);
    expect(value(r, "allowedA")).toBeCloseTo(30.72, 2);
  });

  it("adds 33 °C for a raceway less than 7/8 in above the roof, except XHHW-2", () => {
    const j = exampleJson("ferncliff-farmhouse");
    circuit(j, "C-1").roofClearanceIn = 0.5;
    const r = result(run(j), "conductor-ampacity:C-1");
    // NEC 2023 310.15(B)(2): 34 °C + 33 °C = 67 °C; Table 310.15(B)(1)(1) 66–70 °C, 90 °C = 0.58: 40 × 0.58 × 0.8 = 18.56 A
    expect(value(r, "ambientC")).toBe(67);
    expect(value(r, "allowedA")).toBeCloseTo(18.56, 2);
    expect(r.codeRefs).toContain("NEC 2023 310.15(B)(2)");
    circuit(j, "C-1").insulation = "XHHW-2";
    expect(value(result(run(j), "conductor-ampacity:C-1"), "ambientC")).toBe(34);
  });

  it("limits to the terminal column (110.14(C))", () => {
    const j = exampleJson("tamarack-hut");
    circuit(j, "C-3").terminalTempRatingC = 60;
    const r = result(run(j), "conductor-ampacity:C-3");
    // NEC 2017 Table 310.15(B)(16): 3/0 Cu 60 °C = 165 A < 1.25 × 155.28 A = 194.1 A
    expect(value(r, "tableAtTerminalA")).toBe(165);
    expect(r.status).toBe("fail");
  });

  it("names each missing conductor field", () => {
    const j = exampleJson("tamarack-hut");
    delete circuit(j, "C-1").size;
    delete circuit(j, "C-1").currentCarryingConductors;
    const r = result(run(j), "conductor-ampacity:C-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(expect.arrayContaining(["circuits.0.size", "circuits.0.currentCarryingConductors"]));
  });
});

describe("overcurrent protection (690.9, 240.4, 240.6(A))", () => {
  it("fails 10 AWG on a 40 A breaker: 240.4(D) allows 30 A", () => {
    const r = result(run(exampleJson("tamarack-hut")), "overcurrent-protection:C-2");
    expect(r.status).toBe("fail");
    // NEC 2017 240.4(D)(7): 10 AWG copper, 30 A
    expect(value(r, "smallConductorMaxA")).toBe(30);
    expect(r.message).toContain("30 A (240.4(D))");
    expect(r.codeRefs).toContain("NEC 2017 240.4(D)");
  });

  it("fails a device below 125 % of the continuous current", () => {
    const j = exampleJson("market-stall");
    equipment(j, "CB-1").ratingA = 30;
    const r = result(run(j), "overcurrent-protection:C-2");
    // 1.25 × 30 A = 37.5 A > 30 A
    expect(r.status).toBe("fail");
    expect(r.message).toContain("37.5 A");
  });

  it("allows the next standard rating above the conductor's ampacity (240.4(B))", () => {
    const j = exampleJson("market-stall");
    // 4 AWG Cu at 75 °C = 85 A (Table 310.16); 240.6(A) next standard rating = 90 A
    equipment(j, "F-1").ratingA = 90;
    const r = result(run(j), "overcurrent-protection:C-3");
    expect(value(r, "maxByAmpacityA")).toBe(90);
    expect(r.status).toBe("pass");
    equipment(j, "F-1").ratingA = 100;
    expect(result(run(j), "overcurrent-protection:C-3").status).toBe("fail");
  });

  it("warns on a rating that is not standard in 240.6(A)", () => {
    const j = exampleJson("market-stall");
    equipment(j, "CB-1").ratingA = 42;
    expect(result(run(j), "overcurrent-protection:C-2").status).toBe("warning");
  });

  it("requires string fuses when parallel strings can exceed the module's series fuse rating", () => {
    const j = exampleJson("tamarack-hut");
    array(j, "PV-1").stringsInParallel = 3;
    equipment(j, "CC-1").maxPvInputCurrentA = 40;
    const r = result(run(j), "overcurrent-protection:C-1");
    // 690.9(A): 1.25 × 10.45 A × (3 − 1) = 26.1 A from the other strings > 20 A series fuse
    expect(value(r, "faultFromOtherStringsA")).toBeCloseTo(26.13, 2);
    expect(r.status).toBe("fail");
    array(j, "PV-1").stringsInParallel = 2;
    // 1.25 × 10.45 × 1 = 13.06 A ≤ 20 A: no fuse needed
    expect(result(run(j), "overcurrent-protection:C-1").status).toBe("pass");
  });

  it("fails a battery circuit with no overcurrent device", () => {
    const j = exampleJson("tamarack-hut");
    delete circuit(j, "C-3").ocpdTag;
    const r = result(run(j), "overcurrent-protection:C-3");
    expect(r.status).toBe("fail");
    expect(r.missing).toContain("circuits.2.ocpdTag");
  });
});

describe("equipment grounding conductors (250.122, 690.45)", () => {
  it.each([
    // NEC Table 250.122 (same in 2017/2020/2023): 30 A → 10 Cu, 40 A → 10 Cu, 200 A → 6 Cu
    ["C-4", "10"],
    ["C-2", "10"],
    ["C-3", "6"],
  ])("sizes the hut's %s EGC at %s AWG", (tag, size) => {
    const r = result(run(exampleJson("tamarack-hut")), `grounding:${tag}`);
    expect(r.values.find((x) => x.key === "requiredEgc")?.value).toBe(size);
    expect(r.status).toBe("pass");
  });

  it("sizes an unprotected PV circuit's EGC from the device 690.9(B) would call for", () => {
    const r = result(run(exampleJson("tamarack-hut")), "grounding:C-1");
    // 690.45: 1.25 × 13.06 A = 16.3 A → 20 A (240.6(A)) → Table 250.122: 12 AWG Cu
    expect(value(r, "ocpdA")).toBe(20);
    expect(r.values.find((x) => x.key === "requiredEgc")?.value).toBe("12");
  });

  it("fails a 12 AWG EGC on a 40 A breaker", () => {
    const j = exampleJson("tamarack-hut");
    circuit(j, "C-5").egcSize = "12";
    expect(result(run(j), "grounding:C-5").status).toBe("fail");
  });
});

describe("voltage drop (a recommendation: warns, never fails)", () => {
  it("computes the two-wire drop from Chapter 9 Table 8", () => {
    const r = result(run(exampleJson("tamarack-hut")), "voltage-drop:C-1");
    // Chapter 9 Table 8: 10 AWG stranded Cu 1.24 Ω/kft; 2 × 60 ft × 1.24 × 9.9 A ÷ 1000 = 1.473 V; ÷ 80.8 V = 1.82 %
    expect(value(r, "dropV")).toBeCloseTo(1.473, 3);
    expect(value(r, "dropPct")).toBeCloseTo(1.823, 2);
  });

  it("warns above 3 % and above a stricter local limit", () => {
    const j = exampleJson("tamarack-hut");
    circuit(j, "C-1").lengthFt = 150;
    expect(result(run(j), "voltage-drop:C-1").status).toBe("warning");
    const k = exampleJson("tamarack-hut");
    k.jurisdiction.voltageDropLimitPct = 1.5;
    const r = result(run(k), "voltage-drop:C-1");
    expect(r.status).toBe("warning");
    expect(r.message).toContain("Alder Bay County limit 1.5 %");
    expect(run(k).results.filter((x) => x.checkId === "voltage-drop").some((x) => x.status === "fail")).toBe(false);
  });
});

describe("string fuses on a PV output circuit", () => {
  it("fails three or more paralleled strings without source-circuit fuses", () => {
    const j = exampleJson("tamarack-hut");
    array(j, "PV-1").stringsInParallel = 3;
    equipment(j, "CC-1").maxPvInputCurrentA = 40;
    // The whole array on one output circuit, no source circuits recorded: 690.9(A), 1.25 × 10.45 × 2 = 26.1 A > 20 A
    circuit(j, "C-1").kind = "pv-output";
    const r = result(run(j), "overcurrent-protection:C-1");
    expect(r.status).toBe("fail");
    expect(r.message).toMatch(/fuse each string/);
  });
});

describe("handbook-style worked examples (from memory)", () => {
  it("derates 8 AWG THWN-2 for six conductors at 40 °C: 55 A × 0.80 × 0.91 = 40.04 A", () => {
    // From memory, after the NEC Handbook commentary on 310.15: Table 310.16 8 AWG Cu 90 °C = 55 A;
    // Table 310.15(B)(1) 36–40 °C, 90 °C = 0.91; Table 310.15(C)(1) 4–6 conductors = 0.80.
    const j = exampleJson("market-stall");
    j.equipment.push({ tag: "P-9", kind: "ac-panel", busRatingA: 100, voltage: "120/240" }, { tag: "CB-9", kind: "breaker", ratingA: 40, voltageRatingV: 240, currentType: "ac" });
    j.circuits.push({ tag: "BR-1", fromTag: "P-9", toTag: "CB-9", kind: "ac-branch", loadCurrentA: 30, nominalVoltageV: 240, size: "8", insulation: "THWN-2", insulationTempRatingC: 90, terminalTempRatingC: 75, currentCarryingConductors: 6, ambientTempC: 40, lengthFt: 50, ocpdTag: "CB-9", egcSize: "10" });
    const r = result(run(j), "conductor-ampacity:BR-1");
    expect(value(r, "correctedA")).toBeCloseTo(40.04, 2);
    // 1.25 × 30 A = 37.5 A ≤ 50 A (75 °C column) and 30 A ≤ 40.04 A: passes
    expect(r.status).toBe("pass");
  });

  it("corrects a 12-module string by Table 690.7(A) at −20 °C: 40 V × 12 × 1.18 = 566.4 V", () => {
    // From memory, after the NEC Handbook commentary on 690.7(A): Table 690.7(A), −16 to −20 °C → 1.18
    const j = exampleJson("ferncliff-farmhouse");
    const m = equipment(j, "MOD-1");
    m.vocV = 40;
    delete m.tempCoeffVocPctPerC;
    j.site.designLowTempC = -20;
    array(j, "PV-1").modulesInSeries = 12;
    for (const inp of equipment(j, "INV-1").mpptInputs) inp.maxVoltageV = 600;
    const r = result(run(j), "max-pv-voltage:PV-1");
    expect(value(r, "maxVoltageV")).toBeCloseTo(566.4, 1);
    expect(r.status).toBe("pass");
  });
});
