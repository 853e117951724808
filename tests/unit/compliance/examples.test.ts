/**
 * The three demo systems, worked by hand and compared with the engine.
 * Table values: NEC Table 310.16 (2017: Table 310.15(B)(16)), Table 310.15(B)(1)
 * ambient correction, Table 310.15(C)(1) adjustment, 240.6(A) standard ratings,
 * 240.4(D), Table 250.122, Chapter 9 Table 8 — all the same numbers in 2017/2020/2023.
 */
import { describe, expect, it } from "vitest";
import { CHECKS, loadSummary } from "@/lib/compliance";
import { exampleJson, parse, result, run, value } from "./fixtures";

describe("market stall (NEC 2020, City of Kestrel Falls)", () => {
  /*
   * Array PV-1: one Brightfell BF-410M, Voc 37.4 V, Isc 13.85 A, Vmp 31.3 V, Imp 13.1 A,
   *   αVoc −0.27 %/°C, αVmp −0.35 %/°C. Design low −8 °C, high 35 °C.
   * 690.7(A)(1): 37.4 × (1 + 0.0027 × 33) = 37.4 × 1.0891 = 40.73 V ≤ 100 V controller, 1000 V module.
   * MPPT: cell 35 + 30 = 65 °C; 31.3 × (1 − 0.0035 × 40) = 26.92 V ≥ 14.4 V charge + 5 V = 19.4 V and ≥ 18 V.
   * C-1 PV source: 690.8(A) 1.25 × 13.85 = 17.31 A; 690.8(B)(1) 1.25 × 17.31 = 21.64 A ≤ 35 A (10 AWG, 75 °C);
   *   (B)(2) 40 A × 0.96 (35 °C, 90 °C) = 38.4 A ≥ 17.31 A. One string: no fuse (690.9(A) exception).
   *   EGC: assumed 1.25 × 17.31 = 21.6 → 25 A → 10 AWG (Table 250.122). Drop 2 × 20 × 1.24 × 13.1 / 1000 = 0.650 V ÷ 31.3 V = 2.08 %.
   * C-2 controller → battery: 30 A rated; 37.5 A ≤ 50 A (8 AWG 75 °C); CB-1 40 A ≥ 37.5 A, ≤ 50 A. EGC 10 AWG.
   *   Drop 2 × 5 × 0.778 × 30 / 1000 = 0.233 V ÷ 12.8 V = 1.82 %.
   * C-3 battery → inverter: 600 W ÷ (10.5 V × 0.90) = 63.49 A; 1.25 × = 79.37 A ≤ 85 A (4 AWG 75 °C);
   *   F-1 80 A ≥ 79.37 A, ≤ 90 A (240.4(B): 85 A → next standard 90 A). EGC for 80 A: 8 AWG.
   * Loads: 2 × 10 × 4 + 15 × 8 + 10 × 4 + 25 × 6 + 45 × 6 = 80 + 120 + 40 + 150 + 270 = 660 Wh; ÷ 0.90 inverter efficiency = 733.3 Wh; idle 8 × 24 = 192 Wh;
   *   925.3 Wh/day. Storage: 2 × 1.28 kWh × 0.90 = 2304 Wh → 2.49 days (≥ 2, common practice).
   *   Array 410 W × 4 h × 0.75 = 1230 Wh ≥ 925.3 Wh.
   * Inverter: 600 W ≥ 115 W running; 1200 W surge (≈ 2 × continuous, common practice) ≥ 200 W + 70 W others.
   */
  const r = run(exampleJson("market-stall"));
  it("matches the hand calculation", () => {
    expect(value(result(r, "max-pv-voltage:PV-1"), "maxVoltageV")).toBeCloseTo(40.73, 2);
    expect(value(result(r, "mppt-window:PV-1"), "hotVmpV")).toBeCloseTo(26.92, 2);
    expect(value(result(r, "circuit-current:C-1"), "currentA")).toBeCloseTo(17.31, 2);
    expect(value(result(r, "conductor-ampacity:C-1"), "requiredUnadjustedA")).toBeCloseTo(21.64, 2);
    expect(value(result(r, "conductor-ampacity:C-1"), "correctedA")).toBeCloseTo(38.4, 2);
    expect(value(result(r, "voltage-drop:C-1"), "dropPct")).toBeCloseTo(2.08, 2);
    expect(value(result(r, "voltage-drop:C-2"), "dropPct")).toBeCloseTo(1.82, 2);
    expect(value(result(r, "circuit-current:C-3"), "currentA")).toBeCloseTo(63.49, 2);
    expect(value(result(r, "overcurrent-protection:C-3"), "maxByAmpacityA")).toBe(90);
    expect(result(r, "grounding:C-3").values.find((x) => x.key === "requiredEgc")?.value).toBe("8");
    const s = loadSummary(parse(exampleJson("market-stall")));
    // Loads 660 Wh ÷ 0.90 inverter efficiency = 733.33 Wh + 8 W × 24 h = 925.33 Wh; 2304 Wh ÷ 925.33 = 2.49 days
    expect(s.dailyTotalWh).toBeCloseTo(925.33, 2);
    expect(s.autonomyDays).toBeCloseTo(2.49, 2);
    expect(value(result(r, "stand-alone-sizing"), "arrayWhPerDay")).toBeCloseTo(1230, 6);
  });
  it("has nothing failing", () => {
    expect(r.counts.fail).toBe(0);
    expect(r.counts["needs-input"]).toBe(0);
  });
});

