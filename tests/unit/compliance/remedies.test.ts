/**
 * Every failing result offers a remedy with the figure that makes it pass, and a remedy made of field changes,
 * applied to the record, turns its result to pass. The mistakes are the demo projects' own and ones built from them.
 */
import { describe, expect, it } from "vitest";
import type { CheckResult, CheckRun, Remedy } from "@/lib/compliance";
import type { NecEdition } from "@/lib/schemas/project-record";
import { array, circuit, equipment, exampleJson, result, run, type ExampleName, type Json } from "./fixtures";

/** Sets each change's record path in the project file (the file and the record share their paths). */
function apply(json: Json, remedy: Remedy): Json {
  const out = structuredClone(json);
  for (const change of remedy.changes) {
    const keys = change.path.split(".");
    let at = out;
    for (const k of keys.slice(0, -1)) at = at[k];
    at[keys[keys.length - 1]!] = change.value;
  }
  return out;
}

function remedyOf(r: CheckResult): Remedy {
  expect(r.remedy, `${r.id} (${r.status}) offers no remedy: ${r.message}`).toBeDefined();
  expect(r.remedy!.text.length).toBeGreaterThan(10);
  return r.remedy!;
}

/** Applies the remedy of result `id` and returns that result after a fresh run. */
function afterRemedy(json: Json, id: string, edition?: NecEdition): { before: CheckResult; after: CheckResult; remedy: Remedy } {
  const before = result(run(json, edition), id);
  const remedy = remedyOf(before);
  const after = result(run(apply(json, remedy), edition), id);
  return { before, after, remedy };
}

