import { describe, expect, it } from "vitest";
import { batteryKWh, conductorSizeText, isInverterKind, worst, worstStatus } from "../../../lib/schemas/vocabulary";

describe("the shared vocabulary", () => {
  it("ranks a fail above needs input above a warning, and an empty list has no worst", () => {
    expect(worst("pass", "warning", "needs-input")).toBe("needs-input");
    expect(worst("attest", "fail", "needs-input")).toBe("fail");
    expect(worst("pass", "not-applicable")).toBe("pass");
    expect(worst()).toBe("not-applicable");
    expect(worstStatus([])).toBeUndefined();
  });

  it("writes sizes as a conductor schedule does: AWG up to 4/0, kcmil from 250 (NEC 2020 Chapter 9 Table 8)", () => {
    expect(conductorSizeText("10")).toBe("10 AWG");
    expect(conductorSizeText("4/0", "al")).toBe("4/0 AWG Al");
    expect(conductorSizeText("250", "cu")).toBe("250 kcmil Cu");
  });

  it("takes a battery's energy from its kWh, else Ah × V: 100 Ah at 51.2 V is 5.12 kWh (arithmetic)", () => {
    const base = { tag: "B", kind: "battery", quantity: 1 } as never as Parameters<typeof batteryKWh>[0];
    expect(batteryKWh({ ...base, capacityAh: 100, nominalVoltageV: 51.2 })).toBeCloseTo(5.12, 6);
    expect(batteryKWh({ ...base, capacityKWh: 10, capacityAh: 100, nominalVoltageV: 51.2 })).toBe(10);
    expect(batteryKWh({ ...base, capacityAh: 100 })).toBeUndefined();
  });

  it("counts inverter-chargers and hybrid inverters as inverters, and charge controllers not", () => {
    expect(["inverter", "inverter-charger", "hybrid-inverter"].every(isInverterKind)).toBe(true);
    expect(isInverterKind("charge-controller")).toBe(false);
  });
});
