import { z } from "zod";
import {
  batterySchema,
  chargeControllerSchema,
  EQUIPMENT_KIND_LABELS,
  EQUIPMENT_KINDS,
  generatorSchema,
  inverterSchema,
  mpptInputSchema,
  panelSchema,
  protectiveDeviceSchema,
  pvModuleSchema,
  rapidShutdownSchema,
  type Equipment,
  type EquipmentKind,
} from "./project-record";

/**
 * An organisation's equipment library item: the project record's equipment
 * object without what belongs to one project (tag, quantity, the link back to
 * the library). A library item therefore drops into a project unchanged, and
 * every rating is refused or accepted by the same rule as in the project file.
 */

const PROJECT_ONLY = { tag: true, quantity: true, libraryItemId: true } as const;

// A library item is found again by maker and model, so both are required here
// (the project record lets them be empty while a design is half-entered).
const identity = {
  manufacturer: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(120, { message: "must be at most 120 characters" }),
  model: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(120, { message: "must be at most 120 characters" }),
};

export const libraryPvModuleSchema = pvModuleSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryChargeControllerSchema = chargeControllerSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryInverterSchema = inverterSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryBatterySchema = batterySchema.omit(PROJECT_ONLY).extend(identity);
export const libraryGeneratorSchema = generatorSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryProtectiveDeviceSchema = protectiveDeviceSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryRapidShutdownSchema = rapidShutdownSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryPanelSchema = panelSchema.omit(PROJECT_ONLY).extend(identity);

export const libraryItemSchema = z.discriminatedUnion("kind", [
  libraryPvModuleSchema,
  libraryChargeControllerSchema,
  libraryInverterSchema,
  libraryBatterySchema,
  libraryGeneratorSchema,
  libraryProtectiveDeviceSchema,
  libraryRapidShutdownSchema,
  libraryPanelSchema,
]);
export type LibraryItemInput = z.input<typeof libraryItemSchema>;
export type LibraryItemData = z.output<typeof libraryItemSchema>;

export const libraryKindSchema = z.enum(EQUIPMENT_KINDS, { error: `must be one of ${EQUIPMENT_KINDS.join(", ")}` });
export { EQUIPMENT_KINDS };
export type { EquipmentKind };

/** The schema of one kind's item, for forms that edit one kind at a time. */
export function librarySchemaForKind(kind: EquipmentKind) {
  switch (kind) {
    case "pv-module":
      return libraryPvModuleSchema;
    case "charge-controller":
      return libraryChargeControllerSchema;
    case "inverter":
    case "inverter-charger":
    case "hybrid-inverter":
      return libraryInverterSchema;
    case "battery":
      return libraryBatterySchema;
    case "generator":
      return libraryGeneratorSchema;
    case "disconnect":
    case "fuse":
    case "breaker":
      return libraryProtectiveDeviceSchema;
    case "rapid-shutdown":
      return libraryRapidShutdownSchema;
    case "ac-panel":
    case "busbar":
      return libraryPanelSchema;
  }
}

/** Ratings as stored and served: everything of the item but kind, manufacturer and model. */
export type LibraryRatings = Record<string, unknown>;

/** A library item as the route handlers serve it (GET /api/library). */
export interface LibraryItemView {
  id: string;
  kind: EquipmentKind;
  manufacturer: string;
  model: string;
  ratings: LibraryRatings;
  retiredAt: string | null;
  version: number;
}

export function splitLibraryItem(item: LibraryItemData): { kind: EquipmentKind; manufacturer: string; model: string; ratings: LibraryRatings } {
  const { kind, manufacturer, model, ...ratings } = item;
  return { kind, manufacturer, model, ratings };
}

/**
 * A project equipment instance from a library item: the editor's picker calls
 * this, then the project record schema validates the result as usual.
 */
export function equipmentFromLibraryItem(item: Pick<LibraryItemView, "id" | "kind" | "manufacturer" | "model" | "ratings">, tag: string, quantity = 1): Equipment {
  return {
    ...item.ratings,
    kind: item.kind,
    manufacturer: item.manufacturer,
    model: item.model,
    tag,
    quantity,
    libraryItemId: item.id,
  } as Equipment;
}

/** Human names of the kinds, for headings and pickers. */
export const KIND_LABELS = EQUIPMENT_KIND_LABELS;

export { mpptInputSchema };

/* ------------------------------------------------------------------------ */
/* Rating fields: what a form or a CSV column needs to know about each one. */
/* ------------------------------------------------------------------------ */

export type RatingFieldType = "number" | "integer" | "boolean" | "enum" | "text" | "number-list" | "mppt-inputs";