describe("remedies on the demo mistakes", () => {
  it("tamarack hut: 10 AWG on a 40 A breaker becomes 8 AWG, and both results pass", () => {
    const hut = exampleJson("tamarack-hut");
    // NEC 2017 Table 310.15(B)(16), 75 °C copper: 10 AWG 35 A < 1.25 × 30 A controller output = 37.5 A; 8 AWG 50 A.
    const amp = afterRemedy(hut, "conductor-ampacity:C-2");
    expect(amp.before.status).toBe("fail");
    expect(amp.remedy.changes).toEqual([{ path: "circuits.1.size", value: "8" }]);
    expect(amp.remedy.text).toContain("8 AWG");
    expect(amp.remedy.text).toContain("50.0 A");
    expect(amp.after.status).toBe("pass");
    // NEC 240.4(D): 10 AWG copper at most 30 A; the 40 A breaker stays (next standard rating above 37.5 A, 240.6(A)).
    const ocpd = afterRemedy(hut, "overcurrent-protection:C-2");
    expect(ocpd.remedy.changes).toEqual([{ path: "circuits.1.size", value: "8" }]);
    expect(ocpd.after.status).toBe("pass");
  });

  it("a breaker below 125 % of the current is raised to the next standard rating", () => {
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-2").size = "8";
    equipment(hut, "CB-1").ratingA = 30;
    // 1.25 × 30 A = 37.5 A → next standard rating 40 A (NEC 2017 240.6(A)).
    const r = afterRemedy(hut, "overcurrent-protection:C-2");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "equipment.7.ratingA", value: 40 }]);
    expect(r.after.status).toBe("pass");
  });

  it("a breaker larger than the conductor allows is lowered where a standard rating still covers the current", () => {
    const hut = exampleJson("tamarack-hut");
    // Generator output 3.6 kW ÷ 120 V = 30 A; 8 AWG copper, 60 °C terminals: 40 A (NEC 2017 Table 310.15(B)(16)).
    circuit(hut, "C-4").terminalTempRatingC = 60;
    equipment(hut, "CB-3").ratingA = 60;
    const r = afterRemedy(hut, "overcurrent-protection:C-4");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "equipment.10.ratingA", value: 40 }]);
    expect(r.after.status).toBe("pass");
  });

  it("a rating that is not standard warns and offers the standard one", () => {
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-2").size = "8";
    equipment(hut, "CB-1").ratingA = 42;
    // 240.6(A): 40 A and 45 A are standard, 42 A is not; 40 A still covers 37.5 A.
    const r = afterRemedy(hut, "overcurrent-protection:C-2");
    expect(r.before.status).toBe("warning");
    expect(r.remedy.changes).toEqual([{ path: "equipment.7.ratingA", value: 40 }]);
    expect(r.after.status).toBe("pass");
  });

  it("a string fuse above the module's series fuse rating is lowered to the standard rating under it", () => {
    const farm = exampleJson("ferncliff-farmhouse");
    farm.equipment.push({ tag: "F-9", kind: "fuse", ratingA: 30, voltageRatingV: 600, currentType: "dc", interruptingRatingA: 20000 });
    circuit(farm, "C-1").ocpdTag = "F-9";
    // 1.25 × 1.25 × 13.85 A = 21.6 A → 25 A (NEC 2023 240.6(A)), which is also the module's 25 A series fuse rating (110.3(B)).
    const r = afterRemedy(farm, "overcurrent-protection:C-1");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: `equipment.${farm.equipment.length - 1}.ratingA`, value: 25 }]);
    expect(r.after.status).toBe("pass");
  });

  it("an EGC below Table 250.122 is raised to the table size", () => {
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-5").egcSize = "14";
    // NEC 2017 Table 250.122: 40 A device → 10 AWG copper.
    const r = afterRemedy(hut, "grounding:C-5");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "circuits.4.egcSize", value: "10" }]);
    expect(r.after.status).toBe("pass");
  });

  it("a string too long for the controller gets the longest count that fits", () => {
    const hut = exampleJson("tamarack-hut");
    array(hut, "PV-1").modulesInSeries = 4;
    // 690.7(A)(1): 48.6 V × (1 + (−0.29 %/°C) × (−30 °C − 25 °C)) = 56.35 V per module; 150 V ÷ 56.35 V → 2 modules.
    const r = afterRemedy(hut, "max-pv-voltage:PV-1");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "arrays.0.modulesInSeries", value: 2 }]);
    expect(r.remedy.text).toContain("112.7 V");
    expect(r.after.status).toBe("pass");
  });

  it("a string too short for the tracking window gets the shortest count that clears it", () => {
    const stall = exampleJson("market-stall");
    equipment(stall, "CC-1").mpptMinVoltageV = 30;
    // Hot Vmp: 31.3 V × (1 − 0.35 % × (35 + 30 − 25)) = 26.92 V < 30 V; two modules 53.8 V.
    // Cold Voc of two: 2 × 37.4 V × (1 + 0.27 % × 33) = 81.5 V ≤ the 100 V input (690.7(A)(1)).
    const r = afterRemedy(stall, "mppt-window:PV-1");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "arrays.0.modulesInSeries", value: 2 }]);
    expect(r.after.status).toBe("pass");
    expect(result(run(apply(stall, r.remedy)), "max-pv-voltage:PV-1").status).toBe("pass");
  });

  it("an input that cannot take one string's current says so, with the figures", () => {
    const stall = exampleJson("market-stall");
    equipment(stall, "CC-1").maxPvInputCurrentA = 10;
    const r = result(run(stall), "mppt-window:PV-1");
    expect(r.status).toBe("fail");
    expect(remedyOf(r).text).toContain("13.85 A");
    expect(r.remedy!.changes).toEqual([]);
  });

  it("a missing disconnect names the circuit it goes on", () => {
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-1").disconnectTags = [];
    const r = result(run(hut), "disconnects:PV-1");
    expect(r.status).toBe("fail");
    expect(remedyOf(r).text).toContain("C-1");
    expect(r.remedy!.text).toContain("DC-rated");
  });

  it("a device rated below the circuit's voltage names the rating it needs", () => {
    const hut = exampleJson("tamarack-hut");
    equipment(hut, "DS-1").voltageRatingV = 60;
    // 2 × 56.35 V = 112.7 V at −30 °C (690.7(A)(1)) → a rating of at least 113 V.
    const r = result(run(hut), "device-ratings:DS-1");
    expect(r.status).toBe("fail");
    expect(remedyOf(r).text).toContain("113 V");
  });

  it("storage beyond the garage limit keeps the units that fit", () => {
    const farm = exampleJson("ferncliff-farmhouse");
    equipment(farm, "BAT-1").quantity = 20;
    // IRC 2021 R328.5: 80 kWh in an attached garage; 5.12 kWh units → 15 units (76.8 kWh).
    const r = afterRemedy(farm, "storage-siting");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "equipment.2.quantity", value: 15 }]);
    expect(r.after.status).toBe("pass");
  });

  it("units closer than the spacing rule are spaced 3 ft apart", () => {
    const farm = exampleJson("ferncliff-farmhouse");
    equipment(farm, "BAT-1").largeScaleFireTested = false;
    // IRC 2021 R328.4: 3 ft (36 in) between units unless large-scale fire testing shows less.
    const r = afterRemedy(farm, "storage-siting");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "site.batterySpacingIn", value: 36 }]);
    expect(r.after.status).toBe("pass");
  });

  it("a hybrid panel over the 120 % rule gets the largest main that meets it", () => {
    const farm = exampleJson("ferncliff-farmhouse");
    const p = equipment(farm, "P-1");
    p.busRatingA = 200;
    // NEC 2023 705.12(B)(3)(2): 1.25 × 33.33 A (8000 W ÷ 240 V) + main ≤ 1.2 × 200 A = 240 A → main ≤ 198.3 A → 175 A standard.
    const r = afterRemedy(farm, "panel-busbar:P-1");
    expect(r.before.status).toBe("fail");
    expect(r.remedy.changes).toEqual([{ path: "equipment.6.mainBreakerA", value: 175 }]);
    expect(r.after.status).toBe("pass");
  });

  it("a long run's voltage drop offers the conductor that brings it within 3 %", () => {
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-1").lengthFt = 300;
    // NEC Chapter 9 Table 8, uncoated copper: 10 AWG 1.24 Ω/kft → 9.1 %; 6 AWG 0.491 → 3.6 %; 4 AWG 0.308 → 2.26 %.
    const r = afterRemedy(hut, "voltage-drop:C-1");
    expect(r.before.status).toBe("warning");
    expect(r.remedy.changes).toEqual([{ path: "circuits.0.size", value: "4" }]);
    expect(r.after.status).toBe("pass");
  });

  it("too little storage for the days of autonomy offers the battery count", () => {
    const stall = exampleJson("market-stall");
    stall.daysOfAutonomy = 6;
    const r = afterRemedy(stall, "stand-alone-sizing");
    expect(r.before.status).toBe("warning");
    const change = r.remedy.changes.find((c) => c.path === "equipment.2.quantity");
    expect(change).toBeDefined();
    expect(Number(change!.value)).toBeGreaterThan(2);
    expect(r.after.status).toBe("pass");
  });

  it("the remaining kinds of failure each say what to do", () => {
    const cases: [ExampleName, (j: Json) => void, string, string][] = [
      ["tamarack-hut", (j) => (j.attachments = []), "submittal-completeness", "Attach"],
      ["tamarack-hut", (j) => (equipment(j, "BAT-1").maxConnectionsPerTerminal = 1), "battery-terminals:BAT-1", "bus bar"],
      ["market-stall", (j) => (equipment(j, "INV-1").continuousW = 100), "inverter-capacity", "W continuous"],
      ["market-stall", (j) => (j.loads[0].watts = 900), "stand-alone-supply", "W continuous"],
      ["market-stall", (j) => (equipment(j, "INV-1").listedMode = "interactive"), "device-ratings:INV-1", "stand-alone or multimode"],
      ["ferncliff-farmhouse", (j) => (j.rapidShutdownMethod = "none"), "rapid-shutdown", "method"],
      ["ferncliff-farmhouse", (j) => (j.rapidShutdownInsideBoundary = "none"), "rapid-shutdown", "80 V or less within 30 s"],
      ["ferncliff-farmhouse", (j) => (j.site.batteryLocation = "habitable-room"), "storage-siting", "Move the storage"],
    ];
    for (const [name, mutate, id, words] of cases) {
      const j = exampleJson(name);
      mutate(j);
      const r = result(run(j), id);
      expect(r.status, id).toBe("fail");
      expect(remedyOf(r).text).toContain(words);
    }
  });
});

