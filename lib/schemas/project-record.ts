import { z } from "zod";
import { integerIn, numberIn, requiredText, tagSchema, text } from "./fields";
import { insulationCodeSchema, racewayCodeSchema } from "./wiring-codes";

/**
 * Sundocket's project file: the whole design record the check engine reads.
 * The same schema validates forms, route handlers, the command line and
 * imported files. Units are in the field names. Ratings are optional so a
 * record can be saved half-entered; a check that needs a missing rating
 * reports "needs input" naming the field.
 */

export const NEC_EDITIONS = ["2017", "2020", "2023"] as const;
export const necEditionSchema = z.enum(NEC_EDITIONS, { error: "must be one of 2017, 2020, 2023" });
export type NecEdition = z.infer<typeof necEditionSchema>;

export const SYSTEM_KINDS = ["stand-alone", "stand-alone-generator", "hybrid"] as const;
export const systemKindSchema = z.enum(SYSTEM_KINDS, {
  error: "must be one of stand-alone, stand-alone-generator, hybrid",
});

/** Phases of an AC supply or circuit: 1 for single or split phase (120, 240, 120/240), 3 for three phase. */
/** 1 single phase, 2 split phase (120/240 V, two lines and a neutral), 3 three phase. */
export const phaseCountSchema = z.union([z.literal(1), z.literal(2), z.literal(3)], { error: "must be 1 (single phase), 2 (split phase, 120/240 V) or 3 (three phase)" });

export const OCCUPANCIES = ["one-two-family-dwelling", "other-building"] as const;
export const MOUNTINGS = ["ground", "roof"] as const;

/** Where the batteries stand; drives the storage siting limits (IRC R328/R330, NFPA 855 ch. 15). */
export const BATTERY_LOCATIONS = [
  "utility-closet",
  "basement",
  "storage-room",
  "garage",
  "accessory-building",
  "exterior-wall",
  "outdoors",
  "habitable-room",
] as const;

export const RAPID_SHUTDOWN_INSIDE_BOUNDARY = ["listed-hazard-control", "80v-in-30s", "no-exposed-wiring", "none"] as const;

/** The PV system grounding configurations of 690.41(A)(1)–(6), in that order. */
export const PV_GROUNDING_CONFIGURATIONS = [
  "two-wire-functional-ground",
  "bipolar-functional-ground",
  "not-isolated",
  "ungrounded",
  "solidly-grounded",
  "other-listed",
] as const;
export type PvGroundingConfiguration = (typeof PV_GROUNDING_CONFIGURATIONS)[number];

export const RESIDENTIAL_CODES = ["IRC-2018", "IRC-2021", "IRC-2024", "none"] as const;

export const siteSchema = z.object({
  address: text(300).default(""),
  occupancy: z.enum(OCCUPANCIES, { error: "must be one-two-family-dwelling or other-building" }),
  mounting: z.enum(MOUNTINGS, { error: "must be ground or roof" }),
  /** Racking or mounting system, make and model, as the structural block of the packet prints it. */
  rackingProduct: text(200).default(""),
  /** The racking's listing (UL 2703 for mounting and bonding, by common practice). */
  rackingListing: text(120).default(""),
  /** Height of PV raceways above the roof, for the rooftop temperature adder. */
  roofClearanceIn: numberIn(0, 120, "in").optional(),
  designLowTempC: numberIn(-60, 70, "°C").optional(),
  designLowTempSource: text(300).default(""),
  designHighTempC: numberIn(-60, 70, "°C").optional(),
  designHighTempSource: text(300).default(""),
  /**
   * Module temperature above ambient at the design high temperature, for the MPPT window.
   * About 30 °C for rack and roof mounts by common practice; used when this is left empty.
   */
  moduleTempRiseC: numberIn(0, 50, "°C").optional(),
  /** Peak sun hours per day for the stand-alone energy balance (worst month by common practice). */
  sunHoursPerDay: numberIn(0.5, 12, "h").optional(),
  batteryLocation: z.enum(BATTERY_LOCATIONS).optional(),
  batteryLocationNote: text(300).default(""),
  /** Clear spacing between storage units, for the 3 ft rule unless fire testing supports less. */
  batterySpacingIn: numberIn(0, 600, "in").optional(),
  hasSmokeOrHeatDetection: z.boolean().optional(),
  hasVehicleImpactProtection: z.boolean().optional(),
  /**
   * The building the PV circuits enter houses PV equipment only (the 690.12 exception for ground-mounted
   * arrays). A fact the designer states; never assumed.
   */
  pvOnlyBuilding: z.boolean().optional(),
});
export type Site = z.infer<typeof siteSchema>;

