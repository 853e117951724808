import { describe, expect, it } from "vitest";
import { racewayFill } from "@/lib/compliance/derive/raceway-fill";
import { CHAPTER_9_TABLE_4, CHAPTER_9_TABLE_5, fillLimitPct } from "@/lib/compliance/tables/chapter9-fill";

describe("Chapter 9 tables", () => {
  it("holds the Table 1 limits: 53 % for one conductor, 31 % for two, 40 % for more (NEC 2020 Chapter 9 Table 1)", () => {
    expect([fillLimitPct(1), fillLimitPct(2), fillLimitPct(3), fillLimitPct(9)]).toEqual([53, 31, 40, 40]);
  });

  it("holds Table 4 and Table 5 areas as published", () => {
    // NEC 2020 Chapter 9 Table 4, Article 358 EMT, total area 100 %.
    expect(CHAPTER_9_TABLE_4.EMT!.areas["3/4"]).toBe(0.533);
    expect(CHAPTER_9_TABLE_4.EMT!.areas["1"]).toBe(0.864);
    // NEC 2020 Chapter 9 Table 4, Article 352 PVC Schedule 80 and Schedule 40.
    expect(CHAPTER_9_TABLE_4["PVC-80"]!.areas["3/4"]).toBe(0.409);
    expect(CHAPTER_9_TABLE_4["PVC-40"]!.areas["1"]).toBe(0.832);
    // NEC 2020 Chapter 9 Table 5, THHN/THWN-2.
    expect(CHAPTER_9_TABLE_5.THHN!["12"]).toBe(0.0133);
    expect(CHAPTER_9_TABLE_5["THWN-2"]!["10"]).toBe(0.0211);
    expect(CHAPTER_9_TABLE_5["XHHW-2"]!["10"]).toBe(0.0243);
  });
});

describe("racewayFill", () => {
  // Annex C Table C.1 (EMT, THHN): 1/2 in holds 9 #12, 3/4 in holds 10 #10 (from memory). One more fails 40 %.
  it.each([
    ["1/2", "12", 9, "pass"],
    ["1/2", "12", 10, "fail"],
    ["3/4", "10", 10, "pass"],
    ["3/4", "10", 11, "fail"],
  ] as const)("%s in EMT with %s #%s THHN: %s", (size, conductor, count, status) => {
    const fill = racewayFill({ racewayType: "EMT", racewaySize: size, insulation: "THHN", size: conductor, conductors: count });
    expect(fill.status).toBe(status);
  });

  it("counts the EGC and applies the 31 % limit to two conductors", () => {
    // Two #8 THWN-2 and a #10 EGC in 1/2 in EMT: 2 × 0.0366 + 0.0211 = 0.0943 in² of 0.304 = 31.0 %, three conductors → 40 %.
    const fill = racewayFill({ racewayType: "EMT", racewaySize: "1/2", insulation: "THWN-2", size: "8", conductors: 2, egcSize: "10" });
    expect(fill.status).toBe("pass");
    if (fill.status !== "pass") return;
    expect(fill.count).toBe(3);
    expect(fill.totalAreaIn2).toBeCloseTo(0.0943, 4);
    expect(fill.fillPct).toBeCloseTo(31.02, 1);
    expect(fill.limitPct).toBe(40);
    // Two 2/0 and a #6 in 1 in EMT: 2 × 0.2223 + 0.0507 = 0.4953 of 0.864 = 57.3 % > 40 %.
    const over = racewayFill({ racewayType: "EMT", racewaySize: "1", insulation: "THWN-2", size: "2/0", conductors: 2, egcSize: "6" });
    expect(over.status).toBe("fail");
    // 0.4953 in² at 40 % needs 1.238 in²: 1-1/4 in EMT (1.496 in², Table 4) is the smallest that takes it.
    expect(over.status === "fail" && over.fitsIn).toBe("1-1/4");
    // A single #1/0 THHN alone in 1/2 in EMT: 0.1855 of 0.304 = 61 % > 53 %.
    expect(racewayFill({ racewayType: "EMT", racewaySize: "1/2", insulation: "THHN", size: "1/0", conductors: 1 }).status).toBe("fail");
  });

  it("asks rather than passes when a table cannot give the value, and leaves cable and burial alone", () => {
    expect(racewayFill({ racewayType: "EMT", racewaySize: "3/4", insulation: "PV wire", size: "10", conductors: 2 }).status).toBe("needs-input");
    expect(racewayFill({ racewayType: "EMT", racewaySize: "", insulation: "THHN", size: "10", conductors: 2 }).status).toBe("needs-input");
    expect(racewayFill({ racewayType: "", racewaySize: "3/4", insulation: "THHN", size: "10", conductors: 2 }).status).toBe("needs-input");
    expect(racewayFill({ racewayType: "EMT", racewaySize: "3/4", insulation: "THHN", conductors: 2 }).status).toBe("needs-input");
    expect(racewayFill({ racewayType: "cable tray", racewaySize: "", insulation: "THHN", size: "10", conductors: 2 }).status).toBe("not-applicable");
    expect(racewayFill({ racewayType: "PVC schedule 80", racewaySize: "3/4 in", insulation: "THWN-2", size: "10", conductors: 2, egcSize: "10" }).status).toBe("pass");
  });
});
