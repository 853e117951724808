import { describe, expect, it } from "vitest";
import { array, equipment, exampleJson, result, run, value } from "./fixtures";

describe("maximum PV system voltage (690.7)", () => {
  it("corrects Voc with the module's coefficient, 690.7(A)(1)", () => {
    const j = exampleJson("tamarack-hut");
    const r = result(run(j), "max-pv-voltage:PV-1");
    // NEC 2017 690.7(A)(1): Vmax = Voc × N × (1 + αVoc × (Tlow − 25 °C))
    // 48.6 V × 2 × (1 + (−0.0029) × (−30 − 25)) = 97.2 × 1.1595 = 112.70 V
    expect(value(r, "maxVoltageV")).toBeCloseTo(112.7, 1);
    expect(r.codeRefs).toContain("NEC 2017 690.7(A)");
  });

  it("falls back to Table 690.7(A) without a coefficient", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "MOD-1").tempCoeffVocPctPerC;
    j.site.designLowTempC = -30;
    const r = result(run(j), "max-pv-voltage:PV-1");
    // NEC 2017 Table 690.7(A): −26 to −30 °C → 1.21; 97.2 V × 1.21 = 117.61 V
    expect(value(r, "correctionFactor")).toBe(1.21);
    expect(value(r, "maxVoltageV")).toBeCloseTo(117.61, 1);
    expect(r.codeRefs).toContain("NEC 2017 Table 690.7(A)");
  });

  it.each([
    // NEC Table 690.7(A) rows (2017/2020/2023 identical): 24–20 °C 1.02, 4–0 °C 1.10, −6 to −10 °C 1.14, −36 to −40 °C 1.25
    [22, 1.02],
    [0, 1.1],
    [-10, 1.14],
    [-40, 1.25],
  ])("Table 690.7(A) at %s °C is %s", (lowC, factor) => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "MOD-1").tempCoeffVocPctPerC;
    j.site.designLowTempC = lowC;
    expect(value(result(run(j), "max-pv-voltage:PV-1"), "correctionFactor")).toBe(factor);
  });

  it("two ~48 V modules stay under a 150 V controller at cold; three fail (common practice)", () => {
    const two = exampleJson("tamarack-hut");
    expect(result(run(two), "max-pv-voltage:PV-1").status).toBe("pass");
    const three = exampleJson("tamarack-hut");
    array(three, "PV-1").modulesInSeries = 3;
    const r = result(run(three), "max-pv-voltage:PV-1");
    // 48.6 V × 3 × 1.1595 = 169.06 V > 150 V controller input
    expect(value(r, "maxVoltageV")).toBeCloseTo(169.06, 1);
    expect(r.status).toBe("fail");
    expect(r.message).toContain("150 V");
  });

  it("catches a string that only fits before the cold correction", () => {
    const j = exampleJson("tamarack-hut");
    // Uncorrected: 3 × 46 V = 138 V, under 150 V — the mistake is to stop there.
    equipment(j, "MOD-1").vocV = 46;
    array(j, "PV-1").modulesInSeries = 3;
    j.site.designLowTempC = -20;
    const r = result(run(j), "max-pv-voltage:PV-1");
    // 138 V × (1 + 0.0029 × 45) = 138 × 1.1305 = 156.0 V > 150 V
    expect(value(r, "stringVocV")).toBeCloseTo(138, 5);
    expect(value(r, "maxVoltageV")).toBeCloseTo(156.0, 1);
    expect(r.status).toBe("fail");
  });

  it("eight ~49.5 V modules in series suit a 480–500 V hybrid input; nine do not (common practice)", () => {
    const j = exampleJson("ferncliff-farmhouse");
    for (const inp of equipment(j, "INV-1").mpptInputs) inp.maxVoltageV = 480;
    const eight = run(j);
    // 49.5 V × 8 × (1 + 0.0027 × 47) = 396 × 1.1269 = 446.25 V ≤ 480 V
    expect(value(result(eight, "max-pv-voltage:PV-1"), "maxVoltageV")).toBeCloseTo(446.25, 1);
    expect(result(eight, "max-pv-voltage:PV-1").status).toBe("pass");
    array(j, "PV-1").modulesInSeries = 9;
    // 49.5 × 9 × 1.1269 = 502.0 V > 480 V
    expect(result(run(j), "max-pv-voltage:PV-1").status).toBe("fail");
  });

  it("holds one- and two-family dwellings to 600 V and other buildings to 1000 V (690.7)", () => {
    const j = exampleJson("ferncliff-farmhouse");
    for (const inp of equipment(j, "INV-1").mpptInputs) inp.maxVoltageV = 1000;
    array(j, "PV-1").modulesInSeries = 12;
    // 49.5 × 12 × 1.1269 = 669.4 V: above 600 V on a dwelling
    const dwelling = result(run(j), "max-pv-voltage:PV-1");
    expect(dwelling.status).toBe("fail");
    expect(dwelling.message).toMatch(/dwelling/);
    j.site.occupancy = "other-building";
    expect(result(run(j), "max-pv-voltage:PV-1").status).toBe("pass");
  });

  it("compares with the module's own system voltage rating", () => {
    const j = exampleJson("ferncliff-farmhouse");
    equipment(j, "MOD-1").maxSystemVoltageV = 400;
    expect(result(run(j), "max-pv-voltage:PV-1").status).toBe("fail");
  });

  it("says needs input, naming the field, without a design low temperature", () => {
    const j = exampleJson("tamarack-hut");
    delete j.site.designLowTempC;
    const r = result(run(j), "max-pv-voltage:PV-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toContain("site.designLowTempC");
  });

  it("needs the module coefficient below the table's −40 °C", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "MOD-1").tempCoeffVocPctPerC;
    j.site.designLowTempC = -45;
    const r = result(run(j), "max-pv-voltage:PV-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toContain("equipment.0.tempCoeffVocPctPerC");
  });
});

describe("MPPT window at the design high temperature", () => {
  it("keeps the hut's string above the battery charge voltage with headroom", () => {
    const r = result(run(exampleJson("tamarack-hut")), "mppt-window:PV-1");
    // Cell 30 °C + 30 °C rise (common practice) = 60 °C; 40.4 V × 2 × (1 − 0.0037 × 35) = 70.34 V > 28.8 + 5 V
    expect(value(r, "hotVmpV")).toBeCloseTo(70.34, 1);
    expect(r.status).toBe("pass");
  });

  it("fails a single 36-cell module charging a 24 V battery on a hot day", () => {
    const j = exampleJson("tamarack-hut");
    array(j, "PV-1").modulesInSeries = 1;
    // 18 V × (1 − 0.0037 × 35) = 15.7 V, below 28.8 V charge + 5 V headroom (common practice)
    equipment(j, "MOD-1").vmpV = 18;
    equipment(j, "MOD-1").vocV = 22;
    expect(result(run(j), "mppt-window:PV-1").status).toBe("fail");
  });

  it("fails an array whose Isc exceeds the input's current limit", () => {
    const j = exampleJson("ferncliff-farmhouse");
    equipment(j, "INV-1").mpptInputs[0].maxCurrentA = 12;
    const r = result(run(j), "mppt-window:PV-1");
    expect(r.status).toBe("fail");
    expect(r.message).toContain("13.85 A");
  });
});
