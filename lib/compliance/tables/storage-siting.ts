/**
 * Energy storage siting limits for one- and two-family dwellings and
 * townhouses, as data per residential code edition.
 *
 *   IRC 2021 R328 "Energy Storage Systems": R328.3.1 spacing, R328.4
 *     locations, R328.5 energy ratings, R328.7 fire detection, R328.8
 *     protection from impact.
 *   IRC 2024 R330: the same section renumbered; the limits below are the
 *     same as 2021 (from memory: confirm subsection numbers with the AHJ).
 *   NFPA 855 (2020) chapter 15: the source of the IRC text; the same unit,
 *     aggregate, spacing, detection and impact values. Used where the
 *     jurisdiction names no IRC edition with storage limits (IRC 2018 R327
 *     sets no per-location energy limits, from memory).
 *
 * Energy ratings: a unit is at most 20 kWh; aggregate at most 40 kWh in a
 * utility closet, basement, storage or utility space, 80 kWh in an attached or
 * detached garage or detached accessory structure, 80 kWh on an exterior
 * wall, 80 kWh outdoors on the ground. Larger installations fall under the
 * fire code (IFC 1207 / NFPA 855 outside chapter 15), which Sundocket does
 * not check. Never in sleeping rooms, closets or spaces opening into them, or
 * habitable spaces.
 */
import { BATTERY_LOCATIONS } from "../../schemas/project-record";

/** Where a storage unit stands: the record's battery locations. */
export const STORAGE_LOCATION_KINDS = BATTERY_LOCATIONS;
export type StorageLocationKind = (typeof STORAGE_LOCATION_KINDS)[number];

export interface StorageSitingRules {
  code: "IRC-2021" | "IRC-2024" | "NFPA-855";
  section: string;
  /** Largest single unit, kWh. */
  maxUnitKWh: number;
  /** Aggregate kWh per location kind; null = storage not permitted there. */
  aggregateKWhByLocation: Record<string, number | null>;
  /** Clear spacing between units, in, unless large-scale fire testing (UL 9540A) documented to the building official supports less. */
  minSpacingIn: number;
  /**
   * Location kinds where smoke alarms (or a listed heat detector interconnected with them where smoke alarms cannot
   * go) are required: rooms and areas within the dwelling, basements and attached garages (IRC 2021 R328.7, from
   * memory). Outdoors, on an exterior wall and in a detached accessory structure the rule does not reach.
   */
  requiresDetectionIn: string[];
  /** Storage below this aggregate energy is outside the dwelling rules altogether (IRC 2021 R328.1 exception 2: under 1 kWh, from memory). */
  exemptBelowKWh: number;
  /** Location kinds where vehicle impact protection is required. */
  requiresImpactProtectionIn: string[];
  /** Units on an exterior wall or outdoors stand at least this far from doors and windows into the dwelling, in. */
  minFromDoorsAndWindowsIn: number;
  /**
   * An exemption the edition grants that the check cannot verify from the
   * record (a reviewer or the AHJ must confirm it applies), if any.
   */
  exemption?: string;
  /** Subsection per rule, for citations. */
  sections: {
    spacing: string;
    locations: string;
    energyRatings: string;
    detection: string;
    impactProtection: string;
  };
}

const AGGREGATE_KWH: Readonly<Record<StorageLocationKind, number | null>> = {
  "utility-closet": 40,
  basement: 40,
  "storage-room": 40,
  garage: 80,
  "accessory-building": 80,
  "exterior-wall": 80,
  outdoors: 80,
  "habitable-room": null,
};

const SHARED_LIMITS = {
  maxUnitKWh: 20,
  minSpacingIn: 36,
  // A record's "garage" may be attached; the stricter reading keeps detection there.
  requiresDetectionIn: ["utility-closet", "basement", "storage-room", "garage"],
  exemptBelowKWh: 1,
  // Garages are where vehicles travel; a detached garage recorded as an
  // accessory building is not caught here, so the check should attest it.
  requiresImpactProtectionIn: ["garage"],
  minFromDoorsAndWindowsIn: 36,
} as const;

function rules(
  code: StorageSitingRules["code"],
  section: string,
  sections: StorageSitingRules["sections"],
  exemption?: string,
): StorageSitingRules {
  return {
    code,
    section,
    ...(exemption === undefined ? {} : { exemption }),
    ...SHARED_LIMITS,
    aggregateKWhByLocation: { ...AGGREGATE_KWH },
    requiresImpactProtectionIn: [...SHARED_LIMITS.requiresImpactProtectionIn],
    requiresDetectionIn: [...SHARED_LIMITS.requiresDetectionIn],
    sections,
  };
}

