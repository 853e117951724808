import { describe, expect, it } from "vitest";
import { runChecks } from "@/lib/compliance";
import { exampleJson, parse } from "./fixtures";

const siting = (record: ReturnType<typeof parse>) => runChecks(record).results.find((r) => r.id === "storage-siting")!;

describe("the battery location is asked of every design with a battery", () => {
  it("asks for it on a building that is not a dwelling, naming the field, never passing", () => {
    const stall = parse(exampleJson("market-stall"));
    expect(stall.site.occupancy).toBe("other-building");
    expect(siting(stall).status).not.toBe("needs-input");
    const { batteryLocation: _gone, ...site } = stall.site;
    const without = { ...stall, site };
    expect(siting(without).status).toBe("needs-input");
    expect(siting(without).missing).toContain("site.batteryLocation");
  });

  it("asks for it on a dwelling too", () => {
    const hut = parse(exampleJson("tamarack-hut"));
    const { batteryLocation: _gone, ...site } = hut.site;
    const result = siting({ ...hut, site: { ...site, occupancy: "one-two-family-dwelling" } });
    expect(result.status).toBe("needs-input");
    expect(result.missing).toContain("site.batteryLocation");
  });

  it("does not ask without a battery", () => {
    const stall = parse(exampleJson("market-stall"));
    const { batteryLocation: _gone, ...site } = stall.site;
    const noBattery = { ...stall, site, equipment: stall.equipment.filter((e) => e.kind !== "battery"), circuits: stall.circuits.filter((c) => c.toTag !== "BAT-1" && c.fromTag !== "BAT-1") };
    expect(siting(noBattery).status).toBe("not-applicable");
  });
});