export const jurisdictionRulesSchema = z.object({
  name: requiredText(200),
  necEdition: necEditionSchema,
  residentialCode: z.enum(RESIDENTIAL_CODES).default("none"),
  /** Stricter local voltage-drop limit; the engine defaults to 3 % (common practice). */
  voltageDropLimitPct: numberIn(0.5, 10, "%").optional(),
  /** Local cap on total stored energy per location, overriding the code table. */
  storageAggregateLimitKWh: numberIn(0, 10000, "kWh").optional(),
  requiredDocuments: z
    .array(z.enum(["equipment-datasheets", "storage-listing", "site-plan", "structural-letter"]))
    .default(["equipment-datasheets", "storage-listing", "site-plan"]),
});
export type JurisdictionRules = z.infer<typeof jurisdictionRulesSchema>;

const equipmentBase = {
  tag: tagSchema,
  manufacturer: text(120).default(""),
  model: text(120).default(""),
  quantity: integerIn(1, 500).default(1),
  /** The organisation library item this instance was taken from, if any. */
  libraryItemId: z.string().max(64).optional(),
  /** Listing standard(s) the item carries, e.g. "UL 1741", "UL 9540". */
  listing: text(200).default(""),
};

export const pvModuleSchema = z.object({
  ...equipmentBase,
  kind: z.literal("pv-module"),
  pmaxW: numberIn(1, 1000, "W").optional(),
  vocV: numberIn(0.5, 150, "V").optional(),
  iscA: numberIn(0.1, 30, "A").optional(),
  vmpV: numberIn(0.5, 150, "V").optional(),
  impA: numberIn(0.1, 30, "A").optional(),
  tempCoeffVocPctPerC: numberIn(-1, 0, "%/°C").optional(),
  tempCoeffVmpPctPerC: numberIn(-1, 0, "%/°C").optional(),
  maxSeriesFuseA: numberIn(1, 60, "A").optional(),
  maxSystemVoltageV: numberIn(12, 1500, "V").optional(),
});

export const chargeControllerSchema = z.object({
  ...equipmentBase,
  kind: z.literal("charge-controller"),
  controllerType: z.enum(["pwm", "mppt"]).optional(),
  maxPvInputVoltageV: numberIn(10, 1500, "V").optional(),
  maxPvInputCurrentA: numberIn(1, 500, "A").optional(),
  /** Lowest PV voltage at which the controller still tracks. */
  mpptMinVoltageV: numberIn(0, 1500, "V").optional(),
  ratedOutputCurrentA: numberIn(1, 500, "A").optional(),
  batteryVoltagesV: z.array(numberIn(6, 1000, "V")).default([]),
  hasPvDisconnect: z.boolean().default(false),
  hasOvercurrentProtection: z.boolean().default(false),
  /** Listed to detect and interrupt DC arc faults on the PV input (UL 1699B), so it meets 690.11; unset when not known. */
  providesPvArcFaultProtection: z.boolean().optional(),
  /** Listed to detect PV array ground faults and isolate the faulted circuits (690.41(B)); unset when not known. */
  providesPvGroundFaultProtection: z.boolean().optional(),
});

export const mpptInputSchema = z.object({
  id: requiredText(8),
  maxVoltageV: numberIn(10, 1500, "V").optional(),
  maxCurrentA: numberIn(1, 200, "A").optional(),
  minOperatingVoltageV: numberIn(0, 1500, "V").optional(),
  maxOperatingVoltageV: numberIn(0, 1500, "V").optional(),
});

export const INVERTER_KINDS = ["inverter", "inverter-charger", "hybrid-inverter"] as const;