describe("Tamarack hut (NEC 2017, Alder Bay County) — carries one design mistake", () => {
  /*
   * Array PV-1: 2 × Brightfell BF-400T in series, Voc 48.6 V, Isc 10.45 A, Vmp 40.4 V, Imp 9.9 A,
   *   αVoc −0.29 %/°C, αVmp −0.37 %/°C. Design low −30 °C, high 30 °C. Controller Korvane KV-150/30.
   * 690.7(A)(1): 97.2 × (1 + 0.0029 × 55) = 97.2 × 1.1595 = 112.70 V ≤ 150 V (three modules: 169.1 V, over).
   * MPPT: cell 60 °C; 80.8 × (1 − 0.0037 × 35) = 70.34 V ≥ 28.8 + 5 = 33.8 V and ≥ 34 V.
   * C-1: 1.25 × 10.45 = 13.06 A; drop 2 × 60 × 1.24 × 9.9 / 1000 = 1.473 V ÷ 80.8 V = 1.82 %.
   * C-2 controller → battery (THE MISTAKE): 30 A rated output; 690.8(B)/706.30: 1.25 × 30 = 37.5 A needed,
   *   but 10 AWG Cu carries 35 A at the 75 °C terminal → fails; CB-1 is 40 A, but 240.4(D) allows 10 AWG Cu
   *   no more than 30 A → fails. The fix: 8 AWG (50 A at 75 °C) on the same 40 A breaker.
   * C-3 battery → inverter: 3000 W ÷ (21 V × 0.92) = 155.28 A; 1.25 × = 194.1 A ≤ 200 A (3/0 at 75 °C);
   *   F-1 200 A class T, interrupting 20 kA ≥ 6 kA battery fault current; EGC for 200 A: 6 AWG.
   * C-4 generator: 3600 W ÷ 120 V = 30 A; 445.13: 1.15 × 30 = 34.5 A ≤ 50 A (8 AWG).
   * C-5 inverter output: 25 A; 31.25 A ≤ 50 A (8 AWG); CB-4 40 A ≤ 100 A panel neutral bus (710.15(C)).
   * Loads 1090 Wh ÷ 0.92 inverter efficiency = 1184.8 Wh + idle 20 × 24 = 480 Wh = 1664.8 Wh;
   *   storage 5.12 kWh × 0.9 = 4608 Wh → 2.77 days.
   * Array 800 W × 3 h × 0.75 = 1800 Wh ≥ 1664.8 Wh.
   */
  const r = run(exampleJson("tamarack-hut"));
  it("matches the hand calculation", () => {
    expect(value(result(r, "max-pv-voltage:PV-1"), "maxVoltageV")).toBeCloseTo(112.7, 1);
    expect(value(result(r, "mppt-window:PV-1"), "hotVmpV")).toBeCloseTo(70.34, 2);
    expect(value(result(r, "voltage-drop:C-1"), "dropPct")).toBeCloseTo(1.82, 2);
    expect(value(result(r, "circuit-current:C-3"), "currentA")).toBeCloseTo(155.28, 2);
    expect(value(result(r, "overcurrent-protection:C-3"), "minimumA")).toBeCloseTo(194.1, 1);
    expect(value(result(r, "conductor-ampacity:C-4"), "requiredAdjustedA")).toBeCloseTo(34.5, 5);
    expect(value(result(r, "stand-alone-sizing"), "autonomyDays")).toBeCloseTo(2.768, 3);
  });
  it("fails exactly the 10 AWG conductor on the 40 A breaker, and lists those failures first", () => {
    const failing = r.results.filter((x) => x.status === "fail").map((x) => x.id);
    expect(failing).toEqual(["conductor-ampacity:C-2", "overcurrent-protection:C-2"]);
    expect(r.results[0]?.id).toBe("conductor-ampacity:C-2");
  });
});

