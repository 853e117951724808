import { describe, expect, it } from "vitest";
import { requiredLabels } from "@/lib/compliance";
import { equipment, exampleJson, parse, result, run } from "./fixtures";

function byId(labels: ReturnType<typeof requiredLabels>, id: string) {
  const l = labels.find((x) => x.id === id);
  if (!l) throw new Error(`no label ${id}; have ${labels.map((x) => x.id).join(", ")}`);
  return l;
}

describe("required labels", () => {
  it("puts the computed DC source values on the 2020 label (690.53)", () => {
    const labels = requiredLabels(parse(exampleJson("market-stall")), "2020");
    const dc = byId(labels, "dc-source:PV-1");
    expect(dc.codeRef).toBe("NEC 2020 690.53");
    // 690.7: 37.4 V × (1 + 0.0027 × 33) = 40.73 V; 690.8(A): 1.25 × 13.85 A = 17.31 A; controller 30 A
    expect(dc.lines).toEqual([
      "MAXIMUM VOLTAGE: 40.7 V DC",
      "MAXIMUM CIRCUIT CURRENT: 17.31 A",
      "MAXIMUM RATED OUTPUT CURRENT OF THE CHARGE CONTROLLER: 30 A",
    ]);
    expect(dc.location).toContain("DS-1");
  });

  it("prints the storage disconnect's clearing time and the date calculated, or asks for the clearing time (706.15(C))", () => {
    // NEC 2020 706.15(C): nominal voltage, available fault current with its clearing time, and the date calculated.
    const labels = requiredLabels(parse(exampleJson("tamarack-hut")), "2020", { calculatedOn: "2026-11-30" });
    const ess = byId(labels, "ess-disconnect:BAT-1");
    expect(ess.lines).toContain("ASSOCIATED CLEARING TIME: 8 ms (F-1)");
    expect(ess.lines).toContain("DATE CALCULATED: 2026-11-30");
    expect(ess.lines.join(" ")).not.toContain("____");
    expect(ess.missing).toBeUndefined();
    // Without the fuse's clearing time the label asks for it by the field that clears it, never printing a guess.
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "F-1").clearingTimeMs;
    const blank = byId(requiredLabels(parse(j), "2020", { calculatedOn: "2026-11-30" }), "ess-disconnect:BAT-1");
    const f1 = (j.equipment as { tag: string }[]).findIndex((e) => e.tag === "F-1");
    expect(blank.missing).toEqual([`equipment.${f1}.clearingTimeMs`]);
  });

  it("carries only the maximum DC voltage in 2023 (690.7(D))", () => {
    const labels = requiredLabels(parse(exampleJson("ferncliff-farmhouse")));
    const dc = byId(labels, "dc-source:PV-1");
    expect(dc.codeRef).toBe("NEC 2023 690.7(D)");
    expect(dc.lines).toEqual(["MAXIMUM DC VOLTAGE: 446.3 V DC"]);
  });

  it("requires the rapid-shutdown labels on a roof mount, cited by edition", () => {
    const f = parse(exampleJson("ferncliff-farmhouse"));
    expect(byId(requiredLabels(f, "2023"), "rapid-shutdown").codeRef).toBe("NEC 2023 690.12(D)");
    expect(byId(requiredLabels(f, "2020"), "rapid-shutdown").codeRef).toBe("NEC 2020 690.56(C)");
    // A ground array whose circuits stay outside buildings needs none; the hut's circuit enters the hut, so it does.
    expect(requiredLabels(parse(exampleJson("market-stall"))).some((l) => l.id === "rapid-shutdown")).toBe(false);
    expect(requiredLabels(parse(exampleJson("tamarack-hut"))).some((l) => l.id === "rapid-shutdown")).toBe(true);
  });

  it("requires the single 120-volt supply warning where a 120 V inverter feeds a 120/240 V panel (710.15(C))", () => {
    const l = byId(requiredLabels(parse(exampleJson("tamarack-hut"))), "single-120v-supply:P-1");
    expect(l.signalWord).toBe("WARNING");
    expect(l.lines.join(" ")).toMatch(/MULTIWIRE/);
  });

  it("puts the battery's nominal voltage and fault current on the storage disconnect", () => {
    const l = byId(requiredLabels(parse(exampleJson("ferncliff-farmhouse"))), "ess-disconnect:BAT-1");
    // 4 × 4500 A from the battery datasheet
    expect(l.lines).toContain("MAXIMUM AVAILABLE SHORT-CIRCUIT CURRENT: 18000 A");
    expect(l.lines).toContain("NOMINAL VOLTAGE: 51.2 V DC");
    expect(l.equipmentTag).toBe("DS-1");
  });

  it("asks for the 705.12 breaker label and the source directory on a hybrid", () => {
    const labels = requiredLabels(parse(exampleJson("ferncliff-farmhouse")));
    expect(byId(labels, "backfed-breaker:CB-2").lines).toEqual(["DO NOT RELOCATE THIS OVERCURRENT DEVICE"]);
    expect(byId(labels, "source-directory").lines.join(" ")).toMatch(/GENERATOR \(GEN-1\)/);
  });

  it("puts the arc-flash warning on panels outside dwelling units (110.16)", () => {
    expect(requiredLabels(parse(exampleJson("tamarack-hut"))).some((l) => l.id === "arc-flash:P-1")).toBe(true);
    expect(requiredLabels(parse(exampleJson("ferncliff-farmhouse"))).some((l) => l.id.startsWith("arc-flash"))).toBe(false);
  });

  it("reports the labels as a point to confirm on site, or needs input while a value is blank", () => {
    const ok = result(run(exampleJson("tamarack-hut")), "labels");
    expect(ok.status).toBe("attest");
    expect(ok.codeRefs).toContain("NEC 2017 110.21(B)");
    const j = exampleJson("tamarack-hut");
    delete equipment(j, "MOD-1").vocV;
    const blank = result(run(j), "labels");
    expect(blank.status).toBe("needs-input");
    expect(blank.missing).toContain("equipment.0.vocV");
  });
});