export const inverterSchema = z.object({
  ...equipmentBase,
  kind: z.enum(INVERTER_KINDS),
  continuousW: numberIn(50, 100000, "W").optional(),
  surgeW: numberIn(50, 300000, "W").optional(),
  nominalBatteryVoltageV: numberIn(6, 1000, "V").optional(),
  /** Lowest battery voltage the inverter runs at (its low-voltage cut-out); sets DC input current. */
  minBatteryVoltageV: numberIn(5, 1000, "V").optional(),
  maxDcInputCurrentA: numberIn(1, 2000, "A").optional(),
  acOutputVoltageV: numberIn(100, 480, "V").optional(),
  acOutput: z.enum(["120", "240", "120/240", "208", "277/480"]).optional(),
  acOutputPhases: phaseCountSchema.default(1),
  maxAcOutputCurrentA: numberIn(0.1, 1000, "A").optional(),
  acInputCurrentLimitA: numberIn(1, 400, "A").optional(),
  idleW: numberIn(0, 500, "W").optional(),
  efficiencyPct: numberIn(50, 100, "%").optional(),
  mpptInputs: z.array(mpptInputSchema).default([]),
  hasPvDisconnect: z.boolean().default(false),
  hasOvercurrentProtection: z.boolean().default(false),
  /** Listed to detect and interrupt DC arc faults on the PV input (UL 1699B), so it meets 690.11; unset when not known. */
  providesPvArcFaultProtection: z.boolean().optional(),
  /** Listed to detect PV array ground faults and isolate the faulted circuits (690.41(B)); unset when not known. */
  providesPvGroundFaultProtection: z.boolean().optional(),
  listedMode: z.enum(["stand-alone", "multimode", "interactive"]).optional(),
  /**
   * The unit bonds its AC neutral to its equipment ground (a bonding jumper, or a bonding relay, in place). The
   * system has exactly one such bond (250.30, 250.6); unset when not known.
   */
  neutralBonded: z.boolean().optional(),
});

export const batterySchema = z.object({
  ...equipmentBase,
  kind: z.literal("battery"),
  chemistry: z.enum(["lfp", "nmc", "lead-acid-flooded", "lead-acid-agm", "nickel-iron", "other"]).optional(),
  nominalVoltageV: numberIn(2, 1000, "V").optional(),
  capacityAh: numberIn(1, 10000, "Ah").optional(),
  capacityKWh: numberIn(0.01, 1000, "kWh").optional(),
  maxContinuousDischargeA: numberIn(1, 5000, "A").optional(),
  shortCircuitCurrentA: numberIn(1, 200000, "A").optional(),
  usableDodPct: numberIn(10, 100, "%").optional(),
  maxConnectionsPerTerminal: integerIn(1, 12).optional(),
  /** Highest charge (absorption) voltage; the battery circuits' maximum voltage and the MPPT headroom. */
  maxChargeVoltageV: numberIn(2, 1200, "V").optional(),
  /** Large-scale fire testing (UL 9540A) supports spacing closer than 3 ft. */
  largeScaleFireTested: z.boolean().default(false),
});

export const GENERATOR_INSTALLATIONS = ["portable", "stationary"] as const;

export const generatorSchema = z.object({
  ...equipmentBase,
  kind: z.literal("generator"),
  ratedKW: numberIn(0.1, 2000, "kW").optional(),
  voltageV: numberIn(100, 480, "V").optional(),
  output: z.enum(["120", "240", "120/240", "208", "277/480"]).optional(),
  /** 2 for a split-phase (120/240 V) set, 3 for a three-phase set; its voltageV is then line to line. */
  phases: phaseCountSchema.default(1),
  fuel: z.enum(["gasoline", "diesel", "propane", "natural-gas", "other"]).optional(),
  hasOutputDisconnect: z.boolean().default(false),
  outputBreakerA: numberIn(1, 2000, "A").optional(),
  /**
   * Portable (cord-and-plug connected, listed to UL 2201) or stationary (permanently installed, UL 2200). Empty takes
   * it from the listing.
   */
  installation: z.enum(GENERATOR_INSTALLATIONS).optional(),
  /** A portable generator connects through a power inlet by cord and plug (the plug then disconnects it, 445.18(A)). */
  connectedByInlet: z.boolean().optional(),
  /**
   * The unit bonds its AC neutral to its equipment ground (a bonding jumper, or a bonding relay, in place). The
   * system has exactly one such bond (250.30, 250.6); unset when not known.
   */
  neutralBonded: z.boolean().optional(),
});

