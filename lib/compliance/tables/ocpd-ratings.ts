/**
 * Standard ampere ratings for fuses and inverse time circuit breakers, and the
 * small-conductor overcurrent limits.
 *
 *   NEC 2017 / 2020: 240.6(A), ratings listed in the text; additional standard
 *                    fuse ratings 1, 3, 6, 10 and 601 A.
 *   NEC 2023:        Table 240.6(A). 10 A joined the list for fuses and
 *                    breakers alike; the additional fuse ratings are 1, 3, 6
 *                    and 601 A.
 *
 *   240.4(D) small conductors, all three editions: 18 Cu 7 A, 16 Cu 10 A,
 *   14 Cu 15 A, 12 Al 15 A, 12 Cu 20 A, 10 Al 25 A, 10 Cu 30 A. (The 2023
 *   edition also lists 14 AWG copper-clad aluminium at 10 A; the record's
 *   "al" material stands for aluminium and copper-clad aluminium together,
 *   and 14 AWG Al has no Table 310.16 ampacity, so it is left out here.)
 */
import type { ConductorSize, NecEdition } from "../../schemas/project-record";
import type { Material } from "./units";

/** 15 A … 6000 A: the ratings standard for both fuses and breakers in every edition. */
export const STANDARD_OCPD_RATINGS_A: readonly number[] = Object.freeze([
  15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450,
  500, 600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
]);

const RATINGS_2023_A: readonly number[] = Object.freeze([10, ...STANDARD_OCPD_RATINGS_A]);

export type OcpdKind = "fuse" | "breaker";

const ADDITIONAL_FUSE_RATINGS_A: Readonly<Record<NecEdition, readonly number[]>> = {
  "2017": [1, 3, 6, 10, 601],
  "2020": [1, 3, 6, 10, 601],
  "2023": [1, 3, 6, 601],
};

/** Standard ratings of one edition for one kind of device, ascending. */
export function standardOcpdRatingsA(edition: NecEdition, kind: OcpdKind): readonly number[] {
  const base = edition === "2023" ? RATINGS_2023_A : STANDARD_OCPD_RATINGS_A;
  if (kind === "breaker") return base;
  return [...base, ...ADDITIONAL_FUSE_RATINGS_A[edition]].sort((a, b) => a - b);
}

/**
 * Smallest rating of STANDARD_OCPD_RATINGS_A at or above `minimumA`; undefined
 * above 6000 A or for NaN. Below 15 A returns 15 A (use
 * `nextStandardOcpdRatingForA` for the edition's 10 A and fuse-only ratings).
 */
export function nextStandardOcpdRatingA(minimumA: number): number | undefined {
  return STANDARD_OCPD_RATINGS_A.find((r) => r >= minimumA);
}

/** Smallest standard rating of the edition and device kind at or above `minimumA`. */
export function nextStandardOcpdRatingForA(edition: NecEdition, kind: OcpdKind, minimumA: number): number | undefined {
  return standardOcpdRatingsA(edition, kind).find((r) => r >= minimumA);
}

/** 240.4(D) limits, amperes; the same in 2017, 2020 and 2023. */
export const SMALL_CONDUCTOR_MAX_OCPD_A: Readonly<Record<Material, Partial<Record<ConductorSize, number>>>> = {
  cu: { "18": 7, "16": 10, "14": 15, "12": 20, "10": 30 },
  al: { "12": 15, "10": 25 }, // aluminium and copper-clad aluminium
};

/** Largest overcurrent device 240.4(D) allows on the conductor, or undefined where 240.4(D) does not limit it. */
export function smallConductorMaxOcpdA(material: Material, size: ConductorSize): number | undefined {
  return SMALL_CONDUCTOR_MAX_OCPD_A[material][size];
}