export const STORAGE_SITING_RULES: Readonly<Record<StorageSitingRules["code"], StorageSitingRules>> = {
  "IRC-2021": rules("IRC-2021", "IRC 2021 R328", {
    spacing: "IRC 2021 R328.3.1",
    locations: "IRC 2021 R328.4",
    energyRatings: "IRC 2021 R328.5",
    detection: "IRC 2021 R328.7",
    impactProtection: "IRC 2021 R328.8",
  },
  // From memory; the exact scope of the exception is for the AHJ to confirm.
  "IRC 2021 R328.1 exception: storage listed and labelled to UL 9540, marked for use in residential dwelling units and installed per the manufacturer's instructions and NFPA 70"),
  "IRC-2024": rules("IRC-2024", "IRC 2024 R330", {
    spacing: "IRC 2024 R330.3.1",
    locations: "IRC 2024 R330.4",
    energyRatings: "IRC 2024 R330.5",
    detection: "IRC 2024 R330.7",
    impactProtection: "IRC 2024 R330.8",
  }),
  // Subsection numbers within chapter 15 are not cited (from memory only).
  "NFPA-855": rules("NFPA-855", "NFPA 855 chapter 15", {
    spacing: "NFPA 855 chapter 15",
    locations: "NFPA 855 chapter 15",
    energyRatings: "NFPA 855 chapter 15",
    detection: "NFPA 855 chapter 15",
    impactProtection: "NFPA 855 chapter 15",
  }),
};

/**
 * Rules for the record's residential code. IRC 2018 has no storage section
 * and "none" names no code, so both fall back to NFPA 855 chapter 15.
 * Returns a fresh copy: callers may not alter the shared data.
 */
export function storageSitingRules(residentialCode: "IRC-2018" | "IRC-2021" | "IRC-2024" | "none"): StorageSitingRules {
  const base =
    residentialCode === "IRC-2021" || residentialCode === "IRC-2024"
      ? STORAGE_SITING_RULES[residentialCode]
      : STORAGE_SITING_RULES["NFPA-855"];
  return {
    ...base,
    aggregateKWhByLocation: { ...base.aggregateKWhByLocation },
    requiresImpactProtectionIn: [...base.requiresImpactProtectionIn],
    requiresDetectionIn: [...base.requiresDetectionIn],
    sections: { ...base.sections },
  };
}

/** Battery chemistries as the fire codes group them for their threshold quantities. */
export type FireCodeChemistryGroup = "lithium-ion" | "lead-acid" | "nickel" | "other";

export const CHEMISTRY_GROUP: Readonly<Record<"lfp" | "nmc" | "lead-acid-flooded" | "lead-acid-agm" | "nickel-iron" | "other", FireCodeChemistryGroup>> = {
  lfp: "lithium-ion",
  nmc: "lithium-ion",
  "lead-acid-flooded": "lead-acid",
  "lead-acid-agm": "lead-acid",
  // The tables name nickel-cadmium and nickel-metal hydride; nickel-iron is read with them (from memory).
  "nickel-iron": "nickel",
  other: "other",
};

/**
 * Threshold quantities above which the fire code's storage provisions apply to a building that is not a one- or
 * two-family dwelling: NFPA 855 (2020 and 2023) Table 1.3 and IFC 2021 / 2024 Table 1207.1.1 carry the same kWh
 * figures (from memory): lithium-ion 20 kWh, lead-acid 70 kWh, nickel batteries 70 kWh, other battery technologies
 * 10 kWh. Storage of several chemistries is below the threshold when the sum of each chemistry's energy over its
 * threshold is at most 1 (the mixed-quantity rule, from memory). The 2018 IFC (1206.2) set its thresholds by
 * electrolyte volume and battery weight rather than energy, so a 2017 NEC jurisdiction is read against NFPA 855.
 */
export const FIRE_CODE_THRESHOLD_KWH: Readonly<Record<FireCodeChemistryGroup, number>> = {
  "lithium-ion": 20,
  "lead-acid": 70,
  nickel: 70,
  other: 10,
};

/**
 * Where the thresholds stand, per NEC edition and the fire code usually adopted beside it (from memory): NEC 2017
 * with the 2018 IFC (1206), NEC 2020 with the 2021 IFC, NEC 2023 with the 2024 IFC.
 */
export const FIRE_CODE_THRESHOLD_REFS: Readonly<Record<"2017" | "2020" | "2023", readonly string[]>> = {
  "2017": ["NFPA 855 Table 1.3", "IFC 2018 1206"],
  "2020": ["NFPA 855 Table 1.3", "IFC 2021 Table 1207.1.1"],
  "2023": ["NFPA 855 Table 1.3", "IFC 2024 Table 1207.1.1"],
};