export const protectiveDeviceSchema = z.object({
  ...equipmentBase,
  kind: z.enum(["disconnect", "fuse", "breaker"]),
  ratingA: numberIn(0.5, 4000, "A").optional(),
  voltageRatingV: numberIn(12, 1500, "V").optional(),
  currentType: z.enum(["ac", "dc", "ac-dc"]).optional(),
  interruptingRatingA: numberIn(100, 300000, "A").optional(),
  /** Distance from the battery terminals, for devices protecting a battery circuit. */
  distanceFromBatteryFt: numberIn(0, 1000, "ft").optional(),
  /**
   * For a fuse or breaker protecting a battery circuit: its clearing time at the battery's available
   * short-circuit current, read from the device's time-current curve; the storage disconnect label carries it.
   */
  clearingTimeMs: numberIn(0.1, 100000, "ms").optional(),
  /** How a breaker mounts in its panel: plug-in breakers that are back-fed need a hold-down fastener (408.36(D)). */
  breakerMounting: z.enum(["plug-in", "bolt-on"]).optional(),
  /** Secured by an additional fastener that takes more than a pull to release (a listed hold-down kit). */
  hasHoldDown: z.boolean().optional(),
  /** The equipment the device stands at, within sight of it (a generator's own disconnect, 445.18). */
  locatedAtTag: tagSchema.optional(),
  /** A device listed for PV ground-fault protection (690.41(B)), e.g. a ground-fault breaker on the PV circuits. */
  providesPvGroundFaultProtection: z.boolean().optional(),
});

export const rapidShutdownSchema = z.object({
  ...equipmentBase,
  kind: z.literal("rapid-shutdown"),
  method: z.enum(["module-level", "array-boundary", "listed-pv-hazard-control", "other"]).optional(),
  controls: text(300).default(""),
});

export const panelSchema = z.object({
  ...equipmentBase,
  kind: z.enum(["ac-panel", "busbar"]),
  busRatingA: numberIn(1, 5000, "A").optional(),
  mainBreakerA: numberIn(1, 5000, "A").optional(),
  voltage: z.enum(["12", "24", "48", "120", "240", "120/240", "208", "277/480", "other"]).optional(),
  hasMultiwireBranchCircuits: z.boolean().optional(),
  /** Rating of the neutral bus; a single 120 V supply's sources must stay below it (710.15(C)). */
  neutralBusRatingA: numberIn(1, 5000, "A").optional(),
  /** Sum of the ratings of all breakers on the bus, for the sum-of-breakers rule. */
  sumOfBreakersA: numberIn(0, 20000, "A").optional(),
  /** The main bonding jumper joins neutral and ground in this panel. */
  neutralBonded: z.boolean().optional(),
});

export const equipmentSchema = z.discriminatedUnion("kind", [
  pvModuleSchema,
  chargeControllerSchema,
  inverterSchema,
  batterySchema,
  generatorSchema,
  protectiveDeviceSchema,
  rapidShutdownSchema,
  panelSchema,
]);
export type Equipment = z.infer<typeof equipmentSchema>;
export type EquipmentKind = Equipment["kind"];
export const EQUIPMENT_KINDS = [
  "pv-module",
  "charge-controller",
  "inverter",
  "inverter-charger",
  "hybrid-inverter",
  "battery",
  "generator",
  "disconnect",
  "fuse",
  "breaker",
  "rapid-shutdown",
  "ac-panel",
  "busbar",
] as const satisfies readonly EquipmentKind[];

/** Names of the kinds, for headings, pickers and tables. */
export const EQUIPMENT_KIND_LABELS: Record<EquipmentKind, string> = {
  "pv-module": "PV module",
  "charge-controller": "Charge controller",
  inverter: "Inverter",
  "inverter-charger": "Inverter-charger",
  "hybrid-inverter": "Hybrid inverter",
  battery: "Battery",
  generator: "Generator",
  disconnect: "Disconnect",
  fuse: "Fuse",
  breaker: "Breaker",
  "rapid-shutdown": "Rapid-shutdown device",
  "ac-panel": "AC panel",
  busbar: "Bus bar",
};

export const SYSTEM_KIND_LABELS: Record<(typeof SYSTEM_KINDS)[number], string> = {
  "stand-alone": "Stand-alone",
  "stand-alone-generator": "Stand-alone with generator",
  hybrid: "Hybrid / grid-interactive",
};

export const arraySchema = z.object({
  tag: tagSchema,
  moduleTag: tagSchema,
  modulesInSeries: integerIn(1, 100),
  stringsInParallel: integerIn(1, 200),
  /** Controller or inverter it feeds; for an inverter, the MPPT input id. */
  feedsTag: tagSchema,
  mpptInputId: z.string().max(8).optional(),
});
export type PvArray = z.infer<typeof arraySchema>;

export const CIRCUIT_KINDS = [
  "pv-source",
  "pv-output",
  "battery",
  "inverter-dc-input",
  "inverter-ac-output",
  "generator-output",
  "ac-branch",
] as const;

