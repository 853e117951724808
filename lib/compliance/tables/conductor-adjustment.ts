/**
 * Adjustment factors for more than three current-carrying conductors in a
 * raceway or cable (longer than 24 in).
 *
 *   NEC 2017: Table 310.15(B)(3)(a)
 *   NEC 2020: Table 310.15(C)(1)
 *   NEC 2023: Table 310.15(C)(1)
 *
 * Same percentages in all three editions. The factor already allows for the
 * ambient correction being applied separately.
 */
import type { NecEdition } from "../../schemas/project-record";

export interface ConductorAdjustmentRow {
  /** Highest conductor count of the row; the last row is open-ended. */
  maxCount: number;
  factor: number;
}

export const CONDUCTOR_ADJUSTMENT: readonly ConductorAdjustmentRow[] = [
  { maxCount: 3, factor: 1.0 }, // three or fewer: Table 310.16 applies as printed
  { maxCount: 6, factor: 0.8 }, // 4–6: 80 %
  { maxCount: 9, factor: 0.7 }, // 7–9: 70 %
  { maxCount: 20, factor: 0.5 }, // 10–20: 50 %
  { maxCount: 30, factor: 0.45 }, // 21–30: 45 %
  { maxCount: 40, factor: 0.4 }, // 31–40: 40 %
  { maxCount: Number.POSITIVE_INFINITY, factor: 0.35 }, // 41 and above: 35 %
];

export const CONDUCTOR_ADJUSTMENT_BY_EDITION: Readonly<Record<NecEdition, readonly ConductorAdjustmentRow[]>> = {
  "2017": CONDUCTOR_ADJUSTMENT,
  "2020": CONDUCTOR_ADJUSTMENT,
  "2023": CONDUCTOR_ADJUSTMENT,
};

/**
 * Factor for a count of current-carrying conductors. A fractional count is
 * rounded up (a conductor is either there or not; rounding up is the
 * conservative reading). Counts of three or fewer give 1.0; a NaN count
 * also gives 1.0, so the record's validation must refuse it.
 */
export function conductorCountAdjustment(edition: NecEdition, currentCarryingConductors: number): number {
  if (!(currentCarryingConductors > 3)) return 1.0;
  const count = Math.ceil(currentCarryingConductors);
  const row = CONDUCTOR_ADJUSTMENT_BY_EDITION[edition].find((r) => count <= r.maxCount);
  return row ? row.factor : 0.35;
}
