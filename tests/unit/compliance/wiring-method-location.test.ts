/**
 * Wiring method against location. Sources (from memory unless named): NEC Table 310.4(A) (2020, 2023; Table 310.104(A)
 * in 2017): THHN 90 °C dry and damp only; THWN 75 °C dry and wet; THWN-2 90 °C dry and wet; XHHW 90 °C dry, 75 °C wet.
 * 310.10(C): conductors in wet locations are a wet-rated type; 300.5(B): the interior of underground raceways is a wet
 * location. 400.12(1): flexible cords are not a substitute for the fixed wiring of a structure. 110.8: only wiring
 * methods recognised in the Code; welding cable is for welder secondary circuits (630.42). 392.10(B)(1): single
 * conductors in cable tray 1/0 AWG and larger, marked for tray use, in industrial establishments with qualified
 * persons. 110.14: terminals for conductors finer than Class B and C stranding (Chapter 9, Table 10) are identified
 * for the conductor class.
 */
import { describe, expect, it } from "vitest";
import { parseProjectFile } from "@/lib/compliance";
import { circuit, exampleJson, result, run, type Json } from "./fixtures";

function applyRemedy(json: Json, changes: { path: string; value: unknown }[]): void {
  for (const { path, value } of changes) {
    const keys = path.split(".");
    let at = json;
    for (const k of keys.slice(0, -1)) at = at[k];
    at[keys[keys.length - 1]!] = value;
  }
}

describe("wiring method against location", () => {
  it("passes every demo circuit, citing the insulation table in each edition's numbering", () => {
    const table = { "2017": "Table 310.104(A)", "2020": "Table 310.4(A)", "2023": "Table 310.4(A)" } as const;
    for (const name of ["tamarack-hut", "market-stall", "ferncliff-farmhouse"] as const) {
      for (const edition of ["2017", "2020", "2023"] as const) {
        const out = run(exampleJson(name), edition).results.filter((r) => r.checkId === "wiring-method-location");
        expect(out.length).toBeGreaterThan(0);
        for (const r of out) {
          expect(r.status, r.id).toBe("pass");
          expect(r.codeRefs[0]).toBe(`NEC ${edition} ${table[edition]}`);
        }
      }
    }
  });

  it("fails a rating above the type's, and entering the type's rating passes", () => {
    const hut = exampleJson("tamarack-hut");
    // THWN is 75 °C (Table 310.4(A)); 90 °C entered overstates the ampacity.
    Object.assign(circuit(hut, "C-5"), { insulation: "THWN", insulationTempRatingC: 90 });
    const r = result(run(hut), "wiring-method-location:C-5");
    expect(r.status).toBe("fail");
    expect(r.remedy?.changes).toEqual([{ path: "circuits.4.insulationTempRatingC", value: 75 }]);
    applyRemedy(hut, r.remedy!.changes);
    expect(result(run(hut), "wiring-method-location:C-5").status).toBe("pass");
  });

  it("fails a dry-only type in an underground run and takes the wet rating there", () => {
    const hut = exampleJson("tamarack-hut");
    Object.assign(circuit(hut, "C-4"), { insulation: "THHN", racewayType: "HDPE" });
    const r = result(run(hut), "wiring-method-location:C-4");
    expect(r.status).toBe("fail");
    expect(r.codeRefs).toContain("NEC 2017 310.10(C)");
    applyRemedy(hut, r.remedy!.changes);
    expect(result(run(hut), "wiring-method-location:C-4").status).toBe("pass");
    // XHHW: 90 °C dry but 75 °C wet, so 90 °C entered for an underground run fails.
    Object.assign(circuit(hut, "C-4"), { insulation: "XHHW", insulationTempRatingC: 90 });
    expect(result(run(hut), "wiring-method-location:C-4").status).toBe("fail");
    circuit(hut, "C-4").insulationTempRatingC = 75;
    expect(result(run(hut), "wiring-method-location:C-4").status).toBe("pass");
  });

  it("fails flexible cord as fixed wiring, and asks a person about a generator's cord to its inlet", () => {
    const stall = exampleJson("market-stall");
    Object.assign(circuit(stall, "C-2"), { insulation: "SOOW", insulationTempRatingC: 90 });
    const r = result(run(stall), "wiring-method-location:C-2");
    expect(r.status).toBe("fail");
    expect(r.codeRefs).toContain("NEC 2020 400.12");
    const hut = exampleJson("tamarack-hut");
    Object.assign(circuit(hut, "C-4"), { insulation: "SJOOW", insulationTempRatingC: 90, fineStrandTerminalsIdentified: true });
    const gen = result(run(hut), "wiring-method-location:C-4");
    expect(gen.status).toBe("attest");
    expect(gen.message).toMatch(/inlet/);
  });

  it("fails welding cable, and building wire in its place passes", () => {
    const stall = exampleJson("market-stall");
    circuit(stall, "C-3").insulation = "welding cable";
    const r = result(run(stall), "wiring-method-location:C-3");
    expect(r.status).toBe("fail");
    expect(r.codeRefs).toContain("NEC 2020 110.8");
    applyRemedy(stall, r.remedy!.changes);
    expect(result(run(stall), "wiring-method-location:C-3").status).toBe("pass");
  });

  it("fails single conductors below 1/0 in cable tray, and asks a person to confirm 1/0 and larger", () => {
    const stall = exampleJson("market-stall");
    circuit(stall, "C-3").racewayType = "cable tray"; // 4 AWG THWN-2 singles
    const small = result(run(stall), "wiring-method-location:C-3");
    expect(small.status).toBe("fail");
    expect(small.codeRefs).toContain("NEC 2020 392.10(B)(1)");
    applyRemedy(stall, small.remedy!.changes);
    expect(result(run(stall), "wiring-method-location:C-3").status).toBe("pass");
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-3").racewayType = "CABLE-TRAY"; // 3/0 THWN-2 singles
    expect(result(run(hut), "wiring-method-location:C-3").status).toBe("attest");
    // MC cable in the tray is a cable, not single conductors.
    circuit(stall, "C-3").racewayType = "CABLE-TRAY";
    circuit(stall, "C-3").insulation = "NM-B";
    circuit(stall, "C-3").insulationTempRatingC = 90;
    expect(result(run(stall), "wiring-method-location:C-3").status).toBe("pass");
  });

  it("fails fine-stranded conductors on terminals not identified for them, and asks when the record does not say", () => {
    const stall = exampleJson("market-stall");
    circuit(stall, "C-3").fineStrandTerminalsIdentified = false;
    const r = result(run(stall), "wiring-method-location:C-3");
    expect(r.status).toBe("fail");
    expect(r.codeRefs).toContain("NEC 2020 110.14");
    expect(r.remedy?.text).toMatch(/Class K or M/);
    delete circuit(stall, "C-3").fineStrandTerminalsIdentified;
    expect(result(run(stall), "wiring-method-location:C-3").missing).toEqual(["circuits.2.fineStrandTerminalsIdentified"]);
    delete circuit(stall, "C-2").fineStranded;
    expect(result(run(stall), "wiring-method-location:C-2").missing).toEqual(["circuits.1.fineStranded"]);
  });
});