/** AWG 18…4/0 and kcmil 250…2000, as written on a schedule. */
export const CONDUCTOR_SIZES = [
  "18", "16", "14", "12", "10", "8", "6", "4", "3", "2", "1",
  "1/0", "2/0", "3/0", "4/0",
  "250", "300", "350", "400", "500", "600", "700", "750", "800", "900", "1000", "1250", "1500", "1750", "2000",
] as const;
export const conductorSizeSchema = z.enum(CONDUCTOR_SIZES, {
  error: "must be an AWG size (18 … 4/0) or kcmil size (250 … 2000)",
});
export type ConductorSize = z.infer<typeof conductorSizeSchema>;

export const TEMP_RATINGS_C = [60, 75, 90] as const;
const tempRatingSchema = z.union([z.literal(60), z.literal(75), z.literal(90)], {
  error: "must be 60, 75 or 90 °C",
});

export const circuitSchema = z
  .object({
    tag: tagSchema,
    fromTag: tagSchema,
    toTag: tagSchema,
    kind: z.enum(CIRCUIT_KINDS, { error: `must be one of ${CIRCUIT_KINDS.join(", ")}` }),
    /** For PV circuits: the array whose current and voltage the circuit carries. */
    arrayTag: tagSchema.optional(),
    /** For a PV source circuit: how many strings it carries (1 unless strings are paralleled in the array). */
    stringsCarried: integerIn(1, 200).optional(),
    /** For an AC branch circuit: the load current it serves. */
    loadCurrentA: numberIn(0, 2000, "A").optional(),
    /**
     * Continuous current where the engine cannot derive it from the equipment
     * (e.g. a battery circuit to a bus bar serving several devices). Taken as
     * the circuit's current when given.
     */
    designCurrentA: numberIn(0, 5000, "A").optional(),
    /** Nominal voltage of the circuit where no equipment at its ends sets it (e.g. an AC branch circuit), for voltage drop and device ratings. */
    nominalVoltageV: numberIn(12, 600, "V").optional(),
    /**
     * For an AC circuit: 1 (single phase), 2 (split phase, 120/240 V) or 3. Empty takes the phases of the inverter or
     * generator at its ends, else single phase (the larger current and drop for the same power).
     */
    phases: phaseCountSchema.optional(),
    material: z.enum(["cu", "al"], { error: "must be cu or al" }).default("cu"),
    size: conductorSizeSchema.optional(),
    parallelSets: integerIn(1, 8).default(1),
    /** One of the insulation codes (lib/schemas/wiring-codes.ts); common spellings are read as the code. */
    insulation: insulationCodeSchema.default(""),
    insulationTempRatingC: tempRatingSchema.optional(),
    currentCarryingConductors: integerIn(1, 60).optional(),
    /** One of the wiring-method codes (raceway, cable, cable tray, free air, direct burial). */
    racewayType: racewayCodeSchema.default(""),
    racewaySize: text(20).default(""),
    lengthFt: numberIn(0, 5000, "ft").optional(),
    /** Ambient where the conductor runs; defaults to the site's design high temperature. */
    ambientTempC: numberIn(-60, 70, "°C").optional(),
    /**
     * The DC circuit runs on or into a building (690.7 building voltage limits, 690.12 rapid shutdown).
     * Empty on a ground-mounted array is read as entering one, the stricter case.
     */
    entersBuilding: z.boolean().optional(),
    /**
     * Runs where people can reach it without a ladder or tools (Article 100 "readily accessible"); a PV circuit over
     * 30 V there is guarded or in raceway or MC cable (690.31(A)).
     */
    readilyAccessible: z.boolean().optional(),
    /** Guarded against contact where readily accessible (a fence, cover or enclosure), in place of raceway. */
    guarded: z.boolean().optional(),
    /**
     * Stranding finer than Class B or C (Chapter 9, Table 10), e.g. flexible battery cable: terminals must be
     * identified for it (110.14). Cords and welding cable are fine-stranded whatever this says.
     */
    fineStranded: z.boolean().optional(),
    /** The lugs and terminals at both ends are identified for the fine-stranded conductor class (110.14). */
    fineStrandTerminalsIdentified: z.boolean().optional(),
    /** Raceway or cable exposed to sunlight on or above a roof. */
    onRooftop: z.boolean().default(false),
    roofClearanceIn: numberIn(0, 120, "in").optional(),
    terminalTempRatingC: tempRatingSchema.optional(),
    /** Equipment tag of the fuse or breaker that protects the circuit. */
    ocpdTag: tagSchema.optional(),
    /** Equipment tags of disconnects placed on the circuit. */
    disconnectTags: z.array(tagSchema).default([]),
    egcSize: conductorSizeSchema.optional(),
    egcMaterial: z.enum(["cu", "al"]).default("cu"),
    /**
     * An AC circuit that leaves the structure its source stands in and enters another building (a generator shed's
     * feeder to the house): that building needs its own disconnect where the feeder enters (225.31, 225.32).
     */
    feedsOtherBuilding: z.boolean().optional(),
    /** The disconnect (or panel with its main) where the circuit enters the other building. */
    buildingDisconnectTag: tagSchema.optional(),
  })
  .refine((c) => c.fromTag !== c.toTag, {
    message: "a circuit cannot run from a device to itself",
    path: ["toTag"],
  });
