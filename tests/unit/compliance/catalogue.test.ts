import { describe, expect, it } from "vitest";
import { CHECKS } from "@/lib/compliance";
import { CODE_TOPICS, INSULATION_TYPES, insulationType, racewayType } from "@/lib/compliance/tables";

describe("the check catalogue describes itself", () => {
  it("every definition is whole: id, title, a rule in words and a scope topic the citation map knows", () => {
    const ids = new Set<string>();
    for (const check of CHECKS) {
      expect(check.id, "id").toMatch(/^[a-z][a-z-]*$/);
      expect(ids.has(check.id), `duplicate id ${check.id}`).toBe(false);
      ids.add(check.id);
      expect(check.title.length, `${check.id} title`).toBeGreaterThan(3);
      expect(check.formula.length, `${check.id} formula`).toBeGreaterThan(10);
      expect(CODE_TOPICS, `${check.id} scope topic`).toContain(check.scopeTopic);
      expect(typeof check.run).toBe("function");
    }
  });
});

describe("wiring type pick-lists", () => {
  it("reads the temperature ratings of common insulation types (NEC 2020 Table 310.4(A), from memory)", () => {
    // THWN-2: 90 °C wet and dry; THHN: 90 °C dry only; TW: 60 °C; XHHW: 90 °C dry, 75 °C wet.
    expect(insulationType("thwn-2")).toMatchObject({ dryRatingC: 90, wetRatingC: 90 });
    expect(insulationType("THHN")?.wetRatingC).toBeUndefined();
    expect(insulationType("TW")).toMatchObject({ dryRatingC: 60, wetRatingC: 60 });
    expect(insulationType("XHHW")).toMatchObject({ dryRatingC: 90, wetRatingC: 75 });
    // NM-B: 90 °C conductors, ampacity at the 60 °C column (334.80).
    expect(insulationType("NM-B")?.ampacityColumnC).toBe(60);
    expect(insulationType("PV Wire")?.sunlightResistant).toBe(true);
    expect(insulationType("THWN-9")).toBeUndefined();
    expect(new Set(INSULATION_TYPES.map((t) => t.code)).size).toBe(INSULATION_TYPES.length);
  });
  it("tells metal raceways from non-metallic ones, as 690.31 asks inside a building", () => {
    expect(racewayType("EMT")?.metallic).toBe(true);
    expect(racewayType("PVC schedule 40")?.code).toBe("PVC-40");
    expect(racewayType("PVC schedule 80")?.metallic).toBe(false);
    expect(racewayType("rack cable")).toBeUndefined();
  });
});
