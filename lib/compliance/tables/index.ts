/**
 * NEC code tables as data, per edition (2017 / 2020 / 2023), and the
 * residential storage siting limits. Pure data and lookups: no I/O, no clock.
 * Each data file names its table and says where the editions differ.
 */
export type { Material, TempRatingC } from "./units";
export {
  ampacityA,
  AMPACITY_TABLE_310_16,
  AMPACITY_TABLE_BY_EDITION,
  type AmpacityRow,
  type AmpacityTable,
} from "./ampacity-310-16";
export {
  ambientCorrectionFactor,
  AMBIENT_CORRECTION_30C,
  AMBIENT_CORRECTION_BY_EDITION,
  type AmbientCorrectionRow,
} from "./ambient-correction";
export {
  conductorCountAdjustment,
  CONDUCTOR_ADJUSTMENT,
  CONDUCTOR_ADJUSTMENT_BY_EDITION,
  type ConductorAdjustmentRow,
} from "./conductor-adjustment";
export {
  rooftopTemperatureAdderC,
  ROOFTOP_ADDER_BY_EDITION,
  ROOFTOP_ADDER_BANDS_2014,
  ROOFTOP_ADDER_C,
  ROOFTOP_ADDER_CLEARANCE_IN,
  type RooftopAdderRule,
} from "./rooftop-adder";
export {
  crystallineVoltageCorrectionFactor,
  crystallineVoltageCorrectionFactorOrUndefined,
  VOLTAGE_CORRECTION_690_7_A,
  VOLTAGE_CORRECTION_TABLE_MIN_C,
  type VoltageCorrectionRow,
} from "./voltage-correction-690-7";
export {
  STANDARD_OCPD_RATINGS_A,
  nextStandardOcpdRatingA,
  nextStandardOcpdRatingForA,
  standardOcpdRatingsA,
  smallConductorMaxOcpdA,
  SMALL_CONDUCTOR_MAX_OCPD_A,
  type OcpdKind,
} from "./ocpd-ratings";
export {
  CHAPTER_9_TABLE_8,
  CONDUCTOR_SIZES_ASCENDING,
  circularMils,
  compareConductorSize,
  dcResistanceOhmPerKft,
  nextLargerConductorSize,
  type ConductorProperties,
} from "./conductor-properties";
export { EGC_TABLE_250_122, minimumEgcSize, type EgcRow } from "./egc-250-122";
export { GEC_TABLE_250_66, acGecSize, dcGecSize, equivalentCmil, gecCapFor } from "./gec";
export { CODE_REFS, CODE_TOPICS, codeRef, type CodeTopic } from "./code-refs";
export { CITATIONS, isMappedCitation, type CitationEntry } from "./citations";
export {
  CHEMISTRY_GROUP,
  FIRE_CODE_THRESHOLD_KWH,
  FIRE_CODE_THRESHOLD_REFS,
  type FireCodeChemistryGroup,
  storageSitingRules,
  STORAGE_SITING_RULES,
  STORAGE_LOCATION_KINDS,
  type StorageLocationKind,
  type StorageSitingRules,
} from "./storage-siting";
export {
  INSULATION_TYPES,
  RACEWAY_TYPES,
  insulationType,
  racewayType,
  type ConductorClass,
  type InsulationType,
  type RacewayType,
} from "./wiring-types";
