/**
 * Storage siting states the threshold it measured against. Outside one- and two-family dwellings the fire code's
 * storage provisions apply only above its threshold quantities: NFPA 855 (2020) Table 1.3 and IFC 2021
 * Table 1207.1.1 — lithium-ion 20 kWh, lead-acid 70 kWh, nickel 70 kWh, other 10 kWh (from memory), with several
 * chemistries summed as fractions of their thresholds. In dwellings, detection is asked only where IRC 2021 R328.7
 * reaches (rooms within the dwelling, basements, attached garages; from memory), and storage under 1 kWh is outside
 * R328 altogether (R328.1 exception 2, from memory).
 */
import { describe, expect, it } from "vitest";
import { equipment, exampleJson, result, run, value } from "./fixtures";

describe("storage outside dwellings: the fire code threshold", () => {
  it("passes the market stall's 2 × 1.28 kWh lithium with the 20 kWh threshold named", () => {
    const r = result(run(exampleJson("market-stall")), "storage-siting");
    expect(r.status).toBe("pass");
    // 2 × 1.28 kWh = 2.56 kWh of LFP (lithium-ion), threshold 20 kWh (NFPA 855 Table 1.3, from memory)
    expect(value(r, "kWh:lithium-ion")).toBeCloseTo(2.56, 6);
    expect(value(r, "thresholdKWh:lithium-ion")).toBe(20);
    expect(r.message).toMatch(/2\.56 kWh.*20 kWh/);
    expect(r.codeRefs).toContain("NFPA 855 Table 1.3");
  });

  it("cites the fire code of each edition's usual companion", () => {
    expect(result(run(exampleJson("tamarack-hut"), "2017"), "storage-siting").codeRefs).toContain("IFC 2018 1206");
    expect(result(run(exampleJson("tamarack-hut"), "2020"), "storage-siting").codeRefs).toContain("IFC 2021 Table 1207.1.1");
    expect(result(run(exampleJson("tamarack-hut"), "2023"), "storage-siting").codeRefs).toContain("IFC 2024 Table 1207.1.1");
  });

  it("leaves 4 × 5.12 kWh of lithium (20.48 kWh > 20 kWh) for a person to confirm under the fire code", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "BAT-1").quantity = 4;
    const r = result(run(j), "storage-siting");
    expect(r.status).toBe("attest");
    expect(value(r, "thresholdRatio")).toBeCloseTo(20.48 / 20, 6);
  });

  it("reads lead-acid against 70 kWh, not 20 kWh", () => {
    const j = exampleJson("tamarack-hut");
    Object.assign(equipment(j, "BAT-1"), { chemistry: "lead-acid-flooded", capacityKWh: 12, quantity: 5 });
    // 60 kWh of lead-acid ≤ 70 kWh (NFPA 855 Table 1.3, from memory)
    const r = result(run(j), "storage-siting");
    expect(r.status).toBe("pass");
    expect(value(r, "thresholdKWh:lead-acid")).toBe(70);
  });

  it("sums mixed chemistries as shares of their thresholds: 12/20 + 35/70 = 1.1 is above", () => {
    const j = exampleJson("tamarack-hut");
    Object.assign(equipment(j, "BAT-1"), { capacityKWh: 6, quantity: 2 });
    j.equipment.push({ tag: "BAT-2", kind: "battery", chemistry: "lead-acid-agm", nominalVoltageV: 24, capacityKWh: 7, quantity: 5, listing: "UL 1973" });
    const r = result(run(j), "storage-siting");
    expect(value(r, "thresholdRatio")).toBeCloseTo(12 / 20 + 35 / 70, 6);
    expect(r.status).toBe("attest");
  });

  it("asks for the chemistry the threshold depends on", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "BAT-1").chemistry;
    const r = result(run(j), "storage-siting");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toContain("equipment.2.chemistry");
  });
});

describe("storage in dwellings: detection and exemption only where they apply", () => {
  it("does not ask for detection outdoors", () => {
    const j = exampleJson("ferncliff-farmhouse");
    j.site.batteryLocation = "outdoors";
    delete j.site.hasSmokeOrHeatDetection;
    const r = result(run(j), "storage-siting");
    expect(r.missing).not.toContain("site.hasSmokeOrHeatDetection");
    expect(r.status).not.toBe("needs-input");
  });

  it("asks for detection in a basement, and fails without it", () => {
    const j = exampleJson("ferncliff-farmhouse");
    j.site.batteryLocation = "basement";
    delete j.site.hasSmokeOrHeatDetection;
    expect(result(run(j), "storage-siting").missing).toContain("site.hasSmokeOrHeatDetection");
    j.site.hasSmokeOrHeatDetection = false;
    expect(result(run(j), "storage-siting").status).toBe("fail");
  });

  it("passes 0.5 kWh in a dwelling as under the 1 kWh threshold, saying so", () => {
    const j = exampleJson("ferncliff-farmhouse");
    Object.assign(equipment(j, "BAT-1"), { capacityKWh: 0.5, quantity: 1 });
    j.site.batteryLocation = "basement";
    delete j.site.hasSmokeOrHeatDetection;
    const r = result(run(j), "storage-siting");
    expect(r.status).toBe("pass");
    expect(value(r, "exemptBelowKWh")).toBe(1);
    expect(r.message).toMatch(/0\.50 kWh.*1 kWh/);
  });
});