describe("Ferncliff farmhouse (NEC 2023, Marrow Ridge Township)", () => {
  /*
   * Arrays PV-1 and PV-2: 8 × Brightfell BF-540H each, Voc 49.5 V, Isc 13.85 A, Vmp 41.6 V, Imp 12.98 A,
   *   αVoc −0.27 %/°C, αVmp −0.35 %/°C, each on its own MPPT input (500 V, 18 A, 120–450 V window).
   *   Design low −22 °C, high 34 °C; dwelling limit 600 V.
   * 690.7(A)(1): 396 × (1 + 0.0027 × 47) = 396 × 1.1269 = 446.25 V ≤ 500 V, ≤ 600 V.
   * MPPT: cell 64 °C; 332.8 × (1 − 0.0035 × 39) = 287.37 V ≥ 120 V; cold Vmp 332.8 × 1.1645 = 387.55 V ≤ 450 V.
   * C-1, C-2 (rooftop EMT 1 in above the roof — no adder at ≥ 7/8 in, 310.15(B)(2); 4 conductors):
   *   1.25 × 13.85 = 17.31 A; 40 A × 0.96 × 0.80 = 30.72 A ≥ 17.31 A; 35 A at 75 °C ≥ 21.64 A.
   *   Drop 2 × 85 × 1.24 × 12.98 / 1000 = 2.736 V ÷ 332.8 V = 0.82 %.
   * C-4 bus → inverter: 8000 W ÷ (44 V × 0.95) = 191.39 A; 1.25 × = 239.2 A;
   *   2 × 2/0 Cu: 175 A × 2 = 350 A at 75 °C; 195 A × 0.96 × 0.80 × 2 = 299.5 A; F-2 250 A ≥ 239.2 A, ≤ 300 A.
   *   EGC for 250 A: 4 AWG (Table 250.122, ≤ 300 A). Fault current 4 × 4500 = 18 kA ≤ 20 kA fuse rating.
   * C-6 inverter → panel: 33.3 A; 705.12(B)(3)(2): 1.25 × 33.3 + 200 = 241.6 A ≤ 1.2 × 225 = 270 A.
   * Storage: 4 × 5.12 = 20.48 kWh in the garage ≤ 80 kWh (IRC 2021 R328.5), units 5.12 ≤ 20 kWh, UL 9540A-tested
   *   rack so the 3 ft spacing is relieved; smoke detection and bollards recorded.
   * Rapid shutdown: module-level, 8 dual-module units.
   */
  const r = run(exampleJson("ferncliff-farmhouse"));
  it("matches the hand calculation", () => {
    expect(value(result(r, "max-pv-voltage:PV-2"), "maxVoltageV")).toBeCloseTo(446.25, 1);
    expect(value(result(r, "mppt-window:PV-1"), "hotVmpV")).toBeCloseTo(287.37, 1);
    expect(value(result(r, "mppt-window:PV-1"), "coldVmpV")).toBeCloseTo(387.55, 1);
    expect(value(result(r, "conductor-ampacity:C-1"), "allowedA")).toBeCloseTo(30.72, 2);
    expect(value(result(r, "voltage-drop:C-1"), "dropPct")).toBeCloseTo(0.82, 2);
    expect(value(result(r, "circuit-current:C-4"), "currentA")).toBeCloseTo(191.39, 2);
    expect(value(result(r, "conductor-ampacity:C-4"), "allowedA")).toBeCloseTo(299.52, 2);
    expect(result(r, "grounding:C-4").values.find((x) => x.key === "requiredEgc")?.value).toBe("4");
    expect(value(result(r, "panel-busbar:P-1"), "lhsA")).toBeCloseTo(241.63, 2);
    expect(result(r, "rapid-shutdown").status).toBe("pass");
  });
  it("cites the 2023 numbering", () => {
    expect(result(r, "conductor-ampacity:C-1").codeRefs).toContain("NEC 2023 Table 310.15(B)(1)(1)");
    expect(result(r, "conductor-ampacity:C-1").codeRefs).toContain("NEC 2023 Table 310.16");
  });
  it("cites the 2017 numbering when run under 2017", () => {
    const r17 = run(exampleJson("ferncliff-farmhouse"), "2017");
    expect(r17.edition).toBe("2017");
    expect(result(r17, "conductor-ampacity:C-1").codeRefs).toContain("NEC 2017 Table 310.15(B)(16)");
  });
  it("has nothing failing", () => {
    expect(r.counts.fail).toBe(0);
    expect(r.counts["needs-input"]).toBe(0);
  });
});

describe("result contract", () => {
  it.each(["market-stall", "tamarack-hut", "ferncliff-farmhouse"] as const)("%s: sorted by severity, unique ids, every field present", (name) => {
    const r = run(exampleJson(name));
    const order = ["fail", "needs-input", "warning", "attest", "pass", "not-applicable"];
    const ranks = r.results.map((x) => order.indexOf(x.status));
    expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
    expect(new Set(r.results.map((x) => x.id)).size).toBe(r.results.length);
    for (const x of r.results) {
      expect(x.codeRefs.length).toBeGreaterThan(0);
      expect(x.message.length).toBeGreaterThan(0);
      if (x.status !== "pass") expect(x.reason, x.id).toBeTruthy();
      if (x.subject) expect(x.id).toBe(`${x.checkId}:${x.subject}`);
    }
    const ids = new Set(r.results.map((x) => x.checkId));
    // Every check in the catalogue reports on every record, if only "not applicable".
    expect(ids.size).toBe(CHECKS.length);
  });

  it("is deterministic", () => {
    expect(JSON.stringify(run(exampleJson("ferncliff-farmhouse")))).toBe(JSON.stringify(run(exampleJson("ferncliff-farmhouse"))));
  });
});

describe("every result explains itself", () => {
  it("carries a formula in words", () => {
    for (const name of ["market-stall", "tamarack-hut", "ferncliff-farmhouse"] as const) {
      for (const r of run(exampleJson(name)).results) expect(r.formula.length, r.id).toBeGreaterThan(0);
    }
  });
});
