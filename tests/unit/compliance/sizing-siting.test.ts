import { describe, expect, it } from "vitest";
import { loadSummary } from "@/lib/compliance";
import { equipment, exampleJson, parse, result, run, value } from "./fixtures";

describe("load summary and stand-alone sizing (common practice)", () => {
  it("adds the loads through the inverter's efficiency and its idle draw over 24 h", () => {
    const s = loadSummary(parse(exampleJson("tamarack-hut")));
    // 10 × 6 W × 4 h + 500 W × 0.5 h + 15 W × 24 h + 50 W × 3 h + 30 W × 3 h = 240 + 250 + 360 + 150 + 90 = 1090 Wh
    expect(s.dailyLoadWh).toBeCloseTo(1090, 6);
    // 20 W idle × 24 h = 480 Wh
    expect(s.idleWh).toBe(480);
    // AC loads drawn through the 92 % inverter (common practice): 1090 ÷ 0.92 = 1184.78 Wh, a 94.78 Wh loss; + 480 Wh idle = 1664.78 Wh
    expect(s.conversionLossWh).toBeCloseTo(94.78, 2);
    expect(s.dailyTotalWh).toBeCloseTo(1664.78, 2);
    // 5.12 kWh × 90 % = 4608 Wh usable; 4608 ÷ 1664.78 = 2.77 days
    expect(s.usableStorageWh).toBeCloseTo(4608, 6);
    expect(s.autonomyDays).toBeCloseTo(2.768, 3);
    expect(s.largestSurgeW).toBe(1500);
  });

  it("warns below two days of autonomy (common practice: two to three)", () => {
    const j = exampleJson("tamarack-hut");
    delete j.daysOfAutonomy;
    j.loads.push({ name: "Space heater fan", watts: 100, hoursPerDay: 24 });
    // (1090 + 2400) ÷ 0.92 + 480 = 4273.5 Wh a day; 4608 Wh lasts 1.08 days < 2
    const r = result(run(j), "stand-alone-sizing");
    expect(value(r, "autonomyDays")).toBeCloseTo(1.078, 2);
    expect(r.status).toBe("warning");
    expect(r.reason).toMatch(/fewer than the 2 days/);
  });

  it("asks for the generator's hours when the array falls short, and warns without a generator", () => {
    const j = exampleJson("tamarack-hut");
    j.site.sunHoursPerDay = 2;
    // 800 W × 2 h × 0.75 = 1200 Wh < 1664.8 Wh
    expect(result(run(j), "stand-alone-sizing").status).toBe("attest");
    j.systemKind = "stand-alone";
    expect(result(run(j), "stand-alone-sizing").status).toBe("warning");
  });

  it("is not applicable to a grid-interactive system", () => {
    expect(result(run(exampleJson("ferncliff-farmhouse")), "stand-alone-sizing").status).toBe("not-applicable");
  });

  it("counts the inverter's efficiency: a bank that lasts 1.8 days does not meet a 2-day target", () => {
    const j = exampleJson("market-stall");
    equipment(j, "INV-1").efficiencyPct = 85;
    j.loads = [{ name: "Cold display", watts: 115.6, hoursPerDay: 8 }];
    // 115.6 W × 8 h = 924.8 Wh ÷ 0.85 = 1088 Wh + 8 W × 24 h = 1280 Wh; 2 × 1.28 kWh × 90 % = 2304 Wh ÷ 1280 = 1.8 days.
    // Without the efficiency it would read 924.8 + 192 = 1116.8 Wh → 2.06 days, a false pass.
    const r = result(run(j), "stand-alone-sizing");
    expect(value(r, "autonomyDays")).toBeCloseTo(1.8, 3);
    expect(r.status).toBe("warning");
    expect(r.formula).toMatch(/efficiency 85 %/);
    expect(r.formula).toMatch(/not counted/);
  });

  it("needs the inverter's efficiency", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "INV-1").efficiencyPct;
    const r = result(run(j), "stand-alone-sizing");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toContain("equipment.3.efficiencyPct");
  });

  it("needs the inverter's idle draw", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "INV-1").idleW;
    expect(result(run(j), "stand-alone-sizing").missing).toContain("equipment.3.idleW");
  });
});

