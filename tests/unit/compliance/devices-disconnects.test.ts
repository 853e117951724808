import { describe, expect, it } from "vitest";
import { circuit, equipment, exampleJson, result, run } from "./fixtures";

describe("device ratings and listings (110.3(B), 110.9, 690.4(B), 706.5)", () => {
  it("fails an AC-only breaker on a PV circuit", () => {
    const j = exampleJson("market-stall");
    j.equipment.push({ tag: "CB-9", kind: "breaker", ratingA: 25, voltageRatingV: 240, currentType: "ac", interruptingRatingA: 10000 });
    circuit(j, "C-1").ocpdTag = "CB-9";
    const r = result(run(j), "device-ratings:CB-9");
    expect(r.status).toBe("fail");
    expect(r.message).toMatch(/AC only/);
    expect(r.codeRefs).toContain("NEC 2020 690.4(B)");
  });

  it("fails a DC disconnect rated below the string's cold voltage", () => {
    const j = exampleJson("tamarack-hut");
    // Max string voltage 112.7 V (690.7) against a 100 V device
    equipment(j, "DS-1").voltageRatingV = 100;
    expect(result(run(j), "device-ratings:DS-1").status).toBe("fail");
    expect(result(run(j), "max-pv-voltage:PV-1").status).toBe("fail");
  });

  it("fails a battery fuse whose interrupting rating is below the battery's fault current", () => {
    const j = exampleJson("tamarack-hut");
    // Battery datasheet: 6000 A available short-circuit current; a 5000 A fuse cannot clear it (110.9)
    equipment(j, "F-1").interruptingRatingA = 5000;
    const r = result(run(j), "device-ratings:F-1");
    expect(r.status).toBe("fail");
    expect(r.message).toContain("6000 A");
    expect(r.codeRefs).toContain("NEC 2017 110.9");
  });

  it("adds up the fault current of paralleled battery units", () => {
    const j = exampleJson("ferncliff-farmhouse");
    // 4 units × 4500 A = 18000 A against a 20000 A fuse: passes; a fifth unit makes 22500 A
    expect(result(run(j), "device-ratings:F-2").status).toBe("pass");
    equipment(j, "BAT-1").quantity = 5;
    expect(result(run(j), "device-ratings:F-2").status).toBe("fail");
  });

  it("asks where the battery fuse stands, and warns when it is far from the terminals", () => {
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "F-1").distanceFromBatteryFt;
    expect(result(run(j), "device-ratings:F-1").missing).toContain("equipment.8.distanceFromBatteryFt");
    equipment(j, "F-1").distanceFromBatteryFt = 12;
    expect(result(run(j), "device-ratings:F-1").status).toBe("warning");
  });

  it("fails an inverter listed for a mode it does not run in", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "INV-1").listedMode = "interactive";
    expect(result(run(j), "device-ratings:INV-1").status).toBe("fail");
    const k = exampleJson("ferncliff-farmhouse");
    equipment(k, "INV-1").listedMode = "stand-alone";
    expect(result(run(k), "device-ratings:INV-1").status).toBe("fail");
  });

  it("fails storage not listed as an energy storage system", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "BAT-1").listing = "UL 1973";
    expect(result(run(j), "device-ratings:BAT-1").status).toBe("fail");
  });
});

describe("disconnecting means (690.13, 690.15, 706.15, 445.18)", () => {
  it("fails an array with no PV disconnect", () => {
    const j = exampleJson("tamarack-hut");
    circuit(j, "C-1").disconnectTags = [];
    const r = result(run(j), "disconnects:PV-1");
    expect(r.status).toBe("fail");
    expect(r.codeRefs).toContain("NEC 2017 690.13");
  });

  it("counts a disconnect built into the inverter", () => {
    const j = exampleJson("ferncliff-farmhouse");
    expect(result(run(j), "disconnects:PV-1").status).toBe("pass");
    equipment(j, "INV-1").hasPvDisconnect = false;
    expect(result(run(j), "disconnects:PV-1").status).toBe("fail");
  });

  it("fails a battery with only fuses between it and the loads", () => {
    const j = exampleJson("ferncliff-farmhouse");
    circuit(j, "C-4").disconnectTags = [];
    const r = result(run(j), "disconnects:BAT-1");
    expect(r.status).toBe("fail");
    // NEC 2023 706.15 (2017 706.7)
    expect(r.codeRefs).toContain("NEC 2023 706.15");
  });

  it("fails an inverter whose DC side has no disconnect", () => {
    const j = exampleJson("tamarack-hut");
    circuit(j, "C-3").disconnectTags = [];
    expect(result(run(j), "disconnects:INV-1").status).toBe("fail");
  });
});

describe("rapid shutdown (690.12)", () => {
  it("fails a roof-mounted array with no method named", () => {
    const j = exampleJson("ferncliff-farmhouse");
    delete j.rapidShutdownMethod;
    const r = result(run(j), "rapid-shutdown");
    expect(r.status).toBe("fail");
    expect(r.missing).toContain("rapidShutdownMethod");
  });

  it("fails a method with no devices", () => {
    const j = exampleJson("ferncliff-farmhouse");
    j.equipment = j.equipment.filter((e: { kind: string }) => e.kind !== "rapid-shutdown");
    j.attachments = j.attachments.filter((a: { equipmentTag?: string }) => a.equipmentTag !== "RSD-1");
    expect(result(run(j), "rapid-shutdown").status).toBe("fail");
  });

  it("is not applicable to a ground mount whose PV circuits stay outside buildings, with the reason", () => {
    const r = result(run(exampleJson("market-stall")), "rapid-shutdown");
    expect(r.status).toBe("not-applicable");
    expect(r.reason).toMatch(/ground-mounted/);
  });
});
