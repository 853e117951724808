/**
 * Allowable ampacities of insulated conductors rated up to and including 2000 V,
 * 60 °C through 90 °C, not more than three current-carrying conductors in a
 * raceway, cable or earth (directly buried), based on an ambient of 30 °C.
 *
 *   NEC 2017: Table 310.15(B)(16)
 *   NEC 2020: Table 310.16 (renumbered when medium-voltage moved to Article 311)
 *   NEC 2023: Table 310.16
 *
 * The ampacity values are the same in all three editions, so the editions share
 * one table. Aluminium (and copper-clad aluminium) starts at 12 AWG.
 * 18 and 16 AWG copper carry a 90 °C value only (14 A, 18 A); their use is
 * limited by 240.4(D) and the articles that permit them.
 * Values are the table's as printed; footnotes (240.4(D) small-conductor
 * limits, 110.14(C) terminal temperatures) are applied by the checks.
 */
import type { ConductorSize, NecEdition } from "../../schemas/project-record";
import type { Material, TempRatingC } from "./units";

/** [60 °C, 75 °C, 90 °C]; null where the table has no entry. */
export type AmpacityRow = readonly [number | null, number | null, number];
export type AmpacityTable = Readonly<Record<Material, Partial<Record<ConductorSize, AmpacityRow>>>>;

export const AMPACITY_TABLE_310_16: AmpacityTable = {
  cu: {
    "18": [null, null, 14],
    "16": [null, null, 18],
    "14": [15, 20, 25],
    "12": [20, 25, 30],
    "10": [30, 35, 40],
    "8": [40, 50, 55],
    "6": [55, 65, 75],
    "4": [70, 85, 95],
    "3": [85, 100, 115],
    "2": [95, 115, 130],
    "1": [110, 130, 145],
    "1/0": [125, 150, 170],
    "2/0": [145, 175, 195],
    "3/0": [165, 200, 225],
    "4/0": [195, 230, 260],
    "250": [215, 255, 290],
    "300": [240, 285, 320],
    "350": [260, 310, 350],
    "400": [280, 335, 380],
    "500": [320, 380, 430],
    "600": [350, 420, 475],
    "700": [385, 460, 520],
    "750": [400, 475, 535],
    "800": [410, 490, 555],
    "900": [435, 520, 585],
    "1000": [455, 545, 615],
    "1250": [495, 590, 665],
    "1500": [525, 625, 705],
    "1750": [545, 650, 735],
    "2000": [555, 665, 750],
  },
  al: {
    "12": [15, 20, 25],
    "10": [25, 30, 35],
    "8": [35, 40, 45],
    "6": [40, 50, 55],
    "4": [55, 65, 75],
    "3": [65, 75, 85],
    "2": [75, 90, 100],
    "1": [85, 100, 115],
    "1/0": [100, 120, 135],
    "2/0": [115, 135, 150],
    "3/0": [130, 155, 175],
    "4/0": [150, 180, 205],
    "250": [170, 205, 230],
    "300": [195, 230, 260],
    "350": [210, 250, 280],
    "400": [225, 270, 305],
    "500": [260, 310, 350],
    "600": [285, 340, 385],
    "700": [315, 375, 425],
    "750": [320, 385, 435],
    "800": [330, 395, 445],
    "900": [355, 425, 480],
    "1000": [375, 445, 500],
    "1250": [405, 485, 545],
    "1500": [435, 520, 585],
    "1750": [455, 545, 615],
    "2000": [470, 560, 630],
  },
};

/** One object shared by the editions: no value changed between 2017 and 2023. */
export const AMPACITY_TABLE_BY_EDITION: Readonly<Record<NecEdition, AmpacityTable>> = {
  "2017": AMPACITY_TABLE_310_16,
  "2020": AMPACITY_TABLE_310_16,
  "2023": AMPACITY_TABLE_310_16,
};

const RATING_INDEX: Record<TempRatingC, 0 | 1 | 2> = { 60: 0, 75: 1, 90: 2 };

/** Table ampacity in amperes, or undefined where the table has no entry (e.g. Al 14 AWG, Cu 18 AWG at 75 °C). */
export function ampacityA(
  edition: NecEdition,
  material: Material,
  size: ConductorSize,
  ratingC: TempRatingC,
): number | undefined {
  const row = AMPACITY_TABLE_BY_EDITION[edition][material][size];
  if (!row) return undefined;
  return row[RATING_INDEX[ratingC]] ?? undefined;
}
