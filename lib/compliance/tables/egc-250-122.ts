/**
 * Minimum size of equipment grounding conductors for grounding raceway and
 * equipment, by the rating or setting of the automatic overcurrent device
 * ahead of the equipment, conduit, etc. ("not exceeding" the rating shown).
 *
 *   NEC 2017 / 2020 / 2023: Table 250.122. Same sizes in all three editions.
 *
 * The aluminium column is "aluminum or copper-clad aluminum". Where a larger
 * circuit conductor is used for voltage drop, 250.122(B) increases the EGC in
 * proportion; that is the check's business, not the table's.
 */
import type { ConductorSize } from "../../schemas/project-record";
import type { Material } from "./units";

export interface EgcRow {
  /** Rating or setting of the OCPD, not exceeding, amperes. */
  maxOcpdA: number;
  cu: ConductorSize;
  al: ConductorSize;
  /** Where the table's size is not a size the record can hold, the size as printed. */
  alAsPrinted?: string;
}

export const EGC_TABLE_250_122: readonly EgcRow[] = [
  { maxOcpdA: 15, cu: "14", al: "12" },
  { maxOcpdA: 20, cu: "12", al: "10" },
  { maxOcpdA: 60, cu: "10", al: "8" },
  { maxOcpdA: 100, cu: "8", al: "6" },
  { maxOcpdA: 200, cu: "6", al: "4" },
  { maxOcpdA: 300, cu: "4", al: "2" },
  { maxOcpdA: 400, cu: "3", al: "1" },
  { maxOcpdA: 500, cu: "2", al: "1/0" },
  { maxOcpdA: 600, cu: "1", al: "2/0" },
  { maxOcpdA: 800, cu: "1/0", al: "3/0" },
  { maxOcpdA: 1000, cu: "2/0", al: "4/0" },
  { maxOcpdA: 1200, cu: "3/0", al: "250" },
  { maxOcpdA: 1600, cu: "4/0", al: "350" },
  { maxOcpdA: 2000, cu: "250", al: "400" },
  { maxOcpdA: 2500, cu: "350", al: "600" },
  { maxOcpdA: 3000, cu: "400", al: "600" },
  { maxOcpdA: 4000, cu: "500", al: "750" },
  // The table reads 1200 kcmil aluminium at 5000 A and 6000 A; 1200 kcmil is
  // not a schedule size the record can hold, so the next larger, 1250 kcmil,
  // is returned: it satisfies "not smaller than" the table.
  { maxOcpdA: 5000, cu: "700", al: "1250", alAsPrinted: "1200 kcmil" },
  { maxOcpdA: 6000, cu: "800", al: "1250", alAsPrinted: "1200 kcmil" },
];

/**
 * Minimum EGC for an overcurrent device of `ocpdA` amperes, or undefined above
 * 6000 A, for zero, negative or NaN ratings.
 */
export function minimumEgcSize(ocpdA: number, material: Material): ConductorSize | undefined {
  if (!(ocpdA > 0)) return undefined;
  const row = EGC_TABLE_250_122.find((r) => ocpdA <= r.maxOcpdA);
  return row ? row[material] : undefined;
}
