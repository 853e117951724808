/**
 * A stand-alone system's single 120 V supply into a 120/240 V panel. Source: NEC 710.15(C) (2017–2023,
 * from memory): permitted only with no 240 V outlets and no multiwire branch circuits, and "the sum of
 * the ratings of the power sources shall be less than the rating of the neutral bus".
 */
import { describe, expect, it } from "vitest";
import { equipment, exampleJson, result, run, value } from "./fixtures";

describe("single 120 V supply (710.15(C))", () => {
  it("needs the panel's neutral bus rating instead of passing without it", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "P-1").neutralBusRatingA;
    const r = result(run(j), "stand-alone-supply");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["equipment.5.neutralBusRatingA"]);
  });

  it("compares the neutral bus with the sum of the sources, not one breaker", () => {
    const j = exampleJson("tamarack-hut");
    // Two 25 A inverters on the panel: 2 × 25 A = 50 A, not less than a 50 A neutral bus.
    equipment(j, "INV-1").quantity = 2;
    equipment(j, "P-1").neutralBusRatingA = 50;
    const r = result(run(j), "stand-alone-supply");
    expect(value(r, "sourcesSumA")).toBe(50);
    expect(r.status).toBe("fail");
    expect(r.message).toMatch(/50 A neutral bus/);
  });

  it("passes sources below the neutral bus", () => {
    // 25 A inverter output < 100 A neutral bus.
    const r = result(run(exampleJson("tamarack-hut")), "stand-alone-supply");
    expect(r.status).toBe("pass");
    expect(value(r, "sourcesSumA")).toBe(25);
  });

  it("fails 240 V outlets on a single 120 V supply", () => {
    const j = exampleJson("tamarack-hut");
    j.loads.push({ name: "Well pump", watts: 750, hoursPerDay: 1, voltageV: 240 });
    expect(result(run(j), "stand-alone-supply").status).toBe("fail");
  });

  it("needs the inverter's output when it is unknown and it feeds a 120/240 V panel", () => {
    const j = exampleJson("tamarack-hut");
    const inv = equipment(j, "INV-1");
    delete inv.acOutput;
    delete inv.acOutputVoltageV;
    const r = result(run(j), "stand-alone-supply");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toContain("equipment.3.acOutput");
  });
});
