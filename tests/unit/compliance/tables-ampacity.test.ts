import { describe, expect, it } from "vitest";
import {
  AMPACITY_TABLE_BY_EDITION,
  ampacityA,
  ambientCorrectionFactor,
  conductorCountAdjustment,
  rooftopTemperatureAdderC,
  type Material,
  type TempRatingC,
} from "@/lib/compliance/tables";
import { CONDUCTOR_SIZES, NEC_EDITIONS, type ConductorSize, type NecEdition } from "@/lib/schemas/project-record";

// [size, 60 °C, 75 °C, 90 °C] as printed in NEC 2020 Table 310.16 (= NEC 2017
// Table 310.15(B)(16) = NEC 2023 Table 310.16), copper column.
const COPPER: [ConductorSize, number, number, number][] = [
  ["14", 15, 20, 25],
  ["12", 20, 25, 30],
  ["10", 30, 35, 40],
  ["8", 40, 50, 55],
  ["6", 55, 65, 75],
  ["4", 70, 85, 95],
  ["3", 85, 100, 115],
  ["2", 95, 115, 130],
  ["1", 110, 130, 145],
  ["1/0", 125, 150, 170],
  ["2/0", 145, 175, 195],
  ["3/0", 165, 200, 225],
  ["4/0", 195, 230, 260],
  ["250", 215, 255, 290],
  ["350", 260, 310, 350],
  ["500", 320, 380, 430],
  ["750", 400, 475, 535],
  ["1000", 455, 545, 615],
  ["2000", 555, 665, 750],
];

// Same tables, aluminium or copper-clad aluminium column.
const ALUMINIUM: [ConductorSize, number, number, number][] = [
  ["12", 15, 20, 25],
  ["10", 25, 30, 35],
  ["8", 35, 40, 45],
  ["6", 40, 50, 55],
  ["4", 55, 65, 75],
  ["3", 65, 75, 85],
  ["2", 75, 90, 100],
  ["1", 85, 100, 115],
  ["1/0", 100, 120, 135],
  ["2/0", 115, 135, 150],
  ["3/0", 130, 155, 175],
  ["4/0", 150, 180, 205],
  ["250", 170, 205, 230],
  ["350", 210, 250, 280],
  ["500", 260, 310, 350],
  ["750", 320, 385, 435],
  ["1000", 375, 445, 500],
  ["2000", 470, 560, 630],
];

const TABLE_NAME: Record<NecEdition, string> = {
  "2017": "NEC 2017 Table 310.15(B)(16)",
  "2020": "NEC 2020 Table 310.16",
  "2023": "NEC 2023 Table 310.16",
};

function cases(material: Material, rows: [ConductorSize, number, number, number][]) {
  return NEC_EDITIONS.flatMap((edition) =>
    rows.flatMap(([size, a60, a75, a90]) =>
      ([60, 75, 90] as const).map((rating, i) => ({
        edition,
        size,
        rating,
        expected: [a60, a75, a90][i]!,
        source: `${TABLE_NAME[edition]}, ${rating} °C ${material === "cu" ? "Cu" : "Al"}`,
      })),
    ),
  );
}