export type Circuit = z.infer<typeof circuitSchema>;

/** Electrodes that can make up the grounding electrode system (250.52(A)). */
export const GROUNDING_ELECTRODE_KINDS = [
  "ground-rod",
  "concrete-encased",
  "ground-ring",
  "metal-water-pipe",
  "building-steel",
  "plate",
  "existing-building-system",
] as const;
export type GroundingElectrodeKind = (typeof GROUNDING_ELECTRODE_KINDS)[number];

/**
 * The grounding electrode system, its conductor, and where the one
 * neutral-to-ground bond of the system is made (250.30, 250.6, 250.166, 690.47).
 */
export const groundingSchema = z.object({
  electrodes: z.array(z.enum(GROUNDING_ELECTRODE_KINDS)).default([]),
  gecSize: conductorSizeSchema.optional(),
  gecMaterial: z.enum(["cu", "al"], { error: "must be cu or al" }).default("cu"),
  /** Equipment tag (inverter, generator or panel) where the single neutral-to-ground bond is made. */
  neutralGroundBondTag: tagSchema.optional(),
});
export type Grounding = z.infer<typeof groundingSchema>;

export const loadSchema = z.object({
  name: requiredText(120),
  watts: numberIn(0, 100000, "W"),
  quantity: integerIn(1, 1000).default(1),
  hoursPerDay: numberIn(0, 24, "h"),
  /**
   * Share of those hours it draws its rated power, for a load that cycles (a refrigerator's compressor runs
   * about a third of the time); empty is 100 %.
   */
  dutyPct: numberIn(1, 100, "%").optional(),
  /** Days a week it runs, for a load not used every day; the week's energy is averaged per day. Empty is 7. */
  daysPerWeek: integerIn(1, 7, "days").optional(),
  surgeW: numberIn(0, 300000, "W").optional(),
  voltageV: z.union([z.literal(120), z.literal(240)]).default(120),
  /** Runs at the same time as the others (for the peak simultaneous power). */
  simultaneous: z.boolean().default(true),
});
export type Load = z.infer<typeof loadSchema>;

export const ATTACHMENT_KINDS = [
  "datasheet",
  "site-plan",
  "storage-listing",
  "structural-letter",
  "attachment-detail",
  "photo",
  "stamp",
  "other",
] as const;

export const attachmentRefSchema = z.object({
  id: z.string().max(64).optional(),
  kind: z.enum(ATTACHMENT_KINDS),
  equipmentTag: tagSchema.optional(),
  fileName: text(255).default(""),
  pageCount: integerIn(0, 10000).optional(),
  sha256: z
    .string()
    .regex(/^[0-9a-f]{64}$/, { message: "must be 64 lowercase hex digits" })
    .optional(),
});
export type AttachmentRef = z.infer<typeof attachmentRefSchema>;

export const PROJECT_FILE_FORMAT = "sundocket-project" as const;
export const PROJECT_FILE_VERSION = 1 as const;