export interface RatingField {
  /** The schema field name, also the CSV column name. */
  name: string;
  type: RatingFieldType;
  label: string;
  help: string;
  /** Unit symbol as printed beside a figure ("V", "%/°C"); empty when the field has none. */
  unit: string;
  /** Unit in words, for messages ("in volts"). */
  unitWords: string;
  /** Allowed range as the schema refuses it ("between 0.5 and 150 V"), for numbers. */
  range?: string;
  options?: readonly string[];
  /** Whether the schema fills it in when left empty (false for booleans, [] for lists). */
  hasDefault: boolean;
}

// Longest suffix first: "PctPerC" before "Pct", "KWh" before "KW", "Ah" before "A".
const UNIT_SUFFIXES: { suffix: string; unit: string; words: string }[] = [
  { suffix: "PctPerC", unit: "%/°C", words: "percent per °C" },
  { suffix: "Pct", unit: "%", words: "percent" },
  { suffix: "KWh", unit: "kWh", words: "kilowatt-hours" },
  { suffix: "KW", unit: "kW", words: "kilowatts" },
  { suffix: "Ah", unit: "Ah", words: "ampere-hours" },
  { suffix: "Ft", unit: "ft", words: "feet" },
  { suffix: "In", unit: "in", words: "inches" },
  { suffix: "V", unit: "V", words: "volts" },
  { suffix: "A", unit: "A", words: "amperes" },
  { suffix: "W", unit: "W", words: "watts" },
  { suffix: "C", unit: "°C", words: "degrees Celsius" },
];

/** The unit a field name carries in its suffix ("vocV" → V, volts). */
export function unitOfField(name: string): { unit: string; words: string; suffix: string } {
  const hit = UNIT_SUFFIXES.find((u) => name.endsWith(u.suffix) && name.length > u.suffix.length && /[a-z0-9]/.test(name[name.length - u.suffix.length - 1] ?? ""));
  return hit ? { unit: hit.unit, words: hit.words, suffix: hit.suffix } : { unit: "", words: "", suffix: "" };
}