describe("conductor ampacity", () => {
  it.each(cases("cu", COPPER))("$source: $size = $expected A", ({ edition, size, rating, expected }) => {
    expect(ampacityA(edition, "cu", size, rating)).toBe(expected);
  });

  it.each(cases("al", ALUMINIUM))("$source: $size = $expected A", ({ edition, size, rating, expected }) => {
    expect(ampacityA(edition, "al", size, rating)).toBe(expected);
  });

  it("has no aluminium entry below 12 AWG", () => {
    // NEC 2020 Table 310.16: the aluminium column begins at 12 AWG.
    for (const rating of [60, 75, 90] as const) {
      expect(ampacityA("2020", "al", "14", rating)).toBeUndefined();
      expect(ampacityA("2020", "al", "18", rating)).toBeUndefined();
    }
  });

  it("gives 18 and 16 AWG copper a 90 °C value only", () => {
    // NEC 2020 Table 310.16: 18 AWG 14 A and 16 AWG 18 A at 90 °C, no 60/75 °C entry.
    expect(ampacityA("2020", "cu", "18", 90)).toBe(14);
    expect(ampacityA("2020", "cu", "16", 90)).toBe(18);
    expect(ampacityA("2020", "cu", "18", 75)).toBeUndefined();
    expect(ampacityA("2017", "cu", "16", 60)).toBeUndefined();
  });

  it("covers every schedule size from 14 AWG to 2000 kcmil in copper at every rating", () => {
    const fromFourteen = CONDUCTOR_SIZES.slice(CONDUCTOR_SIZES.indexOf("14"));
    for (const size of fromFourteen) {
      for (const rating of [60, 75, 90] as TempRatingC[]) {
        expect(ampacityA("2023", "cu", size, rating), `${size} at ${rating}`).toBeGreaterThan(0);
      }
    }
  });

  it("never falls as the conductor gets larger or the rating hotter", () => {
    // Property of the printed table: monotone down each column and along each row.
    for (const material of ["cu", "al"] as const) {
      let previous = [0, 0, 0];
      for (const size of CONDUCTOR_SIZES) {
        const row = ([60, 75, 90] as const).map((r) => ampacityA("2020", material, size, r));
        if (row[2] === undefined) continue;
        row.forEach((a, i) => {
          if (a !== undefined) expect(a).toBeGreaterThanOrEqual(previous[i]!);
        });
        if (row[0] !== undefined && row[1] !== undefined) {
          expect(row[1]).toBeGreaterThanOrEqual(row[0]);
          expect(row[2]).toBeGreaterThanOrEqual(row[1]);
          previous = row as number[];
        }
      }
    }
  });

  it("shares one table across editions, with no copy", () => {
    expect(AMPACITY_TABLE_BY_EDITION["2017"]).toBe(AMPACITY_TABLE_BY_EDITION["2020"]);
    expect(AMPACITY_TABLE_BY_EDITION["2020"]).toBe(AMPACITY_TABLE_BY_EDITION["2023"]);
  });
});

const AMBIENT_NAME: Record<NecEdition, string> = {
  "2017": "NEC 2017 Table 310.15(B)(2)(a)",
  "2020": "NEC 2020 Table 310.15(B)(1)",
  "2023": "NEC 2023 Table 310.15(B)(1)(1)",
};

// [ambient °C, 60 °C, 75 °C, 90 °C factors]; null = the table's dash.
const AMBIENT_ROWS: [number, number | null, number | null, number | null][] = [
  [10, 1.29, 1.2, 1.15], // "10 or less"
  [13, 1.22, 1.15, 1.12], // 11–15
  [20, 1.15, 1.11, 1.08], // 16–20
  [22, 1.08, 1.05, 1.04], // 21–25
  [30, 1.0, 1.0, 1.0], // 26–30
  [31, 0.91, 0.94, 0.96], // 31–35
  [35, 0.91, 0.94, 0.96], // 31–35
  [36, 0.82, 0.88, 0.91], // 36–40
  [40, 0.82, 0.88, 0.91], // 36–40
  [41, 0.71, 0.82, 0.87], // 41–45
  [48, 0.58, 0.75, 0.82], // 46–50
  [55, 0.41, 0.67, 0.76], // 51–55
  [58, null, 0.58, 0.71], // 56–60
  [61, null, 0.47, 0.65], // 61–65
  [65, null, 0.47, 0.65], // 61–65
  [68, null, 0.33, 0.58], // 66–70
  [73, null, null, 0.5], // 71–75
  [80, null, null, 0.41], // 76–80
  [85, null, null, 0.29], // 81–85
];

describe("ambient temperature correction", () => {
  const ambientCases = NEC_EDITIONS.flatMap((edition) =>
    AMBIENT_ROWS.flatMap(([ambientC, ...factors]) =>
      ([60, 75, 90] as const).map((rating, i) => ({
        edition,
        ambientC,
        rating,
        expected: factors[i] ?? undefined,
        source: `${AMBIENT_NAME[edition]}, ${rating} °C column`,
      })),
    ),
  );

  it.each(ambientCases)("$source: $ambientC °C → $expected", ({ edition, ambientC, rating, expected }) => {
    expect(ambientCorrectionFactor(edition, ambientC, rating)).toBe(expected);
  });

  it("returns undefined beyond the last row", () => {
    // NEC 2020 Table 310.15(B)(1): the table ends at 81–85 °C.
    expect(ambientCorrectionFactor("2020", 86, 90)).toBeUndefined();
    expect(ambientCorrectionFactor("2020", 71, 75)).toBeUndefined();
    expect(ambientCorrectionFactor("2020", 56, 60)).toBeUndefined();
  });

  it("takes the '10 or less' row for any colder ambient", () => {
    // NEC 2020 Table 310.15(B)(1) first row reads "10 or less".
    expect(ambientCorrectionFactor("2023", -40, 90)).toBe(1.15);
    expect(ambientCorrectionFactor("2017", -5, 75)).toBe(1.2);
  });

  it("reads a fractional ambient in the hotter row", () => {
    // 35.2 °C lies past the 31–35 row; the 36–40 row is the conservative reading.
    expect(ambientCorrectionFactor("2020", 35.2, 90)).toBe(0.91);
    expect(ambientCorrectionFactor("2020", 30.1, 90)).toBe(0.96);
  });

  it("returns undefined for NaN", () => {
    expect(ambientCorrectionFactor("2020", Number.NaN, 90)).toBeUndefined();
  });
});