export const projectRecordObjectSchema = z.object({
  format: z.literal(PROJECT_FILE_FORMAT).default(PROJECT_FILE_FORMAT),
  formatVersion: z.literal(PROJECT_FILE_VERSION).default(PROJECT_FILE_VERSION),
  name: requiredText(200),
  client: text(200).default(""),
  systemKind: systemKindSchema,
  site: siteSchema,
  jurisdiction: jurisdictionRulesSchema,
  /** Days the storage must carry the loads without sun (two to three by common practice). */
  daysOfAutonomy: numberIn(0.5, 14, "days").optional(),
  /** The rapid-shutdown method named for PV circuits on or in a building. */
  rapidShutdownMethod: z
    .enum(["module-level", "array-boundary", "listed-pv-hazard-control", "none"])
    .optional(),
  /**
   * How PV circuits inside the array boundary meet 690.12(B)(2) on a building-mounted array: a listed PV hazard
   * control system, 80 V or less within 30 s, or no exposed wiring methods or conductive parts; "none" when
   * the design meets none of them.
   */
  rapidShutdownInsideBoundary: z.enum(RAPID_SHUTDOWN_INSIDE_BOUNDARY).optional(),
  /** How the PV system DC circuits are grounded (690.41(A)); sets whether DC ground-fault protection is required (690.41(B)). */
  pvGroundingConfiguration: z.enum(PV_GROUNDING_CONFIGURATIONS, { error: `must be one of ${PV_GROUNDING_CONFIGURATIONS.join(", ")}` }).optional(),
  grounding: groundingSchema.default({ electrodes: [], gecMaterial: "cu" }),
  equipment: z.array(equipmentSchema).default([]),
  arrays: z.array(arraySchema).default([]),
  circuits: z.array(circuitSchema).default([]),
  loads: z.array(loadSchema).default([]),
  attachments: z.array(attachmentRefSchema).default([]),
});

type RecordShape = z.output<typeof projectRecordObjectSchema>;

const PV_CIRCUIT_KINDS: readonly string[] = ["pv-source", "pv-output"];
const PV_FED_KINDS: readonly string[] = ["charge-controller", ...INVERTER_KINDS];
const OCPD_KINDS: readonly string[] = ["fuse", "breaker"];
const DISCONNECT_KINDS: readonly string[] = ["disconnect", "breaker", "fuse"];
const BOND_KINDS: readonly string[] = [...INVERTER_KINDS, "generator", "ac-panel"];
const BUILDING_DISCONNECT_KINDS: readonly string[] = ["disconnect", "breaker", "ac-panel"];

/**
 * Refuses references that point at nothing or at the wrong kind of thing, so
 * the engine never has to guess what a tag means. Tags are unique across
 * equipment, arrays and circuits: a tag names one thing on the one-line diagram.
 */
