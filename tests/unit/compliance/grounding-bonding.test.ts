/**
 * Grounding electrode system and the single neutral-to-ground bond.
 * Sources: NEC 2017/2020/2023 Table 250.66 (GEC by the largest supply conductor), 250.166(B) (DC GEC not smaller than
 * the largest DC conductor, at least 8 AWG Cu), 250.166(C)/250.66(A) (sole connection to rods or plates: 6 AWG Cu is
 * enough), 250.166(D)/250.66(B) (concrete-encased: 4 AWG Cu), 250.30(A)(1) and 250.6 (one bond, no neutral current on
 * grounding paths), 250.35 (permanently installed generators) — all from memory, the same numbers in the three editions.
 */
import { describe, expect, it } from "vitest";
import { acGecSize, dcGecSize, gecCapFor } from "@/lib/compliance/tables";
import { parseProjectFile } from "@/lib/compliance";
import { equipment, exampleJson, result, run } from "./fixtures";

const text = (r: { values: { key: string; value: unknown }[] }, key: string) => r.values.find((x) => x.key === key)?.value;

describe("Table 250.66 and 250.166 sizes", () => {
  it("sizes the AC GEC by the largest supply conductor (Table 250.66, from memory)", () => {
    expect(acGecSize(66360, "cu", "cu")).toBe("8"); // 2 AWG Cu or smaller → 8 AWG Cu
    expect(acGecSize(105600, "cu", "cu")).toBe("6"); // 1/0 Cu → 6 AWG Cu
    expect(acGecSize(167800, "cu", "cu")).toBe("4"); // 3/0 Cu → 4 AWG Cu
    expect(acGecSize(250000, "cu", "cu")).toBe("2"); // over 3/0 through 350 kcmil Cu → 2 AWG Cu
    expect(acGecSize(500000, "cu", "cu")).toBe("1/0"); // over 350 through 600 kcmil Cu → 1/0 Cu
    expect(acGecSize(211600, "al", "cu")).toBe("4"); // 4/0 Al → 4 AWG Cu
    expect(acGecSize(167800, "cu", "al")).toBe("2"); // 3/0 Cu → 2 AWG Al
  });

  it("sizes the DC GEC to the largest DC conductor, at least 8 AWG Cu (250.166(B))", () => {
    expect(dcGecSize("10", "cu")).toBe("8");
    expect(dcGecSize("3/0", "cu")).toBe("3/0");
    expect(dcGecSize("10", "al")).toBe("6");
  });

  it("caps a GEC that only reaches rods at 6 AWG Cu, concrete-encased at 4 AWG Cu; a water pipe carries no cap", () => {
    expect(gecCapFor(["ground-rod"], "cu")).toBe("6"); // 250.166(C), 250.66(A)
    expect(gecCapFor(["concrete-encased"], "cu")).toBe("4"); // 250.166(D), 250.66(B)
    expect(gecCapFor(["concrete-encased", "ground-rod"], "cu")).toBe("4");
    expect(gecCapFor(["ground-rod", "metal-water-pipe"], "cu")).toBeUndefined();
  });
});

describe("the electrode system of the demo projects", () => {
  it("the hut's 6 AWG GEC to a rod meets 250.166(C), though its largest DC conductor is 3/0", () => {
    const r = result(run(exampleJson("tamarack-hut")), "grounding-electrode:electrode-system");
    expect(r.status).toBe("pass");
    expect(text(r, "dcRequired")).toBe("3/0"); // C-3 3/0 AWG, 250.166(B)
    expect(text(r, "acRequired")).toBe("8"); // C-4 / C-5 8 AWG, Table 250.66
    expect(text(r, "requiredGec")).toBe("6");
  });

  it("fails the same 6 AWG once a water pipe joins the system (no cap: 3/0 needed), and the remedy passes", () => {
    const j = exampleJson("tamarack-hut");
    j.grounding.electrodes = ["ground-rod", "metal-water-pipe"];
    const r = result(run(j), "grounding-electrode:electrode-system");
    expect(r.status).toBe("fail");
    expect(r.remedy?.changes).toEqual([{ path: "grounding.gecSize", value: "3/0" }]);
    j.grounding.gecSize = "3/0";
    expect(result(run(j), "grounding-electrode:electrode-system").status).toBe("pass");
  });

  it("asks for the electrodes and the GEC, never passes without them", () => {
    const j = exampleJson("market-stall");
    delete j.grounding;
    const r = result(run(j), "grounding-electrode:electrode-system");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(expect.arrayContaining(["grounding.electrodes", "grounding.gecSize"]));
  });

  it("cites the electrode system, 690.47 and both GEC rules in each edition", () => {
    for (const ed of ["2017", "2020", "2023"] as const) {
      const refs = result(run(exampleJson("tamarack-hut"), ed), "grounding-electrode:electrode-system").codeRefs;
      expect(refs).toEqual([`NEC ${ed} 250.50`, `NEC ${ed} 690.47`, `NEC ${ed} 250.166`, `NEC ${ed} Table 250.66`]);
    }
  });
});

describe("exactly one neutral-to-ground bond", () => {
  it("passes the hut: bond in P-1, inverter and generator floating", () => {
    const r = result(run(exampleJson("tamarack-hut")), "grounding-electrode:neutral-bond");
    expect(r.status).toBe("pass");
    expect(r.message).toMatch(/at P-1/);
  });

  it("fails a second bond left in the inverter, and removing it passes", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "INV-1").neutralBonded = true;
    const r = result(run(j), "grounding-electrode:neutral-bond");
    expect(r.status).toBe("fail");
    expect(r.codeRefs).toContain("NEC 2017 250.6");
    for (const c of r.remedy!.changes) {
      const [, i, key] = c.path.split(".");
      j.equipment[Number(i)][key!] = c.value;
    }
    expect(result(run(j), "grounding-electrode:neutral-bond").status).toBe("pass");
  });

  it("fails a bond named in a panel recorded with its neutral floating", () => {
    const j = exampleJson("tamarack-hut");
    equipment(j, "P-1").neutralBonded = false;
    expect(result(run(j), "grounding-electrode:neutral-bond").status).toBe("fail");
  });

  it("asks where the bond is made, and whether each other unit floats", () => {
    const j = exampleJson("tamarack-hut");
    delete j.grounding.neutralGroundBondTag;
    delete equipment(j, "GEN-1").neutralBonded;
    const r = result(run(j), "grounding-electrode:neutral-bond");
    expect(r.status).toBe("needs-input");
    expect(r.missing).toEqual(expect.arrayContaining(["grounding.neutralGroundBondTag", "equipment.4.neutralBonded"]));
  });

  it("cites 250.35 only where a permanently installed generator stands", () => {
    expect(result(run(exampleJson("ferncliff-farmhouse")), "grounding-electrode:neutral-bond").codeRefs).toContain("NEC 2023 250.35");
    expect(result(run(exampleJson("tamarack-hut")), "grounding-electrode:neutral-bond").codeRefs).not.toContain("NEC 2017 250.35");
  });

  it("refuses a bond named at a battery", () => {
    const j = exampleJson("tamarack-hut");
    j.grounding.neutralGroundBondTag = "BAT-1";
    const p = parseProjectFile(j);
    expect(p.ok).toBe(false);
    if (!p.ok) expect(p.issues.some((i) => i.path === "grounding.neutralGroundBondTag")).toBe(true);
  });
});