describe("every fail carries a remedy, and its changes make it pass", () => {
  const mistakes: [string, ExampleName, (j: Json) => void][] = [
    ["as shipped", "tamarack-hut", () => {}],
    ["small battery conductor", "market-stall", (j) => (circuit(j, "C-2").size = "14")],
    ["small inverter conductor", "ferncliff-farmhouse", (j) => (circuit(j, "C-6").size = "14")],
    ["small EGC", "ferncliff-farmhouse", (j) => (circuit(j, "C-4").egcSize = "14")],
    ["long string", "ferncliff-farmhouse", (j) => (array(j, "PV-1").modulesInSeries = 14)],
    ["weak breaker", "market-stall", (j) => (equipment(j, "CB-1").ratingA = 20)],
    ["AC device on DC", "market-stall", (j) => (equipment(j, "DS-1").currentType = "ac")],
    ["low interrupting rating", "market-stall", (j) => (equipment(j, "F-1").interruptingRatingA = 1000)],
    ["storage unlisted", "market-stall", (j) => (equipment(j, "BAT-1").listing = "UL 1973")],
  ];
  for (const [label, name, mutate] of mistakes) {
    for (const edition of ["2017", "2020", "2023"] as const) {
      it(`${label} (${name}, NEC ${edition})`, () => {
        const j = exampleJson(name);
        mutate(j);
        const r: CheckRun = run(j, edition);
        const fails = r.results.filter((x) => x.status === "fail");
        expect(fails.length).toBeGreaterThan(0);
        for (const f of fails) {
          const remedy = remedyOf(f);
          if (remedy.changes.length === 0) continue;
          const after = result(run(apply(j, remedy), edition), f.id);
          expect(after.status, `${f.id} after "${remedy.text}"`).not.toBe("fail");
        }
      });
    }
  }
});
