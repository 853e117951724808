/**
 * String fuses and the module's maximum series fuse rating. Sources: NEC 690.9(A) and its exception
 * (same numbering 2017–2023, from memory), 110.3(B) (use equipment as its listing says), and the
 * module listing (UL 61730 marks the maximum series fuse on the module label).
 */
import { describe, expect, it } from "vitest";
import { array, circuit, equipment, exampleJson, result, run, type Json } from "./fixtures";

/** The farmhouse's PV-1 string protected by a fuse of the given rating (module maximum series fuse 25 A). */
function fusedString(ratingA: number): Json {
  const j = exampleJson("ferncliff-farmhouse");
  j.equipment.push({ tag: "F-9", kind: "fuse", ratingA, voltageRatingV: 600, currentType: "dc", interruptingRatingA: 20000 });
  circuit(j, "C-1").ocpdTag = "F-9";
  return j;
}

describe("a string fuse above the module's maximum series fuse rating", () => {
  it("fails a 30 A fuse on a module marked 25 A", () => {
    // Module label 25 A (example datasheet); 1.25 × 1.25 × 13.85 A = 21.6 A, so a 30 A fuse covers the current but exceeds the label.
    const r = result(run(fusedString(30)), "overcurrent-protection:C-1");
    expect(r.status).toBe("fail");
    expect(r.message).toMatch(/25 A maximum series fuse/);
    expect(r.codeRefs).toContain("NEC 2023 110.3(B)");
  });

  it("passes a 25 A fuse on the same string", () => {
    // NEC 240.6(A): 25 A is a standard rating; 21.6 A ≤ 25 A ≤ 25 A.
    expect(result(run(fusedString(25)), "overcurrent-protection:C-1").status).toBe("pass");
  });

  it("needs the module's series fuse rating to judge a string fuse", () => {
    const j = fusedString(25);
    delete equipment(j, "MOD-1").maxSeriesFuseA;
    const r = result(run(j), "overcurrent-protection:C-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["equipment.0.maxSeriesFuseA"]);
  });
});

describe("a PV output circuit with parallel strings and no module series fuse rating", () => {
  /** The hut's array as two strings in parallel on a PV output circuit with no device. */
  function paralleled(): Json {
    const j = exampleJson("tamarack-hut");
    array(j, "PV-1").modulesInSeries = 1;
    array(j, "PV-1").stringsInParallel = 2;
    Object.assign(circuit(j, "C-1"), { kind: "pv-output" });
    delete circuit(j, "C-1").stringsCarried;
    return j;
  }

  it("is needs input naming the module's maximum series fuse, never a pass", () => {
    const j = paralleled();
    delete equipment(j, "MOD-1").maxSeriesFuseA;
    const r = result(run(j), "overcurrent-protection:C-1");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(["equipment.0.maxSeriesFuseA"]);
  });

  it("passes two strings whose back-feed stays within the rating", () => {
    // 690.9(A) exception: 1.25 × 10.45 A × (2 − 1) = 13.1 A ≤ 20 A module series fuse.
    expect(result(run(paralleled()), "overcurrent-protection:C-1").status).toBe("pass");
  });
});
