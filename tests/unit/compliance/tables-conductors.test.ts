import { describe, expect, it } from "vitest";
import {
  CONDUCTOR_SIZES_ASCENDING,
  EGC_TABLE_250_122,
  circularMils,
  compareConductorSize,
  dcResistanceOhmPerKft,
  minimumEgcSize,
  nextLargerConductorSize,
} from "@/lib/compliance/tables";
import { CONDUCTOR_SIZES } from "@/lib/schemas/project-record";

describe("Chapter 9 Table 8 DC resistance at 75 °C", () => {
  it.each([
    // NEC 2020 Chapter 9 Table 8, stranded uncoated copper, Ω/kft
    ["cu", "18", 7.95],
    ["cu", "14", 3.14],
    ["cu", "12", 1.98],
    ["cu", "10", 1.24],
    ["cu", "8", 0.778],
    ["cu", "6", 0.491],
    ["cu", "4", 0.308],
    ["cu", "2", 0.194],
    ["cu", "1/0", 0.122],
    ["cu", "2/0", 0.0967],
    ["cu", "4/0", 0.0608],
    ["cu", "250", 0.0515],
    ["cu", "500", 0.0258],
    ["cu", "1000", 0.0129],
    ["cu", "2000", 0.00643],
    // NEC 2020 Chapter 9 Table 8, aluminium (stranded), Ω/kft
    ["al", "12", 3.25],
    ["al", "10", 2.04],
    ["al", "8", 1.28],
    ["al", "6", 0.808],
    ["al", "4", 0.508],
    ["al", "2", 0.319],
    ["al", "1/0", 0.201],
    ["al", "4/0", 0.1],
    ["al", "250", 0.0847],
    ["al", "500", 0.0424],
    ["al", "2000", 0.0106],
  ] as const)("NEC 2020 Chapter 9 Table 8: %s %s = %d Ω/kft", (material, size, ohm) => {
    expect(dcResistanceOhmPerKft(material, size)).toBe(ohm);
  });

  it("has aluminium about 1.64 times copper, as the resistivities give", () => {
    // Resistivity ratio Al/Cu ≈ 1.64 (common practice for cross-checking Table 8).
    for (const size of CONDUCTOR_SIZES) {
      const ratio = dcResistanceOhmPerKft("al", size)! / dcResistanceOhmPerKft("cu", size)!;
      expect(ratio, size).toBeGreaterThan(1.6);
      expect(ratio, size).toBeLessThan(1.7);
    }
  });

  it("falls as area grows, with resistance × area nearly constant", () => {
    // R ∝ 1/area: copper at 75 °C ≈ 12.9 Ω·cmil/ft (from the Table 8 figures themselves).
    let previous = Number.POSITIVE_INFINITY;
    for (const size of CONDUCTOR_SIZES_ASCENDING) {
      const r = dcResistanceOhmPerKft("cu", size)!;
      expect(r).toBeLessThan(previous);
      previous = r;
      const ohmCmilPerFt = (r / 1000) * circularMils(size);
      expect(ohmCmilPerFt, size).toBeGreaterThan(12.5);
      expect(ohmCmilPerFt, size).toBeLessThan(13.4);
    }
  });
});

describe("conductor areas and ordering", () => {
  it.each([
    ["18", 1620],
    ["14", 4110],
    ["12", 6530],
    ["10", 10380],
    ["8", 16510],
    ["6", 26240],
    ["4", 41740],
    ["2", 66360],
    ["1/0", 105600],
    ["4/0", 211600],
    ["250", 250000],
    ["2000", 2000000],
  ] as const)("NEC 2020 Chapter 9 Table 8 area: %s = %d cmil", (size, cmil) => {
    expect(circularMils(size)).toBe(cmil);
  });

  it("orders sizes by area", () => {
    expect(compareConductorSize("10", "12")).toBeGreaterThan(0);
    expect(compareConductorSize("1/0", "1")).toBeGreaterThan(0);
    expect(compareConductorSize("4/0", "250")).toBeLessThan(0);
    expect(compareConductorSize("6", "6")).toBe(0);
    expect(CONDUCTOR_SIZES_ASCENDING[0]).toBe("18");
    expect(CONDUCTOR_SIZES_ASCENDING.at(-1)).toBe("2000");
    expect(nextLargerConductorSize("4/0")).toBe("250");
    expect(nextLargerConductorSize("10")).toBe("8");
    expect(nextLargerConductorSize("2000")).toBeUndefined();
  });
});

describe("Table 250.122 minimum equipment grounding conductor", () => {
  it.each([
    // NEC 2020 Table 250.122, copper column, OCPD not exceeding
    [15, "cu", "14"],
    [20, "cu", "12"],
    [30, "cu", "10"],
    [60, "cu", "10"],
    [100, "cu", "8"],
    [125, "cu", "6"],
    [200, "cu", "6"],
    [300, "cu", "4"],
    [400, "cu", "3"],
    [500, "cu", "2"],
    [600, "cu", "1"],
    [800, "cu", "1/0"],
    [1000, "cu", "2/0"],
    [1200, "cu", "3/0"],
    [1600, "cu", "4/0"],
    [2000, "cu", "250"],
    [2500, "cu", "350"],
    [3000, "cu", "400"],
    [4000, "cu", "500"],
    [5000, "cu", "700"],
    [6000, "cu", "800"],
    // NEC 2020 Table 250.122, aluminium or copper-clad aluminium column
    [15, "al", "12"],
    [20, "al", "10"],
    [60, "al", "8"],
    [100, "al", "6"],
    [200, "al", "4"],
    [300, "al", "2"],
    [400, "al", "1"],
    [500, "al", "1/0"],
    [600, "al", "2/0"],
    [800, "al", "3/0"],
    [1000, "al", "4/0"],
    [1200, "al", "250"],
    [1600, "al", "350"],
    [2000, "al", "400"],
    [2500, "al", "600"],
    [3000, "al", "600"],
    [4000, "al", "750"],
  ] as const)("NEC 2020 Table 250.122: %d A, %s → %s", (ocpdA, material, size) => {
    expect(minimumEgcSize(ocpdA, material)).toBe(size);
  });

  it("returns 1250 kcmil where the table prints 1200 kcmil aluminium", () => {
    // NEC 2020 Table 250.122: 5000 A and 6000 A, aluminium 1200 kcmil; 1250 kcmil is the next schedule size.
    expect(minimumEgcSize(5000, "al")).toBe("1250");
    expect(minimumEgcSize(6000, "al")).toBe("1250");
    expect(EGC_TABLE_250_122.find((r) => r.maxOcpdA === 6000)?.alAsPrinted).toBe("1200 kcmil");
  });

  it("reads ratings between rows from the next row up", () => {
    // "Not exceeding": a 70 A device is above 60 A, so the 100 A row applies.
    expect(minimumEgcSize(70, "cu")).toBe("8");
    expect(minimumEgcSize(61, "cu")).toBe("8");
    expect(minimumEgcSize(10, "cu")).toBe("14");
  });

  it("has no entry above 6000 A or for non-positive ratings", () => {
    expect(minimumEgcSize(6001, "cu")).toBeUndefined();
    expect(minimumEgcSize(0, "cu")).toBeUndefined();
    expect(minimumEgcSize(Number.NaN, "al")).toBeUndefined();
  });

  it("never shrinks as the device grows", () => {
    let previous = minimumEgcSize(1, "cu")!;
    for (let a = 1; a <= 6000; a += 7) {
      const size = minimumEgcSize(a, "cu")!;
      expect(compareConductorSize(size, previous)).toBeGreaterThanOrEqual(0);
      previous = size;
    }
  });
});
