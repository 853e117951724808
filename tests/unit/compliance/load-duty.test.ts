import { describe, expect, it } from "vitest";
import { loadDailyWh, loadEnergyFormula, loadSummary } from "@/lib/compliance";
import { loadSchema } from "@/lib/schemas/project-record";
import { exampleJson, parse } from "./fixtures";

const load = (input: Record<string, unknown>) => loadSchema.parse({ name: "x", watts: 100, hoursPerDay: 1, ...input });

describe("a load's daily energy with its duty cycle and days a week (stand-alone load worksheet, common practice)", () => {
  it("takes a cycling load's share of its hours", () => {
    // A refrigerator rated 150 W whose compressor runs a third of the day: 150 W × 24 h × 1/3 = 1200 Wh (worked by hand).
    expect(loadDailyWh(load({ name: "Refrigerator", watts: 150, hoursPerDay: 24, dutyPct: 100 / 3 }))).toBeCloseTo(1200, 6);
    // Left empty, the duty is 100 %: 150 W × 8 h = 1200 Wh.
    expect(loadDailyWh(load({ watts: 150, hoursPerDay: 8 }))).toBe(1200);
  });

  it("averages a load used some days a week over the week", () => {
    // A 1,000 W well pump for 2 h on 3 days a week: 1000 × 2 × 3 ÷ 7 = 857.1 Wh a day on average (the load worksheet's days-per-week column).
    expect(loadDailyWh(load({ watts: 1000, hoursPerDay: 2, daysPerWeek: 3 }))).toBeCloseTo(857.14, 2);
    // With quantity and both factors: 2 × 60 W × 5 h × 50 % × 5/7 = 214.3 Wh.
    expect(loadDailyWh(load({ watts: 60, quantity: 2, hoursPerDay: 5, dutyPct: 50, daysPerWeek: 5 }))).toBeCloseTo(214.29, 2);
  });

  it("carries into the stand-alone sizing: the hut's refrigerator at a 35 % duty lowers the daily need", () => {
    const hut = parse(exampleJson("tamarack-hut"));
    const before = loadSummary(hut).dailyLoadWh;
    const withDuty = { ...hut, loads: [...hut.loads, load({ name: "Refrigerator", watts: 120, hoursPerDay: 24, dutyPct: 35 })] };
    // 120 W × 24 h × 35 % = 1008 Wh added (by hand), not the 2880 Wh of a refrigerator taken as running all day.
    expect(loadSummary(withDuty).dailyLoadWh - before).toBeCloseTo(1008, 6);
  });

  it("writes the figure out for a reader", () => {
    expect(loadEnergyFormula(load({ watts: 150, hoursPerDay: 24, dutyPct: 33 }))).toBe("150 W × 24 h × 33 % duty");
    expect(loadEnergyFormula(load({ watts: 1000, quantity: 2, hoursPerDay: 2, daysPerWeek: 3 }))).toBe("1000 W × 2 × 2 h × 3/7 days");
  });

  it("refuses a duty or a week outside what they can be, naming the range", () => {
    expect(loadSchema.safeParse({ name: "x", watts: 1, hoursPerDay: 1, dutyPct: 0 }).error?.issues[0]?.message).toMatch(/between 1 and 100 %/);
    expect(loadSchema.safeParse({ name: "x", watts: 1, hoursPerDay: 1, daysPerWeek: 8 }).error?.issues[0]?.message).toMatch(/1 and 7/);
    expect(loadSchema.safeParse({ name: "x", watts: 1, hoursPerDay: 1, daysPerWeek: 2.5 }).success).toBe(false);
  });
});
