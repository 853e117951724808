/**
 * Rapid shutdown and the building voltage limits depend on whether PV DC circuits are on or in a building.
 * Sources (from memory, same numbering in NEC 2017, 2020 and 2023):
 *  - 690.12: PV system circuits installed on or in buildings; 690.12(B)(2) inside the array boundary is met by
 *    a listed PV hazard control system, 80 V or less within 30 s, or PV arrays with no exposed wiring methods or
 *    conductive parts; the exception for ground-mounted PV circuits entering a building that houses PV equipment only.
 *  - 690.7: 600 V on or in one- and two-family dwellings, 1000 V on or in other buildings; not on or in
 *    buildings, listed DC PV equipment up to 1500 V.
 */
import { describe, expect, it } from "vitest";
import { array, circuit, equipment, exampleJson, result, run, value, type Json } from "./fixtures";

describe("rapid shutdown inside the array boundary (690.12(B)(2))", () => {
  it("fails shutdown at the array boundary alone on a roof-mounted array", () => {
    const j = exampleJson("ferncliff-farmhouse");
    j.rapidShutdownMethod = "array-boundary";
    equipment(j, "RSD-1").method = "array-boundary";
    j.rapidShutdownInsideBoundary = "none";
    const r = result(run(j), "rapid-shutdown");
    expect(r.status).toBe("fail");
    expect(r.codeRefs).toContain("NEC 2023 690.12(B)(2)");
  });

  it("needs the record to name how the inside-boundary requirement is met", () => {
    const j = exampleJson("ferncliff-farmhouse");
    delete j.rapidShutdownInsideBoundary;
    const r = result(run(j), "rapid-shutdown");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["rapidShutdownInsideBoundary"]);
  });

  it("passes when the record names a listed hazard control system", () => {
    const r = result(run(exampleJson("ferncliff-farmhouse")), "rapid-shutdown");
    expect(r.status).toBe("pass");
    expect(r.message).toMatch(/listed PV hazard control system/);
  });
});

describe("ground-mounted PV circuits that enter a building (690.12)", () => {
  it("applies when the circuit enters an occupied building: never not applicable", () => {
    const j = exampleJson("tamarack-hut");
    delete j.rapidShutdownMethod;
    const r = result(run(j), "rapid-shutdown");
    expect(r.status).toBe("fail");
    expect(r.message).toMatch(/enters a building/);
  });

  it("takes the PV-only-building exception only where the designer states it", () => {
    const j = exampleJson("tamarack-hut");
    delete j.rapidShutdownMethod;
    j.site.pvOnlyBuilding = true;
    const r = result(run(j), "rapid-shutdown");
    expect(r.status).toBe("not-applicable");
    expect(r.codeRefs).toContain("NEC 2017 690.12 Exception");
    j.site.pvOnlyBuilding = false;
    expect(result(run(j), "rapid-shutdown").status).toBe("fail");
  });

  it("needs to know whether a ground array's circuit enters a building when no method is named", () => {
    const j = exampleJson("tamarack-hut");
    delete j.rapidShutdownMethod;
    delete circuit(j, "C-1").entersBuilding;
    const r = result(run(j), "rapid-shutdown");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["circuits.0.entersBuilding", "rapidShutdownMethod"]);
  });
});

describe("the 1500 V limit off buildings (690.7)", () => {
  /** The stall's module at 30 in series: 37.4 V × 30 × (1 + 0.0027 × 33) = 1222.0 V at −8 °C. */
  function longString(): Json {
    const j = exampleJson("market-stall");
    array(j, "PV-1").modulesInSeries = 30;
    equipment(j, "MOD-1").maxSystemVoltageV = 1500;
    equipment(j, "CC-1").maxPvInputVoltageV = 1500;
    equipment(j, "DS-1").voltageRatingV = 1500;
    return j;
  }

  it("allows up to 1500 V where the PV circuits do not enter a building, and says so", () => {
    const r = result(run(longString()), "max-pv-voltage:PV-1");
    // 690.7(A)(1): 1122 V × (1 + 0.0027 × (25 − (−8))) = 1122 × 1.0891 = 1221.97 V ≤ 1500 V
    expect(value(r, "maxVoltageV")).toBeCloseTo(1221.97, 1);
    expect(r.status).toBe("pass");
    expect(r.values.some((x) => x.value === 1500 && /not on or in a building/.test(x.label))).toBe(true);
  });

  it("keeps 1000 V where the circuit enters a building other than a dwelling", () => {
    const j = longString();
    circuit(j, "C-1").entersBuilding = true;
    const r = result(run(j), "max-pv-voltage:PV-1");
    expect(r.status).toBe("fail");
    expect(r.message).toMatch(/1000 V/);
  });

  it("keeps the building limit while the field is empty (the stricter reading)", () => {
    const j = longString();
    delete circuit(j, "C-1").entersBuilding;
    expect(result(run(j), "max-pv-voltage:PV-1").status).toBe("fail");
  });
});
