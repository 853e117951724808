import { describe, expect, it } from "vitest";
import { STORAGE_LOCATION_KINDS, storageSitingRules } from "@/lib/compliance/tables";
import { BATTERY_LOCATIONS, RESIDENTIAL_CODES } from "@/lib/schemas/project-record";

describe("energy storage siting rules", () => {
  it("IRC 2021 R328: 20 kWh per unit; 40 / 80 / 80 / 80 kWh aggregate", () => {
    const rules = storageSitingRules("IRC-2021");
    expect(rules.code).toBe("IRC-2021");
    expect(rules.section).toBe("IRC 2021 R328");
    // IRC 2021 R328.5: individual units at most 20 kWh.
    expect(rules.maxUnitKWh).toBe(20);
    // IRC 2021 R328.5 item 1: 40 kWh in utility closets, basements, storage or utility spaces.
    expect(rules.aggregateKWhByLocation["utility-closet"]).toBe(40);
    expect(rules.aggregateKWhByLocation.basement).toBe(40);
    expect(rules.aggregateKWhByLocation["storage-room"]).toBe(40);
    // IRC 2021 R328.5 item 2: 80 kWh in attached or detached garages and detached accessory structures.
    expect(rules.aggregateKWhByLocation.garage).toBe(80);
    expect(rules.aggregateKWhByLocation["accessory-building"]).toBe(80);
    // IRC 2021 R328.5 items 3 and 4: 80 kWh on exterior walls, 80 kWh outdoors on the ground.
    expect(rules.aggregateKWhByLocation["exterior-wall"]).toBe(80);
    expect(rules.aggregateKWhByLocation.outdoors).toBe(80);
    // IRC 2021 R328.4: not in habitable spaces or sleeping rooms.
    expect(rules.aggregateKWhByLocation["habitable-room"]).toBeNull();
    // IRC 2021 R328.3.1: 3 ft between units unless large-scale fire testing supports less.
    expect(rules.minSpacingIn).toBe(36);
    // IRC 2021 R328.7: smoke alarms (heat detector where smoke alarms cannot go).
    expect(rules.requiresDetectionIn).toEqual(["utility-closet", "basement", "storage-room", "garage"]);
    // IRC 2021 R328.8: impact protection where subject to vehicle damage (garages).
    expect(rules.requiresImpactProtectionIn).toEqual(["garage"]);
    // IRC 2021 R328.4 item 3: exterior walls and outdoors at least 3 ft from doors and windows.
    expect(rules.minFromDoorsAndWindowsIn).toBe(36);
  });

  it("IRC 2024 R330 carries the same limits under its own section (from memory)", () => {
    const rules = storageSitingRules("IRC-2024");
    expect(rules.code).toBe("IRC-2024");
    expect(rules.section).toBe("IRC 2024 R330");
    expect(rules.sections.energyRatings).toBe("IRC 2024 R330.5");
    expect(rules.maxUnitKWh).toBe(20);
    expect(rules.aggregateKWhByLocation.basement).toBe(40);
    expect(rules.aggregateKWhByLocation.garage).toBe(80);
    expect(rules.aggregateKWhByLocation["habitable-room"]).toBeNull();
    expect(rules.minSpacingIn).toBe(36);
  });

  it.each(["IRC-2018", "none"] as const)("%s falls back to NFPA 855 chapter 15", (code) => {
    // IRC 2018 R327 sets no per-location energy limits (from memory); NFPA 855 (2020) chapter 15 has the values IRC 2021 adopted.
    const rules = storageSitingRules(code);
    expect(rules.code).toBe("NFPA-855");
    expect(rules.section).toBe("NFPA 855 chapter 15");
    expect(rules.maxUnitKWh).toBe(20);
    expect(rules.aggregateKWhByLocation["utility-closet"]).toBe(40);
    expect(rules.aggregateKWhByLocation.outdoors).toBe(80);
    expect(rules.aggregateKWhByLocation["habitable-room"]).toBeNull();
    expect(rules.minSpacingIn).toBe(36);
    expect(rules.requiresDetectionIn).toEqual(["utility-closet", "basement", "storage-room", "garage"]);
  });

  it("has a limit or a prohibition for every location the record can hold", () => {
    expect([...STORAGE_LOCATION_KINDS].sort()).toEqual([...BATTERY_LOCATIONS].sort());
    for (const code of RESIDENTIAL_CODES) {
      const rules = storageSitingRules(code);
      for (const location of BATTERY_LOCATIONS) {
        expect(location in rules.aggregateKWhByLocation, `${code} ${location}`).toBe(true);
      }
    }
  });

  it("hands out copies, so one check cannot alter another's rules", () => {
    const a = storageSitingRules("IRC-2021");
    a.aggregateKWhByLocation.garage = 1000;
    a.requiresImpactProtectionIn.push("outdoors");
    const b = storageSitingRules("IRC-2021");
    expect(b.aggregateKWhByLocation.garage).toBe(80);
    expect(b.requiresImpactProtectionIn).toEqual(["garage"]);
  });
});
