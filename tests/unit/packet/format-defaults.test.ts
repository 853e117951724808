import { describe, expect, it } from "vitest";
import { Trace } from "../../../lib/compliance/context";
import { formatCheckValue } from "../../../lib/packet/format";

describe("how a check input prints", () => {
  it("a default the engine used says so, with its value (30 °C module rise above ambient, common practice for rack-mounted modules)", () => {
    const t = new Trace();
    const rise = t.readOr("site.moduleTempRiseC", "Module temperature above ambient", undefined, 30, "°C");
    expect(rise).toBe(30);
    expect(formatCheckValue(t.inputs[0]!)).toBe("default: 30 °C (no value given)");
    expect(t.missing).toEqual([]);
  });

  it("a given value prints as given, not as a default", () => {
    const t = new Trace();
    t.readOr("site.moduleTempRiseC", "Module temperature above ambient", 25, 30, "°C");
    expect(formatCheckValue(t.inputs[0]!)).toBe("25 °C");
  });

  it("an optional field left empty reads 'not given'; a required one reads missing", () => {
    const t = new Trace();
    t.read("circuits.0.ambientTempC", "Ambient along the run", undefined, "°C");
    t.need("site.designHighTempC", "Design high temperature", undefined, "°C");
    expect(t.inputs.map(formatCheckValue)).toEqual(["not given", "— (missing)"]);
    expect(t.missing).toEqual(["site.designHighTempC"]);
  });
});

describe("timestamps in the printed set", () => {
  it("print as a dated time with its zone, not a raw ISO string", async () => {
    const { datedTime } = await import("../../../lib/packet/format");
    expect(datedTime("2026-12-02T14:20:59.412Z")).toBe("2 December 2026, 14:20 UTC");
  });
});
