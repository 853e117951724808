/**
 * Ambient temperature correction factors based on 30 °C (86 °F), for the
 * ampacities of Table 310.16.
 *
 *   NEC 2017: Table 310.15(B)(2)(a)
 *   NEC 2020: Table 310.15(B)(1)
 *   NEC 2023: Table 310.15(B)(1)(1) (the 30 °C table gained a "(1)"; the
 *             40 °C table of 310.15(B)(1)(2) sits beside it)
 *
 * The factors did not change between the editions, so one table serves all
 * three. A dash in the table (the conductor may not be used at that ambient)
 * is null here.
 */
import type { NecEdition } from "../../schemas/project-record";
import type { TempRatingC } from "./units";

export interface AmbientCorrectionRow {
  /** Highest ambient of the row, °C; the row covers (previous row's maxC, maxC]. */
  maxC: number;
  /** Factors for 60 °C, 75 °C, 90 °C insulation; null = not permitted. */
  factors: readonly [number | null, number | null, number | null];
}

export const AMBIENT_CORRECTION_30C: readonly AmbientCorrectionRow[] = [
  { maxC: 10, factors: [1.29, 1.2, 1.15] }, // "10 or less"
  { maxC: 15, factors: [1.22, 1.15, 1.12] }, // 11–15
  { maxC: 20, factors: [1.15, 1.11, 1.08] }, // 16–20
  { maxC: 25, factors: [1.08, 1.05, 1.04] }, // 21–25
  { maxC: 30, factors: [1.0, 1.0, 1.0] }, // 26–30
  { maxC: 35, factors: [0.91, 0.94, 0.96] }, // 31–35
  { maxC: 40, factors: [0.82, 0.88, 0.91] }, // 36–40
  { maxC: 45, factors: [0.71, 0.82, 0.87] }, // 41–45
  { maxC: 50, factors: [0.58, 0.75, 0.82] }, // 46–50
  { maxC: 55, factors: [0.41, 0.67, 0.76] }, // 51–55
  { maxC: 60, factors: [null, 0.58, 0.71] }, // 56–60
  { maxC: 65, factors: [null, 0.47, 0.65] }, // 61–65
  { maxC: 70, factors: [null, 0.33, 0.58] }, // 66–70
  { maxC: 75, factors: [null, null, 0.5] }, // 71–75
  { maxC: 80, factors: [null, null, 0.41] }, // 76–80
  { maxC: 85, factors: [null, null, 0.29] }, // 81–85
];

export const AMBIENT_CORRECTION_BY_EDITION: Readonly<Record<NecEdition, readonly AmbientCorrectionRow[]>> = {
  "2017": AMBIENT_CORRECTION_30C,
  "2020": AMBIENT_CORRECTION_30C,
  "2023": AMBIENT_CORRECTION_30C,
};

const RATING_INDEX: Record<TempRatingC, 0 | 1 | 2> = { 60: 0, 75: 1, 90: 2 };

/**
 * Correction factor for an ambient in °C, or undefined where the table forbids
 * the insulation at that ambient (or the ambient is beyond the table's last row).
 *
 * The rows are whole degrees (31–35, 36–40 …); a fractional ambient is rounded
 * up to the next whole degree, so 35.2 °C reads the 36–40 row: the hotter row
 * gives the smaller factor, the conservative side.
 *
 * The first row reads "10 or less", so any colder ambient takes that row's
 * factor: the table itself extends the row downward, and a higher factor is not
 * claimed for cold the table does not list.
 */
export function ambientCorrectionFactor(
  edition: NecEdition,
  ambientC: number,
  ratingC: TempRatingC,
): number | undefined {
  if (!Number.isFinite(ambientC)) return undefined;
  const wholeC = Math.ceil(ambientC);
  const row = AMBIENT_CORRECTION_BY_EDITION[edition].find((r) => wholeC <= r.maxC);
  if (!row) return undefined;
  return row.factors[RATING_INDEX[ratingC]] ?? undefined;
}