/** Labels and help lines; where a value usually comes from, in the designer's words. */
const FIELD_TEXT: Record<string, { label: string; help: string }> = {
  listing: { label: "Listing", help: "Listing standard(s) on the nameplate, e.g. UL 1741, UL 9540, UL 61730." },
  // PV module
  pmaxW: { label: "Pmax", help: "Rated power at STC, from the datasheet's electrical table." },
  vocV: { label: "Voc", help: "Open-circuit voltage at STC; the maximum-voltage check starts from it (690.7)." },
  iscA: { label: "Isc", help: "Short-circuit current at STC; PV circuit current is 125 % of it (690.8(A))." },
  vmpV: { label: "Vmp", help: "Voltage at maximum power, STC; used for the MPPT window at high temperature." },
  impA: { label: "Imp", help: "Current at maximum power, STC." },
  tempCoeffVocPctPerC: { label: "Temp. coefficient of Voc", help: "Negative, e.g. -0.27. Without it the check falls back to Table 690.7(A)." },
  tempCoeffVmpPctPerC: { label: "Temp. coefficient of Vmp", help: "Negative, e.g. -0.35; often printed as the coefficient of Pmax when Vmp's is absent." },
  maxSeriesFuseA: { label: "Maximum series fuse", help: "Maximum series fuse (or OCPD) rating on the module label." },
  maxSystemVoltageV: { label: "Maximum system voltage", help: "Module's maximum system voltage rating, usually 1000 or 1500 V." },
  // Charge controller
  controllerType: { label: "Controller type", help: "PWM or MPPT." },
  maxPvInputVoltageV: { label: "Maximum PV input voltage", help: "Absolute maximum PV open-circuit voltage the controller accepts, cold." },
  maxPvInputCurrentA: { label: "Maximum PV input current", help: "Maximum PV short-circuit current the input accepts." },
  mpptMinVoltageV: { label: "MPPT minimum voltage", help: "Lowest PV voltage at which it still tracks; often battery voltage plus a margin." },
  ratedOutputCurrentA: { label: "Rated output current", help: "Rated charging current into the battery." },
  batteryVoltagesV: { label: "Battery voltages supported", help: "Nominal battery voltages the controller works with, e.g. 12, 24, 48." },
  hasPvDisconnect: { label: "PV disconnect built in", help: "The equipment carries a listed PV disconnect that counts for 690.13/690.15." },
  hasOvercurrentProtection: { label: "Overcurrent protection built in", help: "The equipment carries listed overcurrent protection for its PV or DC input." },
  providesPvArcFaultProtection: { label: "PV arc-fault protection", help: "Listed to detect and interrupt DC arc faults on its PV input (UL 1699B), which meets 690.11." },
  providesPvGroundFaultProtection: {
    label: "PV ground-fault protection",
    help: "Listed to detect ground faults in the PV array's conductors and isolate the faulted circuit, which meets 690.41(B).",
  },
  // Inverter
  continuousW: { label: "Continuous power", help: "Continuous AC output power at the rated temperature." },
  surgeW: { label: "Surge power", help: "Short-time surge output for motor starts; the datasheet names the duration." },
  nominalBatteryVoltageV: { label: "Nominal battery voltage", help: "Battery bank voltage the inverter is built for, e.g. 12, 24, 48 or 51.2." },
  minBatteryVoltageV: { label: "Minimum battery voltage", help: "Low-voltage cut-out; sets the largest DC input current." },
  maxDcInputCurrentA: { label: "Maximum DC input current", help: "Battery-side input current at full power, where the datasheet gives it." },
  acOutputVoltageV: { label: "AC output voltage", help: "Nominal AC output voltage." },
  acOutput: { label: "AC output", help: "Output configuration: 120, 240, 120/240 split phase, 208 or 277/480." },
  acOutputPhases: { label: "AC output phases", help: "1 for single phase, 2 for split phase (120/240 V), 3 for three phase." },
  maxAcOutputCurrentA: { label: "Maximum AC output current", help: "Maximum continuous AC output current from the nameplate (705.60, 690.8)." },
  acInputCurrentLimitA: { label: "AC input current limit", help: "Maximum current drawn from a generator or the grid through the AC input." },
  idleW: { label: "Idle consumption", help: "No-load draw when on and inverting; counted over 24 h in the daily energy." },
  efficiencyPct: { label: "Efficiency", help: "Peak or weighted efficiency; used for the DC input current." },
  mpptInputs: { label: "MPPT inputs", help: "One row per PV input of a hybrid inverter; strings are assigned to an input by its id." },
  listedMode: { label: "Listed mode", help: "The mode it is listed for: stand-alone, multimode or utility-interactive." },
  // Battery
  chemistry: { label: "Chemistry", help: "Cell chemistry; siting and depth of discharge depend on it." },
  nominalVoltageV: { label: "Nominal voltage", help: "Nominal voltage of one unit." },
  capacityAh: { label: "Capacity", help: "Rated capacity of one unit at its stated discharge rate." },
  capacityKWh: { label: "Energy", help: "Rated energy of one unit; siting limits (IRC R328/R330, NFPA 855) use it." },
  maxContinuousDischargeA: { label: "Maximum continuous discharge", help: "Continuous discharge current the unit or its BMS allows." },
  shortCircuitCurrentA: { label: "Available short-circuit current", help: "Available fault current at the terminals; the battery OCPD's interrupting rating must exceed it." },
  usableDodPct: { label: "Usable depth of discharge", help: "Share of the rated energy the system may use, e.g. 90 for LFP, 50 for lead-acid (common practice)." },
  maxConnectionsPerTerminal: { label: "Connections per terminal", help: "Lugs the terminal accepts; more conductors need a bus bar. Three by common practice when unstated." },
  maxChargeVoltageV: { label: "Maximum charge voltage", help: "Absorption or highest charge voltage of one unit." },
  largeScaleFireTested: { label: "Large-scale fire tested", help: "UL 9540A large-scale testing supports spacing closer than 3 ft." },
  // Generator
  ratedKW: { label: "Rated output", help: "Continuous (prime) rating, not the peak." },
  voltageV: { label: "Voltage", help: "Nominal output voltage." },
  output: { label: "Output", help: "Output configuration: 120, 240, 120/240, 208 or 277/480." },
  phases: { label: "Phases", help: "1 for single phase, 2 for split phase (120/240 V), 3 for three phase (its voltage is then line to line)." },
  fuel: { label: "Fuel", help: "Fuel the generator runs on." },
  hasOutputDisconnect: { label: "Output disconnect built in", help: "A built-in breaker or switch that serves as the 445.18 disconnect." },
  outputBreakerA: { label: "Output breaker", help: "Rating of the generator's output breaker." },
  // Disconnects, fuses, breakers
  ratingA: { label: "Current rating", help: "Ampere rating of the device." },
  voltageRatingV: { label: "Voltage rating", help: "Voltage rating for the current type below; a DC circuit needs the DC rating." },
  currentType: { label: "AC or DC", help: "ac, dc, or ac-dc when listed for both (an AC-only breaker may not go on a PV circuit)." },
  interruptingRatingA: { label: "Interrupting rating", help: "Interrupting (AIC) rating at its voltage; must exceed the fault current available (110.9)." },
  distanceFromBatteryFt: { label: "Distance from battery", help: "Usually set per project; leave empty in the library." },
  // Rapid shutdown
  method: { label: "Method", help: "The rapid-shutdown method the device serves (690.12)." },
  controls: { label: "Controls", help: "What the device controls, e.g. two modules per unit." },
  // Panels, bus bars
  busRatingA: { label: "Bus rating", help: "Ampere rating of the bus (705.12(B))." },
  mainBreakerA: { label: "Main breaker", help: "Main breaker rating; leave empty for main-lug panels and bus bars." },
  voltage: { label: "Voltage", help: "System voltage of the bus." },
  neutralBusRatingA: { label: "Neutral bus rating", help: "Ampere rating of the neutral bus; with a single 120 V supply the sum of the sources must stay below it (710.15(C))." },
  hasMultiwireBranchCircuits: { label: "Multiwire branch circuits", help: "Whether the panel feeds multiwire branch circuits (710.15(C))." },
  sumOfBreakersA: { label: "Sum of breakers", help: "Usually set per project: the sum of all breaker ratings on the bus." },
};