describe("inverter capacity", () => {
  it("estimates a missing surge at twice the continuous rating (common practice) and flags it", () => {
    const j = exampleJson("market-stall");
    delete equipment(j, "INV-1").surgeW;
    const r = result(run(j), "inverter-capacity");
    // 600 W × 2 = 1200 W estimated surge
    expect(value(r, "surgeW")).toBe(1200);
    expect(r.status).toBe("warning");
  });

  it("fails when the largest start exceeds the surge", () => {
    const j = exampleJson("market-stall");
    j.loads.push({ name: "Blender", watts: 350, hoursPerDay: 0.2, surgeW: 1200 });
    // 1200 W start + 115 W of other loads running > 1200 W surge
    expect(result(run(j), "inverter-capacity").status).toBe("fail");
  });

  it("fails when simultaneous loads exceed the continuous rating", () => {
    const j = exampleJson("market-stall");
    j.loads.push({ name: "Kettle", watts: 1000, hoursPerDay: 0.2 });
    expect(result(run(j), "inverter-capacity").status).toBe("fail");
  });
});

describe("stand-alone supply (710.15)", () => {
  it("fails an inverter smaller than the largest single load", () => {
    const j = exampleJson("market-stall");
    j.loads.push({ name: "Coffee machine", watts: 900, hoursPerDay: 0.5, simultaneous: false });
    const r = result(run(j), "stand-alone-supply");
    expect(r.status).toBe("fail");
    expect(r.message).toContain("900 W");
  });

  it("requires the single-supply warning and no multiwire branch circuits on a 120/240 V panel fed at 120 V", () => {
    const j = exampleJson("tamarack-hut");
    const ok = result(run(j), "stand-alone-supply");
    expect(ok.status).toBe("pass");
    expect(ok.codeRefs).toContain("NEC 2017 710.15(C)");
    equipment(j, "P-1").hasMultiwireBranchCircuits = true;
    expect(result(run(j), "stand-alone-supply").status).toBe("fail");
  });
});

describe("battery terminals (common practice: three connections)", () => {
  it("fails four conductors on a terminal", () => {
    const j = exampleJson("tamarack-hut");
    for (const tag of ["DC-1", "DC-2"]) {
      j.equipment.push({ tag: `L-${tag}`, kind: "disconnect", ratingA: 30, voltageRatingV: 48, currentType: "dc" });
      j.circuits.push({ tag, fromTag: "BAT-1", toTag: `L-${tag}`, kind: "battery", designCurrentA: 10 });
    }
    const r = result(run(j), "battery-terminals:BAT-1");
    expect(value(r, "connections")).toBe(4);
    expect(r.status).toBe("fail");
    expect(r.message).toMatch(/bus bar/);
  });

  it("passes three", () => {
    const j = exampleJson("tamarack-hut");
    j.equipment.push({ tag: "L-1", kind: "disconnect", ratingA: 30, voltageRatingV: 48, currentType: "dc" });
    j.circuits.push({ tag: "DC-1", fromTag: "BAT-1", toTag: "L-1", kind: "battery", designCurrentA: 10 });
    expect(result(run(j), "battery-terminals:BAT-1").status).toBe("pass");
  });
});