describe("more than three current-carrying conductors", () => {
  // NEC 2017 Table 310.15(B)(3)(a) = NEC 2020 / 2023 Table 310.15(C)(1).
  const rows: [number, number][] = [
    [1, 1.0],
    [3, 1.0],
    [4, 0.8],
    [6, 0.8],
    [7, 0.7],
    [9, 0.7],
    [10, 0.5],
    [20, 0.5],
    [21, 0.45],
    [30, 0.45],
    [31, 0.4],
    [40, 0.4],
    [41, 0.35],
    [120, 0.35],
  ];
  const name: Record<NecEdition, string> = {
    "2017": "NEC 2017 Table 310.15(B)(3)(a)",
    "2020": "NEC 2020 Table 310.15(C)(1)",
    "2023": "NEC 2023 Table 310.15(C)(1)",
  };
  const adjustmentCases = NEC_EDITIONS.flatMap((edition) =>
    rows.map(([count, expected]) => ({ edition, count, expected, source: name[edition] })),
  );

  it.each(adjustmentCases)("$source: $count conductors → $expected", ({ edition, count, expected }) => {
    expect(conductorCountAdjustment(edition, count)).toBe(expected);
  });

  it("never rises as conductors are added", () => {
    let previous = 1;
    for (let n = 1; n <= 60; n++) {
      const f = conductorCountAdjustment("2023", n);
      expect(f).toBeLessThanOrEqual(previous);
      previous = f;
    }
  });
});

describe("rooftop temperature adder", () => {
  it.each(NEC_EDITIONS)("NEC %s: 33 °C where less than 7/8 in above the roof", (edition) => {
    // NEC 2017 310.15(B)(3)(c); NEC 2020 and 2023 310.15(B)(2): 33 °C (60 °F) below 7/8 in (22 mm).
    expect(rooftopTemperatureAdderC(edition, 0, "THWN-2")).toBe(33);
    expect(rooftopTemperatureAdderC(edition, 0.5, "THWN-2")).toBe(33);
    expect(rooftopTemperatureAdderC(edition, 0.87, "PV wire")).toBe(33);
  });

  it.each(NEC_EDITIONS)("NEC %s: no adder at 7/8 in or more", (edition) => {
    // Same sections: the adder applies only below 7/8 in. The 2014 bands up to 36 in were deleted in 2017.
    expect(rooftopTemperatureAdderC(edition, 7 / 8)).toBe(0);
    expect(rooftopTemperatureAdderC(edition, 3.5)).toBe(0);
    expect(rooftopTemperatureAdderC(edition, 12)).toBe(0);
  });

  it.each(NEC_EDITIONS)("NEC %s: XHHW-2 is exempt", (edition) => {
    // Exception to NEC 2017 310.15(B)(3)(c) / NEC 2020, 2023 310.15(B)(2): Type XHHW-2 not subject to the adder.
    expect(rooftopTemperatureAdderC(edition, 0, "XHHW-2")).toBe(0);
    expect(rooftopTemperatureAdderC(edition, 0, " xhhw-2 ")).toBe(0);
    expect(rooftopTemperatureAdderC(edition, 0, "XHHW")).toBe(33);
  });

  it("treats a missing or negative clearance as on the roof", () => {
    expect(rooftopTemperatureAdderC("2020", Number.NaN)).toBe(33);
    expect(rooftopTemperatureAdderC("2020", -1)).toBe(33);
  });
});