export const MPPT_INPUT_FIELDS: { name: "id" | "maxVoltageV" | "maxCurrentA" | "minOperatingVoltageV" | "maxOperatingVoltageV"; label: string; help: string }[] = [
  { name: "id", label: "Input id", help: "As printed on the inverter, e.g. A, B or 1, 2." },
  { name: "maxVoltageV", label: "Maximum voltage", help: "Absolute maximum open-circuit voltage of this input." },
  { name: "maxCurrentA", label: "Maximum current", help: "Maximum short-circuit current of this input." },
  { name: "minOperatingVoltageV", label: "Tracking window, low", help: "Lowest voltage at which this input tracks." },
  { name: "maxOperatingVoltageV", label: "Tracking window, high", help: "Highest voltage at which this input tracks." },
];

const IDENTITY_FIELDS = new Set(["kind", "manufacturer", "model"]);

interface ZodLike {
  _zod: { def: { type: string; innerType?: ZodLike; element?: ZodLike; options?: ZodLike[]; values?: unknown[] } };
  options?: readonly string[];
  isInt?: boolean;
  safeParse(v: unknown): { success: boolean; error?: { issues: { message: string }[] } };
}

function describeField(name: string, schema: ZodLike): RatingField {
  let t = schema;
  let hasDefault = false;
  while (t._zod.def.type === "optional" || t._zod.def.type === "default") {
    if (t._zod.def.type === "default") hasDefault = true;
    t = t._zod.def.innerType as ZodLike;
  }
  const def = t._zod.def;
  const text = FIELD_TEXT[name] ?? { label: name, help: "" };
  const { unit, words } = unitOfField(name);
  let type: RatingFieldType;
  if (def.type === "number") type = t.isInt ? "integer" : "number";
  else if (def.type === "boolean") type = "boolean";
  else if (def.type === "enum") type = "enum";
  // A choice of whole numbers (phases: 1, 2 or 3) reads as a whole number; the schema still refuses any other.
  else if (def.type === "union" && def.options?.every((o) => o._zod.def.type === "literal" && o._zod.def.values?.every((v) => Number.isInteger(v)))) type = "integer";
  else if (def.type === "array") type = def.element?._zod.def.type === "object" ? "mppt-inputs" : "number-list";
  else type = "text";
  let range: string | undefined;
  const probe = type === "number" || type === "integer" ? t : type === "number-list" ? def.element : undefined;
  if (probe) {
    // The schema names its own range in the refusal; reading it here keeps one source for the bound.
    const message = probe.safeParse(1e15).error?.issues[0]?.message ?? "";
    range = /between .+$/.exec(message)?.[0];
  }
  return { name, type, label: text.label, help: text.help, unit, unitWords: words, range, options: t.options, hasDefault };
}

const fieldsCache = new Map<EquipmentKind, RatingField[]>();

/** The rating fields of one kind, in schema order (listing first). */
export function ratingFieldsForKind(kind: EquipmentKind): RatingField[] {
  const cached = fieldsCache.get(kind);
  if (cached) return cached;
  const shape = librarySchemaForKind(kind).shape as unknown as Record<string, ZodLike>;
  const fields = Object.entries(shape)
    .filter(([name]) => !IDENTITY_FIELDS.has(name))
    .map(([name, s]) => describeField(name, s));
  fieldsCache.set(kind, fields);
  return fields;
}

/** The MPPT input fields with their ranges, for the form and the CSV columns mpptInputs.N.<field>. */
export function mpptInputFields(): RatingField[] {
  const shape = mpptInputSchema.shape as unknown as Record<string, ZodLike>;
  return MPPT_INPUT_FIELDS.map((f) => {
    const d = describeField(f.name, shape[f.name] as ZodLike);
    return { ...d, label: f.label, help: f.help };
  });
}
