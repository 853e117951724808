/**
 * Conductor properties, NEC Chapter 9 Table 8: area in circular mils and DC
 * resistance at 75 °C (167 °F), ohms per 1000 ft, stranded conductors
 * (class B stranding; 18–10 AWG also come solid, not kept here).
 *
 *   NEC 2017 / 2020 / 2023: Chapter 9, Table 8. No value changes known
 *   between these editions, so the values are not kept per edition.
 *
 * Copper is uncoated copper; aluminium covers aluminium conductors (Table 8
 * has one aluminium column). Coated (tinned) copper is slightly higher and
 * is not kept.
 */
import { CONDUCTOR_SIZES, type ConductorSize } from "../../schemas/project-record";
import type { Material } from "./units";

export interface ConductorProperties {
  areaCmil: number;
  /** Stranded uncoated copper, Ω/kft at 75 °C. */
  cuOhmPerKft: number;
  /** Stranded aluminium, Ω/kft at 75 °C. */
  alOhmPerKft: number;
}

export const CHAPTER_9_TABLE_8: Readonly<Record<ConductorSize, ConductorProperties>> = {
  "18": { areaCmil: 1620, cuOhmPerKft: 7.95, alOhmPerKft: 13.1 },
  "16": { areaCmil: 2580, cuOhmPerKft: 4.99, alOhmPerKft: 8.21 },
  "14": { areaCmil: 4110, cuOhmPerKft: 3.14, alOhmPerKft: 5.17 },
  "12": { areaCmil: 6530, cuOhmPerKft: 1.98, alOhmPerKft: 3.25 },
  "10": { areaCmil: 10380, cuOhmPerKft: 1.24, alOhmPerKft: 2.04 },
  "8": { areaCmil: 16510, cuOhmPerKft: 0.778, alOhmPerKft: 1.28 },
  "6": { areaCmil: 26240, cuOhmPerKft: 0.491, alOhmPerKft: 0.808 },
  "4": { areaCmil: 41740, cuOhmPerKft: 0.308, alOhmPerKft: 0.508 },
  "3": { areaCmil: 52620, cuOhmPerKft: 0.245, alOhmPerKft: 0.403 },
  "2": { areaCmil: 66360, cuOhmPerKft: 0.194, alOhmPerKft: 0.319 },
  "1": { areaCmil: 83690, cuOhmPerKft: 0.154, alOhmPerKft: 0.253 },
  "1/0": { areaCmil: 105600, cuOhmPerKft: 0.122, alOhmPerKft: 0.201 },
  "2/0": { areaCmil: 133100, cuOhmPerKft: 0.0967, alOhmPerKft: 0.159 },
  "3/0": { areaCmil: 167800, cuOhmPerKft: 0.0766, alOhmPerKft: 0.126 },
  "4/0": { areaCmil: 211600, cuOhmPerKft: 0.0608, alOhmPerKft: 0.1 },
  "250": { areaCmil: 250000, cuOhmPerKft: 0.0515, alOhmPerKft: 0.0847 },
  "300": { areaCmil: 300000, cuOhmPerKft: 0.0429, alOhmPerKft: 0.0707 },
  "350": { areaCmil: 350000, cuOhmPerKft: 0.0367, alOhmPerKft: 0.0605 },
  "400": { areaCmil: 400000, cuOhmPerKft: 0.0321, alOhmPerKft: 0.0529 },
  "500": { areaCmil: 500000, cuOhmPerKft: 0.0258, alOhmPerKft: 0.0424 },
  "600": { areaCmil: 600000, cuOhmPerKft: 0.0214, alOhmPerKft: 0.0353 },
  "700": { areaCmil: 700000, cuOhmPerKft: 0.0184, alOhmPerKft: 0.0303 },
  "750": { areaCmil: 750000, cuOhmPerKft: 0.0171, alOhmPerKft: 0.0282 },
  "800": { areaCmil: 800000, cuOhmPerKft: 0.0161, alOhmPerKft: 0.0265 },
  "900": { areaCmil: 900000, cuOhmPerKft: 0.0143, alOhmPerKft: 0.0235 },
  "1000": { areaCmil: 1000000, cuOhmPerKft: 0.0129, alOhmPerKft: 0.0212 },
  "1250": { areaCmil: 1250000, cuOhmPerKft: 0.0103, alOhmPerKft: 0.0169 },
  "1500": { areaCmil: 1500000, cuOhmPerKft: 0.00858, alOhmPerKft: 0.0141 },
  "1750": { areaCmil: 1750000, cuOhmPerKft: 0.00735, alOhmPerKft: 0.0121 },
  "2000": { areaCmil: 2000000, cuOhmPerKft: 0.00643, alOhmPerKft: 0.0106 },
};

/** DC resistance at 75 °C, Ω per 1000 ft, stranded; undefined only for a size outside Table 8. */
export function dcResistanceOhmPerKft(material: Material, size: ConductorSize): number | undefined {
  const row = CHAPTER_9_TABLE_8[size];
  if (!row) return undefined;
  return material === "cu" ? row.cuOhmPerKft : row.alOhmPerKft;
}

/** Conductor area in circular mils (Chapter 9 Table 8). */
export function circularMils(size: ConductorSize): number {
  return CHAPTER_9_TABLE_8[size].areaCmil;
}

/** Negative when `a` is the smaller conductor, 0 when equal, positive when larger (by area). */
export function compareConductorSize(a: ConductorSize, b: ConductorSize): number {
  return CHAPTER_9_TABLE_8[a].areaCmil - CHAPTER_9_TABLE_8[b].areaCmil;
}

/** Sizes smallest first, as the record's schedule lists them. */
export const CONDUCTOR_SIZES_ASCENDING: readonly ConductorSize[] = [...CONDUCTOR_SIZES].sort(compareConductorSize);

/** The next larger standard size, or undefined for 2000 kcmil. */
export function nextLargerConductorSize(size: ConductorSize): ConductorSize | undefined {
  const i = CONDUCTOR_SIZES_ASCENDING.indexOf(size);
  return i < 0 ? undefined : CONDUCTOR_SIZES_ASCENDING[i + 1];
}
