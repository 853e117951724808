/**
 * Voltage correction factors for crystalline and multicrystalline silicon
 * modules: multiply the rated open-circuit voltage by the factor for the
 * lowest expected ambient temperature. Used only where the manufacturer's
 * temperature coefficient is not available (690.7(A)(1) prefers it).
 *
 *   NEC 2017 / 2020 / 2023: Table 690.7(A). Same rows in all three editions.
 *
 * The rows are whole degrees Celsius; the °F column of the table is not kept.
 */

export interface VoltageCorrectionRow {
  /** Warmest ambient of the row, °C; the row covers [minC, maxC]. */
  maxC: number;
  minC: number;
  factor: number;
}

export const VOLTAGE_CORRECTION_690_7_A: readonly VoltageCorrectionRow[] = [
  { maxC: 24, minC: 20, factor: 1.02 },
  { maxC: 19, minC: 15, factor: 1.04 },
  { maxC: 14, minC: 10, factor: 1.06 },
  { maxC: 9, minC: 5, factor: 1.08 },
  { maxC: 4, minC: 0, factor: 1.1 },
  { maxC: -1, minC: -5, factor: 1.12 },
  { maxC: -6, minC: -10, factor: 1.14 },
  { maxC: -11, minC: -15, factor: 1.16 },
  { maxC: -16, minC: -20, factor: 1.18 },
  { maxC: -21, minC: -25, factor: 1.2 },
  { maxC: -26, minC: -30, factor: 1.21 },
  { maxC: -31, minC: -35, factor: 1.23 },
  { maxC: -36, minC: -40, factor: 1.25 },
];

/** Coldest ambient the table covers, °C. */
export const VOLTAGE_CORRECTION_TABLE_MIN_C = -40;

/**
 * Factor for the lowest expected ambient, or undefined below −40 °C where the
 * table has no row (the module's own coefficient is then required).
 * A fractional temperature is rounded down to the next whole degree (−5.5 °C
 * reads the −6 to −10 row): colder gives the larger factor, the conservative side.
 * At 25 °C and above the factor is 1.00: Voc is rated at 25 °C cell temperature
 * and the table starts at 24 °C.
 */
export function crystallineVoltageCorrectionFactorOrUndefined(lowTempC: number): number | undefined {
  if (Number.isNaN(lowTempC)) return undefined;
  const wholeC = Math.floor(lowTempC);
  if (wholeC >= 25) return 1.0;
  return VOLTAGE_CORRECTION_690_7_A.find((r) => wholeC <= r.maxC && wholeC >= r.minC)?.factor;
}

/**
 * As `crystallineVoltageCorrectionFactorOrUndefined`, for callers that have
 * already checked `lowTempC >= VOLTAGE_CORRECTION_TABLE_MIN_C`. Throws a
 * RangeError below −40 °C (or for NaN) rather than invent a factor the table
 * does not give.
 */
export function crystallineVoltageCorrectionFactor(lowTempC: number): number {
  const factor = crystallineVoltageCorrectionFactorOrUndefined(lowTempC);
  if (factor === undefined) {
    throw new RangeError(
      `Table 690.7(A) has no factor for ${lowTempC} °C (coldest row −36 to −40 °C); use the module's Voc temperature coefficient`,
    );
  }
  return factor;
}
