/**
 * DC arc-fault protection. Sources: NEC 690.11 (2017, 2020, 2023: PV system DC circuits at 80 V or more between any
 * two conductors, protected by a listed PV arc-fault circuit interrupter or equivalent listed equipment; exception for
 * circuits not in or on buildings in metal raceway or underground), UL 1699B (the listing for PV DC arc-fault
 * protection). Figures from 690.7(A)(1) with the module's coefficient.
 */
import { describe, expect, it } from "vitest";
import { array, equipment, exampleJson, result, run } from "./fixtures";

describe("DC arc-fault protection (690.11)", () => {
  it("passes a string below 80 V with the figure", () => {
    // Market stall: one module, 37.4 V × (1 + 0.27 % × 33 °C) = 40.7 V < 80 V.
    const r = result(run(exampleJson("market-stall")), "pv-arc-fault:PV-1");
    expect(r.status).toBe("pass");
    expect(r.message).toContain("40.7 V");
  });

  it("passes an inverter whose listing names UL 1699B", () => {
    // Farmhouse: 8 × 49.5 V × (1 + 0.27 % × 47 °C) = 446.3 V ≥ 80 V; INV-1 listed UL 1699B.
    const r = result(run(exampleJson("ferncliff-farmhouse")), "pv-arc-fault:PV-1");
    expect(r.status).toBe("pass");
    expect(r.message).toContain("INV-1");
  });

  it("fails a roof array at 80 V or more whose inverter does not provide it, and names the remedy", () => {
    const farm = exampleJson("ferncliff-farmhouse");
    equipment(farm, "INV-1").providesPvArcFaultProtection = false;
    for (const edition of ["2017", "2020", "2023"] as const) {
      const r = result(run(farm, edition), "pv-arc-fault:PV-1");
      expect(r.status).toBe("fail");
      expect(r.codeRefs).toEqual([`NEC ${edition} 690.11`]);
      expect(r.remedy?.text).toContain("UL 1699B");
    }
  });

  it("is needs input naming the field when the equipment's arc-fault listing is unknown", () => {
    const farm = exampleJson("ferncliff-farmhouse");
    equipment(farm, "INV-1").listing = "UL 1741 SB";
    const r = result(run(farm), "pv-arc-fault:PV-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["equipment.1.providesPvArcFaultProtection"]);
  });

  it("asks a person to confirm the ground-mount exception instead of passing", () => {
    const hut = exampleJson("tamarack-hut");
    equipment(hut, "CC-1").providesPvArcFaultProtection = false;
    const r = result(run(hut), "pv-arc-fault:PV-1");
    expect(r.status).toBe("attest");
    expect(r.message).toMatch(/underground/);
  });

  it("follows the voltage across the threshold", () => {
    const stall = exampleJson("market-stall");
    equipment(stall, "CC-1").providesPvArcFaultProtection = false;
    stall.site.mounting = "roof";
    stall.site.roofClearanceIn = 4;
    // Two modules: 2 × 40.7 V = 81.5 V ≥ 80 V.
    array(stall, "PV-1").modulesInSeries = 2;
    expect(result(run(stall), "pv-arc-fault:PV-1").status).toBe("fail");
    array(stall, "PV-1").modulesInSeries = 1;
    expect(result(run(stall), "pv-arc-fault:PV-1").status).toBe("pass");
  });
});
