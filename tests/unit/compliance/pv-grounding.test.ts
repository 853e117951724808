/**
 * PV system grounding and DC ground-fault protection. Source: NEC 2017 690.41 as quoted in a published analysis of
 * the 2017 changes: (A) one or more of six configurations — (1) 2-wire with one functional grounded conductor,
 * (2) bipolar with a functional ground reference, (3) not isolated from a grounded inverter output, (4) ungrounded,
 * (5) solidly grounded as permitted in 690.41(B) Exception, (6) other methods with listed equipment; (B) DC PV arrays
 * shall have DC ground-fault protection, except arrays with not more than two PV source circuits and all PV system DC
 * circuits not on or in buildings, where solidly grounded. Same numbers in 2020 and 2023 (from memory).
 */
import { describe, expect, it } from "vitest";
import { array, circuit, equipment, exampleJson, result, run } from "./fixtures";

describe("PV system grounding and ground-fault protection (690.41)", () => {
  it("passes the demo arrays with the protection named, citing 690.41(A) and (B) in every edition", () => {
    for (const edition of ["2017", "2020", "2023"] as const) {
      const hut = result(run(exampleJson("tamarack-hut"), edition), "pv-grounding:PV-1");
      expect(hut.status).toBe("pass");
      expect(hut.message).toContain("CC-1");
      expect(hut.codeRefs).toEqual([`NEC ${edition} 690.41(A)`, `NEC ${edition} 690.41(B)`]);
    }
    const farm = run(exampleJson("ferncliff-farmhouse"));
    expect(result(farm, "pv-grounding:PV-1").status).toBe("pass");
    expect(result(farm, "pv-grounding:PV-2").status).toBe("pass");
  });

  it("lets a solidly grounded ground array of one source circuit off buildings go without protection (690.41(B) Exception)", () => {
    // Market stall: 1 source circuit ≤ 2, C-1 does not enter a building, ground mount.
    const r = result(run(exampleJson("market-stall")), "pv-grounding:PV-1");
    expect(r.status).toBe("pass");
    expect(r.message).toMatch(/Exception/);
  });

  it("fails a solidly grounded array with three source circuits", () => {
    const stall = exampleJson("market-stall");
    array(stall, "PV-1").stringsInParallel = 3; // 3 > 2 source circuits (690.41(B) Exception)
    const r = result(run(stall), "pv-grounding:PV-1");
    expect(r.status).toBe("fail");
    expect(r.remedy?.text).toMatch(/ground-fault protection/);
  });

  it("fails a solidly grounded array whose circuits enter a building, and asks when that is not recorded", () => {
    const stall = exampleJson("market-stall");
    circuit(stall, "C-1").entersBuilding = true;
    expect(result(run(stall), "pv-grounding:PV-1").status).toBe("fail");
    delete circuit(stall, "C-1").entersBuilding;
    const r = result(run(stall), "pv-grounding:PV-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["circuits.0.entersBuilding"]);
  });

  it("fails a functionally grounded array whose controller has no ground-fault protection", () => {
    const hut = exampleJson("tamarack-hut");
    equipment(hut, "CC-1").providesPvGroundFaultProtection = false;
    const r = result(run(hut), "pv-grounding:PV-1");
    expect(r.status).toBe("fail");
    expect(r.remedy?.text).toContain("690.41(B)");
    // A listed ground-fault device on the array's circuit (here the PV disconnect DS-1) clears it.
    equipment(hut, "DS-1").providesPvGroundFaultProtection = true;
    const fixed = result(run(hut), "pv-grounding:PV-1");
    expect(fixed.status).toBe("pass");
    expect(fixed.message).toContain("DS-1");
  });

  it("asks for the configuration, and for the equipment's protection when the record does not say", () => {
    const hut = exampleJson("tamarack-hut");
    delete hut.pvGroundingConfiguration;
    const r = result(run(hut), "pv-grounding:PV-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["pvGroundingConfiguration"]);

    const farm = exampleJson("ferncliff-farmhouse");
    delete equipment(farm, "INV-1").providesPvGroundFaultProtection;
    const f = result(run(farm), "pv-grounding:PV-1");
    expect(f.status).toBe("needs-input");
    expect(f.missing).toEqual(["equipment.1.providesPvGroundFaultProtection"]);
  });
});
