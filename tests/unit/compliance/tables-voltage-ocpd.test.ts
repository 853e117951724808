import { describe, expect, it } from "vitest";
import {
  crystallineVoltageCorrectionFactor,
  crystallineVoltageCorrectionFactorOrUndefined,
  nextStandardOcpdRatingA,
  nextStandardOcpdRatingForA,
  smallConductorMaxOcpdA,
  standardOcpdRatingsA,
  STANDARD_OCPD_RATINGS_A,
} from "@/lib/compliance/tables";

describe("Table 690.7(A) crystalline silicon voltage correction", () => {
  // NEC 2017 / 2020 / 2023 Table 690.7(A), by lowest expected ambient (°C).
  const rows: [number, number][] = [
    [24, 1.02], // 24 to 20
    [20, 1.02],
    [19, 1.04], // 19 to 15
    [12, 1.06], // 14 to 10
    [5, 1.08], // 9 to 5
    [0, 1.1], // 4 to 0
    [-1, 1.12], // −1 to −5
    [-5, 1.12],
    [-6, 1.14], // −6 to −10
    [-10, 1.14],
    [-15, 1.16], // −11 to −15
    [-18, 1.18], // −16 to −20
    [-25, 1.2], // −21 to −25
    [-30, 1.21], // −26 to −30
    [-33, 1.23], // −31 to −35
    [-40, 1.25], // −36 to −40
  ];
  it.each(rows)("NEC 2020 Table 690.7(A): %d °C → %d", (lowC, factor) => {
    expect(crystallineVoltageCorrectionFactor(lowC)).toBe(factor);
  });

  it("rounds a fractional temperature toward the colder row", () => {
    // −5.5 °C is colder than the −1 to −5 row; the −6 to −10 factor is the conservative one.
    expect(crystallineVoltageCorrectionFactor(-5.5)).toBe(1.14);
    expect(crystallineVoltageCorrectionFactor(-0.2)).toBe(1.12);
  });

  it("is 1.00 at and above the 25 °C rating temperature", () => {
    // Voc is rated at 25 °C (STC); Table 690.7(A) begins at 24 °C.
    expect(crystallineVoltageCorrectionFactor(25)).toBe(1.0);
    expect(crystallineVoltageCorrectionFactor(40)).toBe(1.0);
  });

  it("gives no factor below −40 °C, where the table ends", () => {
    expect(crystallineVoltageCorrectionFactorOrUndefined(-41)).toBeUndefined();
    expect(crystallineVoltageCorrectionFactorOrUndefined(Number.NaN)).toBeUndefined();
    expect(() => crystallineVoltageCorrectionFactor(-41)).toThrow(RangeError);
  });

  it("never falls as the design temperature gets colder", () => {
    let previous = 0;
    for (let t = 30; t >= -40; t -= 0.5) {
      const f = crystallineVoltageCorrectionFactor(t);
      expect(f).toBeGreaterThanOrEqual(previous);
      previous = f;
    }
  });
});

describe("240.6(A) standard ampere ratings", () => {
  it("lists the ratings of NEC 2020 240.6(A), 15 A to 6000 A", () => {
    // NEC 2020 240.6(A) text; the same list in NEC 2017 240.6(A).
    expect(STANDARD_OCPD_RATINGS_A).toEqual([
      15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450,
      500, 600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
    ]);
  });

  it.each([
    [1, 15],
    [15, 15],
    [15.1, 20],
    [41, 45],
    [46.9, 50],
    [51, 60],
    [101, 110],
    [111, 125],
    [126, 150],
    [201, 225],
    [451, 500],
    [801, 1000],
    [6000, 6000],
  ])("NEC 2020 240.6(A): next standard rating at or above %d A is %d A", (minimumA, ratingA) => {
    expect(nextStandardOcpdRatingA(minimumA)).toBe(ratingA);
  });

  it("has no standard rating above 6000 A", () => {
    expect(nextStandardOcpdRatingA(6001)).toBeUndefined();
    expect(nextStandardOcpdRatingA(Number.NaN)).toBeUndefined();
  });

  it("adds 10 A to the list in 2023", () => {
    // NEC 2023 Table 240.6(A) begins at 10 A for fuses and inverse time breakers.
    expect(standardOcpdRatingsA("2023", "breaker")[0]).toBe(10);
    expect(nextStandardOcpdRatingForA("2023", "breaker", 8)).toBe(10);
    // NEC 2020 240.6(A): breakers start at 15 A; 10 A is an additional fuse rating only.
    expect(nextStandardOcpdRatingForA("2020", "breaker", 8)).toBe(15);
    expect(nextStandardOcpdRatingForA("2020", "fuse", 8)).toBe(10);
  });

  it("includes the additional fuse ratings", () => {
    // NEC 2017 / 2020 240.6(A): additional standard fuse ratings 1, 3, 6, 10 and 601 A.
    expect(standardOcpdRatingsA("2017", "fuse")).toEqual(expect.arrayContaining([1, 3, 6, 10, 601]));
    expect(nextStandardOcpdRatingForA("2020", "fuse", 2)).toBe(3);
    expect(nextStandardOcpdRatingForA("2020", "fuse", 601)).toBe(601);
    expect(nextStandardOcpdRatingForA("2020", "breaker", 601)).toBe(700);
    // NEC 2023 Table 240.6(A): additional fuse ratings 1, 3, 6 and 601 A (10 A now in the table).
    expect(standardOcpdRatingsA("2023", "fuse").filter((r) => r === 10)).toHaveLength(1);
  });

  it("keeps every list ascending", () => {
    for (const edition of ["2017", "2020", "2023"] as const) {
      for (const kind of ["fuse", "breaker"] as const) {
        const list = standardOcpdRatingsA(edition, kind);
        expect([...list].sort((a, b) => a - b)).toEqual(list);
      }
    }
  });
});

describe("240.4(D) small-conductor limits", () => {
  it.each([
    ["cu", "18", 7], // NEC 2020 240.4(D)(1): 18 AWG copper, 7 A
    ["cu", "16", 10], // NEC 2020 240.4(D)(2): 16 AWG copper, 10 A
    ["cu", "14", 15], // NEC 2020 240.4(D)(3): 14 AWG copper, 15 A
    ["al", "12", 15], // NEC 2020 240.4(D)(4): 12 AWG aluminium and copper-clad aluminium, 15 A
    ["cu", "12", 20], // NEC 2020 240.4(D)(5): 12 AWG copper, 20 A
    ["al", "10", 25], // NEC 2020 240.4(D)(6): 10 AWG aluminium and copper-clad aluminium, 25 A
    ["cu", "10", 30], // NEC 2020 240.4(D)(7): 10 AWG copper, 30 A
  ] as const)("NEC 2020 240.4(D): %s %s AWG at most %d A", (material, size, maxA) => {
    expect(smallConductorMaxOcpdA(material, size)).toBe(maxA);
  });

  it("does not limit 8 AWG and larger", () => {
    expect(smallConductorMaxOcpdA("cu", "8")).toBeUndefined();
    expect(smallConductorMaxOcpdA("al", "8")).toBeUndefined();
    expect(smallConductorMaxOcpdA("cu", "4/0")).toBeUndefined();
  });

  it("catches 10 AWG copper on a 40 A breaker", () => {
    // Common reason for a packet to come back: 240.4(D) caps 10 AWG copper at 30 A.
    expect(40).toBeGreaterThan(smallConductorMaxOcpdA("cu", "10")!);
  });
});
