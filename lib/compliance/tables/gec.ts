/**
 * Grounding electrode conductor sizes.
 *
 *   AC systems, NEC 2017 / 2020 / 2023 Table 250.66: by the largest ungrounded supply conductor (or equivalent area
 *   of parallel sets), copper or aluminium, from memory; the same sizes in all three editions.
 *     Cu supply ≤ 2 AWG (Al ≤ 1/0)             → 8 Cu / 6 Al
 *     Cu 1 or 1/0 (Al 2/0 or 3/0)               → 6 Cu / 4 Al
 *     Cu 2/0 or 3/0 (Al 4/0 or 250 kcmil)       → 4 Cu / 2 Al
 *     Cu over 3/0 to 350 kcmil (Al over 250–500) → 2 Cu / 1/0 Al
 *     Cu over 350–600 (Al over 500–900)         → 1/0 Cu / 3/0 Al
 *     Cu over 600–1100 (Al over 900–1750)       → 2/0 Cu / 4/0 Al
 *     Cu over 1100 (Al over 1750)               → 3/0 Cu / 250 Al
 *   DC systems, 250.166: not smaller than the largest conductor the DC system supplies, and not smaller than
 *     8 AWG Cu or 6 AWG Al (250.166(B)).
 *   Either system, the portion that is the sole connection to a rod, pipe or plate electrode need not be larger
 *   than 6 AWG Cu / 4 AWG Al (250.66(A), 250.166(C)); to a concrete-encased electrode 4 AWG Cu (250.66(B),
 *   250.166(D)); to a ground ring no larger than the ring conductor, at least 2 AWG Cu (250.66(C), 250.166(E),
 *   250.52(A)(4)). From memory; the same in the three editions.
 */
import type { ConductorSize, GroundingElectrodeKind } from "../../schemas/project-record";
import { circularMils, compareConductorSize } from "./conductor-properties";
import type { Material } from "./units";

interface GecRow {
  /** Largest copper supply conductor, circular mils, "not exceeding". */
  maxCuCmil: number;
  /** Largest aluminium supply conductor, circular mils, "not exceeding". */
  maxAlCmil: number;
  cu: ConductorSize;
  al: ConductorSize;
}

const KCMIL = 1000;

export const GEC_TABLE_250_66: readonly GecRow[] = [
  { maxCuCmil: 66360, maxAlCmil: 105600, cu: "8", al: "6" }, // 2 AWG Cu, 1/0 Al
  { maxCuCmil: 105600, maxAlCmil: 167800, cu: "6", al: "4" }, // 1/0 Cu, 3/0 Al
  { maxCuCmil: 167800, maxAlCmil: 250 * KCMIL, cu: "4", al: "2" }, // 3/0 Cu, 250 Al
  { maxCuCmil: 350 * KCMIL, maxAlCmil: 500 * KCMIL, cu: "2", al: "1/0" },
  { maxCuCmil: 600 * KCMIL, maxAlCmil: 900 * KCMIL, cu: "1/0", al: "3/0" },
  { maxCuCmil: 1100 * KCMIL, maxAlCmil: 1750 * KCMIL, cu: "2/0", al: "4/0" },
  { maxCuCmil: Infinity, maxAlCmil: Infinity, cu: "3/0", al: "250" },
];

/** Table 250.66: the GEC for an AC system whose largest ungrounded conductor (all parallel sets together) has this area. */
export function acGecSize(supplyCmil: number, supplyMaterial: Material, gecMaterial: Material): ConductorSize {
  const row = GEC_TABLE_250_66.find((r) => supplyCmil <= (supplyMaterial === "cu" ? r.maxCuCmil : r.maxAlCmil))!;
  return row[gecMaterial];
}

/** 250.166(B): the largest DC conductor, at least 8 AWG Cu / 6 AWG Al (aluminium GEC one size up from copper, by the same rule). */
export function dcGecSize(largest: ConductorSize, gecMaterial: Material): ConductorSize {
  const floor: ConductorSize = gecMaterial === "cu" ? "8" : "6";
  return compareConductorSize(largest, floor) > 0 ? largest : floor;
}

/** The largest GEC an electrode of this kind ever needs when it is the conductor's only connection; undefined = no cap. */
const CAP_BY_ELECTRODE: Partial<Record<GroundingElectrodeKind, Record<Material, ConductorSize>>> = {
  "ground-rod": { cu: "6", al: "4" },
  plate: { cu: "6", al: "4" },
  "concrete-encased": { cu: "4", al: "4" },
  "ground-ring": { cu: "2", al: "2" },
};

/**
 * The cap that applies when every electrode the GEC reaches is of a capped kind (the largest of their caps);
 * undefined when any electrode (a water pipe, building steel, an existing system) carries no cap.
 */
export function gecCapFor(electrodes: readonly GroundingElectrodeKind[], gecMaterial: Material): ConductorSize | undefined {
  if (electrodes.length === 0) return undefined;
  let cap: ConductorSize | undefined;
  for (const e of electrodes) {
    const c = CAP_BY_ELECTRODE[e]?.[gecMaterial];
    if (c === undefined) return undefined;
    if (cap === undefined || compareConductorSize(c, cap) > 0) cap = c;
  }
  return cap;
}

/** Area of a conductor of several parallel sets, for Table 250.66's "equivalent area". */
export function equivalentCmil(size: ConductorSize, sets: number): number {
  return circularMils(size) * Math.max(1, sets);
}