describe("insulation and wiring-method pick-lists in the record", () => {
  it("refuses an invented insulation type or wiring method, naming the list", () => {
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-2").insulation = "THWN-9";
    circuit(hut, "C-3").racewayType = "rack cable";
    const p = parseProjectFile(hut);
    expect(p.ok).toBe(false);
    if (p.ok) return;
    expect(p.issues.find((i) => i.path === "circuits.1.insulation")?.message).toMatch(/THWN-2.*PV WIRE/);
    expect(p.issues.find((i) => i.path === "circuits.2.racewayType")?.message).toMatch(/EMT.*MC/);
  });

  it("reads common spellings as the code", () => {
    const hut = exampleJson("tamarack-hut");
    circuit(hut, "C-1").insulation = "pv-wire";
    circuit(hut, "C-2").insulation = "thhn/thwn-2";
    circuit(hut, "C-4").racewayType = "PVC schedule 80";
    const p = parseProjectFile(hut);
    expect(p.ok).toBe(true);
    if (!p.ok) return;
    expect(p.record.circuits.map((c) => [c.insulation, c.racewayType])).toEqual([
      ["PV WIRE", "RMC"],
      ["THWN-2", "EMT"],
      ["THWN-2", "EMT"],
      ["THWN-2", "PVC-80"],
      ["THWN-2", "EMT"],
    ]);
  });
});

describe("stored circuits from before the pick-lists", () => {
  it("clear a type the list does not know, so the project opens and the check asks for it", async () => {
    const { withKnownWiringCodes } = await import("@/lib/schemas/wiring-codes");
    expect(withKnownWiringCodes({ insulation: "rope", racewayType: "PVC schedule 80" })).toEqual({ insulation: "", racewayType: "PVC schedule 80" });
    const hut = exampleJson("tamarack-hut");
    Object.assign(circuit(hut, "C-2"), withKnownWiringCodes({ ...circuit(hut, "C-2"), insulation: "rope" }));
    expect(result(run(hut), "wiring-method-location:C-2").missing).toEqual(["circuits.1.insulation"]);
  });
});
