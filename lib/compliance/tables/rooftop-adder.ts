/**
 * Temperature adder for raceways and cables exposed to direct sunlight on or
 * above rooftops, added to the outdoor ambient before the ambient correction.
 *
 *   NEC 2017: 310.15(B)(3)(c): 33 °C (60 °F) where the raceway or cable is less
 *             than 7/8 in (22 mm) above the roof, measured to its bottom.
 *             The 2017 edition deleted the banded Table 310.15(B)(3)(c) of 2008–2014
 *             (33 / 22 / 17 / 14 °C up to 36 in); the bands are kept below for
 *             reference only and are not used for any edition Sundocket checks.
 *   NEC 2020: 310.15(B)(2) "Rooftop": same rule, relocated.
 *   NEC 2023: 310.15(B)(2): same rule.
 *
 * Exception (all three editions): Type XHHW-2 conductors are not subject to
 * the adder.
 */
import type { NecEdition } from "../../schemas/project-record";

/** Clearance below which the adder applies, inches (22 mm). */
export const ROOFTOP_ADDER_CLEARANCE_IN = 7 / 8;
export const ROOFTOP_ADDER_C = 33;

export interface RooftopAdderRule {
  /** The adder applies where clearance is strictly less than this, in. */
  belowClearanceIn: number;
  adderC: number;
  /** Insulation types the exception frees from the adder. */
  exemptInsulations: readonly string[];
}

const SINGLE_BAND_RULE: RooftopAdderRule = {
  belowClearanceIn: ROOFTOP_ADDER_CLEARANCE_IN,
  adderC: ROOFTOP_ADDER_C,
  exemptInsulations: ["XHHW-2"],
};

export const ROOFTOP_ADDER_BY_EDITION: Readonly<Record<NecEdition, RooftopAdderRule>> = {
  "2017": SINGLE_BAND_RULE,
  "2020": SINGLE_BAND_RULE,
  "2023": SINGLE_BAND_RULE,
};

/**
 * NEC 2014 Table 310.15(B)(3)(c), superseded; for users comparing with designs
 * made under 2014. Upper clearance of each band in inches, and its adder.
 */
export const ROOFTOP_ADDER_BANDS_2014: readonly { maxClearanceIn: number; adderC: number }[] = [
  { maxClearanceIn: 0.5, adderC: 33 }, // 0–13 mm
  { maxClearanceIn: 3.5, adderC: 22 }, // above 13 mm – 90 mm
  { maxClearanceIn: 12, adderC: 17 }, // above 90 mm – 300 mm
  { maxClearanceIn: 36, adderC: 14 }, // above 300 mm – 900 mm
];

function normaliseInsulation(insulation: string): string {
  return insulation.trim().toUpperCase().replace(/\s+/g, "");
}

/**
 * Adder in °C for a raceway or cable `clearanceIn` inches above the roof
 * (bottom of the raceway to the roof surface). Pass the insulation type to
 * apply the XHHW-2 exception; "XHHW-2" in any case, with or without spaces.
 */
export function rooftopTemperatureAdderC(edition: NecEdition, clearanceIn: number, insulation?: string): number {
  const rule = ROOFTOP_ADDER_BY_EDITION[edition];
  if (insulation !== undefined && rule.exemptInsulations.includes(normaliseInsulation(insulation))) return 0;
  // NaN or negative clearance is treated as on the roof: the conservative side.
  if (!(clearanceIn >= rule.belowClearanceIn)) return rule.adderC;
  return 0;
}
