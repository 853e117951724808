/**
 * PV wiring methods. Sources: NEC 690.31(A) (2017, 2020, 2023, from memory): PV source and output circuits over 30 V
 * in readily accessible locations are guarded or installed in Type MC cable or raceway. NEC 2017 690.31(G) (from
 * memory): PV DC circuits inside a building run in metal raceway, Type MC cable or metal enclosures from the
 * penetration to the first readily accessible disconnect; NEC 2020/2023 690.31(D) (from memory): inside buildings,
 * PV DC circuits exceeding 30 V or 8 A are in metal raceway, MC cable or metal enclosures, and raceways are marked
 * (690.31(D)(2); 690.31(G)(3) in 2017). Voltages from 690.7(A)(1) with the module's coefficient; currents 690.8(A)(1).
 */
import { describe, expect, it } from "vitest";
import { circuit, equipment, exampleJson, result, run, value, type Json } from "./fixtures";

function applyRemedy(json: Json, changes: { path: string; value: unknown }[]): void {
  for (const { path, value } of changes) {
    const keys = path.split(".");
    let at = json;
    for (const k of keys.slice(0, -1)) at = at[k];
    at[keys[keys.length - 1]!] = value;
  }
}

describe("PV wiring methods (690.31)", () => {
  it("passes the demo PV circuits and cites the building rule in each edition's numbering", () => {
    const cites = { "2017": "690.31(G)", "2020": "690.31(D)", "2023": "690.31(D)" } as const;
    const marks = { "2017": "690.31(G)(3)", "2020": "690.31(D)(2)", "2023": "690.31(D)(2)" } as const;
    for (const edition of ["2017", "2020", "2023"] as const) {
      // Hut C-1: 2 × 48.6 V × (1 + 0.29 % × 55 °C) = 112.7 V, readily accessible, in RMC, entering the hut.
      const r = result(run(exampleJson("tamarack-hut"), edition), "pv-wiring-methods:C-1");
      expect(r.status).toBe("pass");
      expect(value(r, "maxVoltageV")).toBeCloseTo(112.7, 1);
      expect(r.codeRefs).toEqual([`NEC ${edition} 690.31(A)`, `NEC ${edition} ${cites[edition]}`, `NEC ${edition} ${marks[edition]}`]);
      expect(r.message).toContain("PHOTOVOLTAIC POWER SOURCE");
    }
    const farm = run(exampleJson("ferncliff-farmhouse"));
    expect(result(farm, "pv-wiring-methods:C-1").status).toBe("pass");
    expect(result(run(exampleJson("market-stall")), "pv-wiring-methods:C-1").status).toBe("pass");
  });

  it("fails a readily accessible circuit over 30 V in free air, unguarded; raceway or a guard clears it", () => {
    const stall = exampleJson("market-stall");
    // Stall C-1: 37.4 V × (1 + 0.27 % × 33 °C) = 40.7 V > 30 V.
    circuit(stall, "C-1").readilyAccessible = true;
    const ask = result(run(stall), "pv-wiring-methods:C-1");
    expect(ask.status).toBe("needs-input");
    expect(ask.missing).toEqual(["circuits.0.guarded"]);
    circuit(stall, "C-1").guarded = false;
    const fail = result(run(stall), "pv-wiring-methods:C-1");
    expect(fail.status).toBe("fail");
    expect(fail.codeRefs).toContain("NEC 2020 690.31(A)");
    expect(fail.remedy?.text).toContain("40.7 V");
    applyRemedy(stall, fail.remedy!.changes);
    expect(result(run(stall), "pv-wiring-methods:C-1").status).toBe("pass");
    circuit(stall, "C-1").racewayType = "FREE-AIR";
    circuit(stall, "C-1").guarded = true;
    expect(result(run(stall), "pv-wiring-methods:C-1").status).toBe("pass");
  });

  it("fails a PV circuit inside a building in non-metallic conduit, in every edition, and EMT passes", () => {
    for (const edition of ["2017", "2020", "2023"] as const) {
      const hut = exampleJson("tamarack-hut");
      circuit(hut, "C-1").racewayType = "PVC-80";
      const r = result(run(hut, edition), "pv-wiring-methods:C-1");
      expect(r.status).toBe("fail");
      expect(r.message).toMatch(/not metal raceway or MC cable/);
      applyRemedy(hut, r.remedy!.changes);
      expect(result(run(hut, edition), "pv-wiring-methods:C-1").status).toBe("pass");
    }
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-1").racewayType = "MC";
    expect(result(run(hut), "pv-wiring-methods:C-1").status).toBe("pass");
  });

  it("from 2020 leaves a circuit of at most 30 V and 8 A free of the metal rule; 2017 has no threshold", () => {
    const stall = exampleJson("market-stall");
    // A 36-cell module: 22 V × (1 + 0.27 % × 33 °C) = 23.96 V ≤ 30 V; 1.25 × 6 A = 7.5 A ≤ 8 A.
    Object.assign(equipment(stall, "MOD-1"), { vocV: 22, vmpV: 18, iscA: 6, impA: 5.6 });
    Object.assign(circuit(stall, "C-1"), { entersBuilding: true, racewayType: "PVC-40" });
    expect(result(run(stall, "2020"), "pv-wiring-methods:C-1").status).toBe("pass");
    expect(result(run(stall, "2023"), "pv-wiring-methods:C-1").status).toBe("pass");
    expect(result(run(stall, "2017"), "pv-wiring-methods:C-1").status).toBe("fail");
    // 1.25 × 7 A = 8.75 A > 8 A.
    equipment(stall, "MOD-1").iscA = 7;
    expect(result(run(stall, "2020"), "pv-wiring-methods:C-1").status).toBe("fail");
  });

  it("asks whether a circuit over 30 V is readily accessible, and for the wiring method", () => {
    const hut = exampleJson("tamarack-hut");
    delete circuit(hut, "C-1").readilyAccessible;
    const r = result(run(hut), "pv-wiring-methods:C-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["circuits.0.readilyAccessible"]);
    circuit(hut, "C-1").readilyAccessible = false;
    circuit(hut, "C-1").racewayType = "";
    expect(result(run(hut), "pv-wiring-methods:C-1").missing).toEqual(["circuits.0.racewayType"]);
  });
});