describe("energy storage siting (IRC 2021 R328)", () => {
  it("passes the farmhouse garage: 20.48 kWh of 80 kWh", () => {
    const r = result(run(exampleJson("ferncliff-farmhouse")), "storage-siting");
    // IRC 2021 R328.5: 80 kWh aggregate in an attached garage; 20 kWh per unit
    expect(value(r, "aggregateKWh")).toBeCloseTo(20.48, 6);
    expect(value(r, "aggregateLimitKWh")).toBe(80);
    expect(r.status).toBe("pass");
  });

  it("fails 48 kWh in a utility closet (40 kWh limit)", () => {
    const j = exampleJson("ferncliff-farmhouse");
    j.site.batteryLocation = "utility-closet";
    equipment(j, "BAT-1").quantity = 9;
    // 9 × 5.12 = 46.08 kWh > 40 kWh, IRC 2021 R328.5
    expect(result(run(j), "storage-siting").status).toBe("fail");
  });

  it("fails a 25 kWh unit (20 kWh per unit)", () => {
    const j = exampleJson("ferncliff-farmhouse");
    equipment(j, "BAT-1").capacityKWh = 25;
    equipment(j, "BAT-1").quantity = 1;
    expect(result(run(j), "storage-siting").message).toMatch(/20 kWh/);
  });

  it("fails storage in a habitable room, or a garage without impact protection", () => {
    const j = exampleJson("ferncliff-farmhouse");
    j.site.batteryLocation = "habitable-room";
    expect(result(run(j), "storage-siting").status).toBe("fail");
    const k = exampleJson("ferncliff-farmhouse");
    k.site.hasVehicleImpactProtection = false;
    expect(result(run(k), "storage-siting").message).toMatch(/impact/);
  });

  it("fails units closer than 3 ft unless large-scale fire testing supports it", () => {
    const j = exampleJson("ferncliff-farmhouse");
    equipment(j, "BAT-1").largeScaleFireTested = false;
    // IRC 2021 R328.3.1: 3 ft (36 in) between units
    expect(result(run(j), "storage-siting").status).toBe("fail");
  });

  it("needs the location", () => {
    const j = exampleJson("ferncliff-farmhouse");
    delete j.site.batteryLocation;
    expect(result(run(j), "storage-siting").missing).toContain("site.batteryLocation");
  });
});

describe("panel busbar (705.12(B))", () => {
  it("applies the 120 % rule", () => {
    const r = result(run(exampleJson("ferncliff-farmhouse")), "panel-busbar:P-1");
    // NEC 2023 705.12(B)(3)(2): 1.25 × 33.3 A + 200 A = 241.6 A ≤ 1.2 × 225 A = 270 A
    expect(value(r, "lhsA")).toBeCloseTo(241.63, 2);
    expect(value(r, "rhsA")).toBe(270);
    expect(r.status).toBe("pass");
  });

  it("fails a 200 A bus with a 200 A main (241.6 A > 240 A) unless the sum of breakers fits", () => {
    const j = exampleJson("ferncliff-farmhouse");
    equipment(j, "P-1").busRatingA = 200;
    expect(result(run(j), "panel-busbar:P-1").status).toBe("fail");
    // Sum-of-breakers: 380 A − 200 A main = 180 A ≤ 200 A bus
    equipment(j, "P-1").sumOfBreakersA = 380;
    expect(result(run(j), "panel-busbar:P-1").status).toBe("pass");
  });

  it("checks a stand-alone inverter's output device against the bus", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "P-1").busRatingA = 30;
    expect(result(run(j), "panel-busbar:P-1").status).toBe("fail");
  });
});

describe("submittal completeness", () => {
  it("names the missing datasheet", () => {
    const j = exampleJson("tamarack-hut");
    j.attachments = j.attachments.filter((a: { equipmentTag?: string; kind: string }) => !(a.kind === "datasheet" && a.equipmentTag === "INV-1"));
    const r = result(run(j), "submittal-completeness");
    expect(r.status).toBe("fail");
    expect(r.message).toContain("no datasheet for INV-1");
  });

  it("asks for a site plan, storage listing and the structural letter where required", () => {
    const j = exampleJson("ferncliff-farmhouse");
    j.attachments = [];
    const r = result(run(j), "submittal-completeness");
    expect(r.message).toMatch(/no storage listing/);
    expect(r.message).toMatch(/no site plan/);
    expect(r.message).toMatch(/structural letter/);
  });

  it("follows the jurisdiction's list", () => {
    const j = exampleJson("market-stall");
    j.attachments = [];
    j.jurisdiction.requiredDocuments = [];
    expect(result(run(j), "submittal-completeness").status).toBe("pass");
  });
});