function checkReferences(record: RecordShape, ctx: z.RefinementCtx): void {
  const equipmentByTag = new Map<string, Equipment>();
  const arrayTags = new Set<string>();
  const seen = new Map<string, string>();
  const claim = (tag: string, path: (string | number)[]) => {
    const first = seen.get(tag);
    if (first !== undefined) {
      ctx.addIssue({ code: "custom", path, message: `duplicate tag "${tag}": ${first} already has it` });
    } else {
      // Named as the editor numbers rows (from 1), so the message reads the same wherever it is shown.
      const noun = path[0] === "equipment" ? "equipment row" : path[0] === "arrays" ? "array row" : "circuit row";
      seen.set(tag, `${noun} ${Number(path[1]) + 1}`);
    }
  };
  record.equipment.forEach((e, i) => {
    claim(e.tag, ["equipment", i, "tag"]);
    if (!equipmentByTag.has(e.tag)) equipmentByTag.set(e.tag, e);
  });
  record.arrays.forEach((a, i) => {
    claim(a.tag, ["arrays", i, "tag"]);
    arrayTags.add(a.tag);
  });
  record.circuits.forEach((c, i) => claim(c.tag, ["circuits", i, "tag"]));

  record.arrays.forEach((a, i) => {
    const module = equipmentByTag.get(a.moduleTag);
    if (!module) {
      ctx.addIssue({ code: "custom", path: ["arrays", i, "moduleTag"], message: `names no equipment: "${a.moduleTag}"` });
    } else if (module.kind !== "pv-module") {
      ctx.addIssue({
        code: "custom",
        path: ["arrays", i, "moduleTag"],
        message: `"${a.moduleTag}" is a ${module.kind}, not a pv-module`,
      });
    }
    const fed = equipmentByTag.get(a.feedsTag);
    if (!fed) {
      ctx.addIssue({ code: "custom", path: ["arrays", i, "feedsTag"], message: `names no equipment: "${a.feedsTag}"` });
    } else if (!PV_FED_KINDS.includes(fed.kind)) {
      ctx.addIssue({
        code: "custom",
        path: ["arrays", i, "feedsTag"],
        message: `"${a.feedsTag}" is a ${fed.kind}, not a charge controller or inverter`,
      });
    } else if (a.mpptInputId !== undefined && a.mpptInputId !== "") {
      const inputs = fed.kind === "charge-controller" ? [] : (fed as { mpptInputs: { id: string }[] }).mpptInputs;
      if (!inputs.some((m) => m.id === a.mpptInputId)) {
        const have = inputs.map((m) => m.id).join(", ");
        ctx.addIssue({
          code: "custom",
          path: ["arrays", i, "mpptInputId"],
          message: `string on an MPPT input that does not exist: "${a.feedsTag}" has no input "${a.mpptInputId}"${have ? ` (it has ${have})` : ""}`,
        });
      }
    }
  });

  record.circuits.forEach((c, i) => {
    const pv = PV_CIRCUIT_KINDS.includes(c.kind);
    for (const end of ["fromTag", "toTag"] as const) {
      const tag = c[end];
      if (equipmentByTag.has(tag)) continue;
      if (arrayTags.has(tag)) {
        if (!pv) {
          ctx.addIssue({
            code: "custom",
            path: ["circuits", i, end],
            message: `"${tag}" is a PV array; only pv-source and pv-output circuits may start or end at an array`,
          });
        }
        continue;
      }
      ctx.addIssue({
        code: "custom",
        path: ["circuits", i, end],
        message: `names no equipment${pv ? " or array" : ""}: "${tag}"`,
      });
    }
    if (c.arrayTag !== undefined && !arrayTags.has(c.arrayTag)) {
      const e = equipmentByTag.get(c.arrayTag);
      ctx.addIssue({
        code: "custom",
        path: ["circuits", i, "arrayTag"],
        message: e ? `"${c.arrayTag}" is a ${e.kind}, not an array` : `names no array: "${c.arrayTag}"`,
      });
    }
    if (c.ocpdTag !== undefined) {
      const e = equipmentByTag.get(c.ocpdTag);
      if (!e || !OCPD_KINDS.includes(e.kind)) {
        ctx.addIssue({
          code: "custom",
          path: ["circuits", i, "ocpdTag"],
          message: e ? `"${c.ocpdTag}" is a ${e.kind}, not a fuse or breaker` : `names no equipment: "${c.ocpdTag}"`,
        });
      }
    }
    c.disconnectTags.forEach((tag, j) => {
      const e = equipmentByTag.get(tag);
      if (!e || !DISCONNECT_KINDS.includes(e.kind)) {
        ctx.addIssue({
          code: "custom",
          path: ["circuits", i, "disconnectTags", j],
          message: e ? `"${tag}" is a ${e.kind}, not a disconnect, breaker or fuse` : `names no equipment: "${tag}"`,
        });
      }
    });
  });

  const bondTag = record.grounding.neutralGroundBondTag;
  if (bondTag !== undefined) {
    const e = equipmentByTag.get(bondTag);
    if (!e) ctx.addIssue({ code: "custom", path: ["grounding", "neutralGroundBondTag"], message: `names no equipment: "${bondTag}"` });
    else if (!BOND_KINDS.includes(e.kind)) {
      ctx.addIssue({ code: "custom", path: ["grounding", "neutralGroundBondTag"], message: `"${bondTag}" is a ${e.kind}; the bond is made in an inverter, generator or AC panel` });
    }
  }
  record.equipment.forEach((e, i) => {
    if ((e.kind === "disconnect" || e.kind === "breaker" || e.kind === "fuse") && e.locatedAtTag !== undefined && !equipmentByTag.has(e.locatedAtTag)) {
      ctx.addIssue({ code: "custom", path: ["equipment", i, "locatedAtTag"], message: `names no equipment: "${e.locatedAtTag}"` });
    }
  });
  record.circuits.forEach((c, i) => {
    if (c.buildingDisconnectTag === undefined) return;
    const e = equipmentByTag.get(c.buildingDisconnectTag);
    if (!e || !BUILDING_DISCONNECT_KINDS.includes(e.kind)) {
      ctx.addIssue({
        code: "custom",
        path: ["circuits", i, "buildingDisconnectTag"],
        message: e ? `"${c.buildingDisconnectTag}" is a ${e.kind}, not a disconnect, breaker or AC panel` : `names no equipment: "${c.buildingDisconnectTag}"`,
      });
    }
  });

  record.attachments.forEach((a, i) => {
    if (a.equipmentTag !== undefined && !equipmentByTag.has(a.equipmentTag)) {
      ctx.addIssue({
        code: "custom",
        path: ["attachments", i, "equipmentTag"],
        message: `names no equipment: "${a.equipmentTag}"`,
      });
    }
  });
}

export const projectRecordSchema = projectRecordObjectSchema.superRefine(checkReferences);
export type ProjectRecord = z.infer<typeof projectRecordSchema>;
export type ProjectRecordInput = z.input<typeof projectRecordSchema>;
