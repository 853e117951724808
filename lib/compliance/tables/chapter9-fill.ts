/**
 * Raceway fill, NEC Chapter 9:
 *   Table 1: the percentage of a raceway's cross-section conductors may fill
 *            (1 conductor 53 %, 2 conductors 31 %, over 2 conductors 40 %);
 *            Note 3 counts equipment grounding conductors.
 *   Table 4: the internal area of each raceway type and trade size, in² (the "total area 100 %" column).
 *   Table 5: the approximate area of insulated conductors, in², by type and size.
 * The same values in the 2017, 2020 and 2023 editions (no changes known), so they
 * are not kept per edition. Values from memory of the tables; they agree with
 * Annex C Table C.1 (e.g. 1/2 in EMT holds 9 #12 THHN, 3/4 in EMT 10 #10 THHN).
 * PV wire and USE-2 are not in Table 5: their area comes from the cable's datasheet.
 */
import type { ConductorSize } from "../../schemas/project-record";

/** Chapter 9 Table 1, percent of the raceway area, by number of conductors. */
export function fillLimitPct(conductors: number): 53 | 31 | 40 {
  if (conductors <= 1) return 53;
  if (conductors === 2) return 31;
  return 40;
}

export const TRADE_SIZES = ["3/8", "1/2", "3/4", "1", "1-1/4", "1-1/2", "2", "2-1/2", "3", "3-1/2", "4"] as const;
export type TradeSize = (typeof TRADE_SIZES)[number];

type AreaBySize = Partial<Record<TradeSize, number>>;

/** Chapter 9 Table 4, internal area in² (100 %), keyed by the raceway codes of wiring-types.ts. */
export const CHAPTER_9_TABLE_4: Readonly<Record<string, { article: string; areas: AreaBySize }>> = {
  EMT: {
    article: "358",
    areas: { "1/2": 0.304, "3/4": 0.533, "1": 0.864, "1-1/4": 1.496, "1-1/2": 2.036, "2": 3.356, "2-1/2": 5.858, "3": 8.846, "3-1/2": 11.545, "4": 14.753 },
  },
  RMC: {
    article: "344",
    areas: { "1/2": 0.314, "3/4": 0.549, "1": 0.887, "1-1/4": 1.526, "1-1/2": 2.071, "2": 3.408, "2-1/2": 4.866, "3": 7.499, "3-1/2": 10.01, "4": 12.882 },
  },
  IMC: {
    article: "342",
    areas: { "1/2": 0.342, "3/4": 0.586, "1": 0.959, "1-1/4": 1.647, "1-1/2": 2.225, "2": 3.63, "2-1/2": 5.135, "3": 7.922, "3-1/2": 10.584, "4": 13.631 },
  },
  FMC: {
    article: "348",
    areas: { "3/8": 0.116, "1/2": 0.317, "3/4": 0.533, "1": 0.817, "1-1/4": 1.277, "1-1/2": 1.858, "2": 3.269 },
  },
  LFMC: {
    article: "350",
    areas: { "1/2": 0.314, "3/4": 0.541, "1": 0.873, "1-1/4": 1.528, "1-1/2": 1.981, "2": 3.246 },
  },
  "PVC-80": {
    article: "352",
    areas: { "1/2": 0.217, "3/4": 0.409, "1": 0.688, "1-1/4": 1.237, "1-1/2": 1.711, "2": 2.874, "2-1/2": 4.119, "3": 6.442, "3-1/2": 8.688, "4": 11.258 },
  },
  "PVC-40": {
    article: "352",
    areas: { "1/2": 0.285, "3/4": 0.508, "1": 0.832, "1-1/4": 1.453, "1-1/2": 1.986, "2": 3.291, "2-1/2": 4.695, "3": 7.268, "3-1/2": 9.737, "4": 12.554 },
  },
  // Table 4 gives HDPE conduit the same areas as PVC Schedule 40.
  HDPE: {
    article: "353",
    areas: { "1/2": 0.285, "3/4": 0.508, "1": 0.832, "1-1/4": 1.453, "1-1/2": 1.986, "2": 3.291, "2-1/2": 4.695, "3": 7.268, "3-1/2": 9.737, "4": 12.554 },
  },
};

type AreaByConductor = Partial<Record<ConductorSize, number>>;

const THHN: AreaByConductor = {
  "14": 0.0097, "12": 0.0133, "10": 0.0211, "8": 0.0366, "6": 0.0507, "4": 0.0824, "3": 0.0973, "2": 0.1158, "1": 0.1562,
  "1/0": 0.1855, "2/0": 0.2223, "3/0": 0.2679, "4/0": 0.3237, "250": 0.397, "300": 0.4608, "350": 0.5242, "400": 0.5863, "500": 0.7073,
};
const XHHW: AreaByConductor = {
  "14": 0.0139, "12": 0.0181, "10": 0.0243, "8": 0.0437, "6": 0.059, "4": 0.0814, "3": 0.0962, "2": 0.1146, "1": 0.1534,
  "1/0": 0.1825, "2/0": 0.219, "3/0": 0.2642, "4/0": 0.3197, "250": 0.3904, "300": 0.4536, "350": 0.5166, "400": 0.5782, "500": 0.6984,
};
const THW: AreaByConductor = {
  "14": 0.0139, "12": 0.0181, "10": 0.0243, "8": 0.0437, "6": 0.0726, "4": 0.0973, "3": 0.1134, "2": 0.1333, "1": 0.1901,
  "1/0": 0.2223, "2/0": 0.2624, "3/0": 0.3117, "4/0": 0.3718,
};

/** Chapter 9 Table 5, approximate area in², keyed by the insulation codes of wiring-types.ts. */
export const CHAPTER_9_TABLE_5: Readonly<Record<string, AreaByConductor>> = {
  THHN,
  "THWN-2": THHN,
  THWN: THHN,
  XHHW,
  "XHHW-2": XHHW,
  THW,
  "THW-2": THW,
  THHW: THW,
  TW: THW,
};

/** "3/4", "3/4 in", "1 1/4", "1-1/4\"" → a Table 4 trade size. */
export function tradeSize(text: string): TradeSize | undefined {
  const key = text.trim().replace(/\s*(in|inch|inches|")\s*$/i, "").trim().replace(/\s+/g, "-");
  return (TRADE_SIZES as readonly string[]).includes(key) ? (key as TradeSize) : undefined;
}
