/**
 * The ratings a designer enters for each equipment kind, in the order they
 * appear on a datasheet. Names and units follow the project record schema.
 */
import { EQUIPMENT_KIND_LABELS, EQUIPMENT_KINDS, type EquipmentKind } from "@/lib/schemas/project-record";
import { isInverterKind } from "@/lib/schemas/vocabulary";
import type { GridColumn } from "./editable-grid";
import type { FieldType, Option } from "./field-control";

export interface RatingField {
  key: string;
  label: string;
  unit?: string;
  type: FieldType;
  options?: Option[];
  help?: string;
}

const opts = (...values: string[]): Option[] => values.map((v) => ({ value: v, label: v }));

export { EQUIPMENT_KIND_LABELS };

/** Tag prefixes a plan set commonly uses for each kind (common practice). */
export const TAG_PREFIX: Record<EquipmentKind, string> = {
  "pv-module": "MOD",
  "charge-controller": "CC",
  inverter: "INV",
  "inverter-charger": "INV",
  "hybrid-inverter": "INV",
  battery: "BAT",
  generator: "GEN",
  disconnect: "DS",
  fuse: "F",
  breaker: "CB",
  "rapid-shutdown": "RSD",
  "ac-panel": "P",
  busbar: "BB",
};

const inverterFields: RatingField[] = [
  { key: "continuousW", label: "Continuous power", unit: "W", type: "number" },
  { key: "surgeW", label: "Surge power", unit: "W", type: "number" },
  { key: "nominalBatteryVoltageV", label: "Nominal battery voltage", unit: "V", type: "number" },
  { key: "minBatteryVoltageV", label: "Low-voltage cut-out", unit: "V", type: "number", help: "Sets the DC input current at full power." },
  { key: "maxDcInputCurrentA", label: "Max DC input current", unit: "A", type: "number" },
  { key: "acOutputVoltageV", label: "AC output voltage", unit: "V", type: "number" },
  { key: "acOutput", label: "AC output", type: "select", options: opts("120", "240", "120/240", "208", "277/480") },
  { key: "acOutputPhases", label: "AC output phases", type: "integer" },
  { key: "maxAcOutputCurrentA", label: "Max AC output current", unit: "A", type: "number" },
  { key: "acInputCurrentLimitA", label: "AC input current limit", unit: "A", type: "number" },
  { key: "idleW", label: "Idle consumption", unit: "W", type: "number" },
  { key: "efficiencyPct", label: "Efficiency", unit: "%", type: "number" },
  { key: "listedMode", label: "Listed for", type: "select", options: opts("stand-alone", "multimode", "interactive") },
  { key: "hasPvDisconnect", label: "PV disconnect built in", type: "checkbox" },
  { key: "hasOvercurrentProtection", label: "Overcurrent devices built in", type: "checkbox" },
  { key: "providesPvArcFaultProtection", label: "PV arc-fault protection (UL 1699B)", type: "tri-state" },
  { key: "neutralBonded", label: "Neutral bonded to ground", type: "tri-state", help: "Its bonding jumper or relay joins neutral and ground; only one unit in the system does." },
  { key: "providesPvGroundFaultProtection", label: "PV ground-fault protection (690.41(B))", type: "tri-state" },
];

const protectiveFields: RatingField[] = [
  { key: "ratingA", label: "Rating", unit: "A", type: "number" },
  { key: "voltageRatingV", label: "Voltage rating", unit: "V", type: "number" },
  { key: "currentType", label: "Current", type: "select", options: [{ value: "ac", label: "AC" }, { value: "dc", label: "DC" }, { value: "ac-dc", label: "AC and DC" }] },
  { key: "interruptingRatingA", label: "Interrupting rating", unit: "A", type: "number" },
  { key: "distanceFromBatteryFt", label: "Distance from battery", unit: "ft", type: "number", help: "For a device protecting a battery circuit." },
  {
    key: "clearingTimeMs",
    label: "Clearing time at the battery's fault current",
    unit: "ms",
    type: "number",
    help: "From the fuse's or breaker's time-current curve at the battery's short-circuit current; the storage disconnect label carries it (706.15(C)).",
  },
  { key: "breakerMounting", label: "Breaker mounting", type: "select", options: opts("plug-in", "bolt-on"), help: "A back-fed plug-in breaker needs a hold-down (408.36(D))." },
  { key: "hasHoldDown", label: "Hold-down fastener", type: "tri-state" },
  { key: "locatedAtTag", label: "Stands at (tag)", type: "text", help: "The equipment it stands beside, e.g. the generator it disconnects (445.18)." },
  {
    key: "providesPvGroundFaultProtection",
    label: "PV ground-fault protection (690.41(B))",
    type: "tri-state",
    help: "Yes for a device listed to detect PV array ground faults and open the faulted circuit.",
  },
];

const panelFields: RatingField[] = [
  { key: "busRatingA", label: "Bus rating", unit: "A", type: "number" },
  { key: "neutralBusRatingA", label: "Neutral bus rating", unit: "A", type: "number", help: "A single 120 V supply's sources must stay below it." },
  { key: "mainBreakerA", label: "Main breaker", unit: "A", type: "number" },
  { key: "voltage", label: "Voltage", type: "select", options: opts("12", "24", "48", "120", "240", "120/240", "208", "277/480", "other") },
  { key: "sumOfBreakersA", label: "Sum of breakers", unit: "A", type: "number" },
  { key: "hasMultiwireBranchCircuits", label: "Multiwire branch circuits", type: "tri-state" },
  { key: "neutralBonded", label: "Main bonding jumper (neutral to ground)", type: "tri-state" },
];

export const RATING_FIELDS: Record<EquipmentKind, RatingField[]> = {
  "pv-module": [
    { key: "pmaxW", label: "Pmax", unit: "W", type: "number" },
    { key: "vocV", label: "Voc", unit: "V", type: "number", help: "Open-circuit voltage at STC, from the datasheet." },
    { key: "iscA", label: "Isc", unit: "A", type: "number" },
    { key: "vmpV", label: "Vmp", unit: "V", type: "number" },
    { key: "impA", label: "Imp", unit: "A", type: "number" },
    { key: "tempCoeffVocPctPerC", label: "Voc temperature coefficient", unit: "%/°C", type: "number", help: "Negative, e.g. −0.29. Without it the checks use the Table 690.7(A) factors." },
    { key: "tempCoeffVmpPctPerC", label: "Vmp temperature coefficient", unit: "%/°C", type: "number" },
    { key: "maxSeriesFuseA", label: "Max series fuse", unit: "A", type: "number" },
    { key: "maxSystemVoltageV", label: "Max system voltage", unit: "V", type: "number" },
  ],
  "charge-controller": [
    { key: "controllerType", label: "Type", type: "select", options: [{ value: "mppt", label: "MPPT" }, { value: "pwm", label: "PWM" }] },
    { key: "maxPvInputVoltageV", label: "Max PV input voltage", unit: "V", type: "number" },
    { key: "maxPvInputCurrentA", label: "Max PV input current", unit: "A", type: "number" },
    { key: "mpptMinVoltageV", label: "Lowest tracking voltage", unit: "V", type: "number" },
    { key: "ratedOutputCurrentA", label: "Rated output current", unit: "A", type: "number" },
    { key: "batteryVoltagesV", label: "Battery voltages", unit: "V", type: "numbers", help: "Comma-separated, e.g. 12, 24, 48." },
    { key: "hasPvDisconnect", label: "PV disconnect built in", type: "checkbox" },
    { key: "hasOvercurrentProtection", label: "Overcurrent devices built in", type: "checkbox" },
    { key: "providesPvArcFaultProtection", label: "PV arc-fault protection (UL 1699B)", type: "tri-state" },
    { key: "providesPvGroundFaultProtection", label: "PV ground-fault protection (690.41(B))", type: "tri-state" },
  ],
  inverter: inverterFields,
  "inverter-charger": inverterFields,
  "hybrid-inverter": inverterFields,
  battery: [
    { key: "chemistry", label: "Chemistry", type: "select", options: opts("lfp", "nmc", "lead-acid-flooded", "lead-acid-agm", "nickel-iron", "other") },
    { key: "nominalVoltageV", label: "Nominal voltage", unit: "V", type: "number" },
    { key: "capacityAh", label: "Capacity", unit: "Ah", type: "number" },
    { key: "capacityKWh", label: "Energy", unit: "kWh", type: "number" },
    { key: "maxContinuousDischargeA", label: "Max continuous discharge", unit: "A", type: "number" },
    { key: "shortCircuitCurrentA", label: "Available short-circuit current", unit: "A", type: "number" },
    { key: "usableDodPct", label: "Usable depth of discharge", unit: "%", type: "number" },
    { key: "maxConnectionsPerTerminal", label: "Max connections per terminal", type: "integer" },
    { key: "maxChargeVoltageV", label: "Max charge voltage", unit: "V", type: "number" },
    { key: "largeScaleFireTested", label: "Large-scale fire tested (UL 9540A)", type: "checkbox" },
  ],
  generator: [
    { key: "ratedKW", label: "Rated power", unit: "kW", type: "number" },
    { key: "voltageV", label: "Voltage", unit: "V", type: "number" },
    { key: "output", label: "Output", type: "select", options: opts("120", "240", "120/240", "208", "277/480") },
    { key: "phases", label: "Phases", type: "integer", help: "1 for single or split phase, 3 for three phase." },
    { key: "fuel", label: "Fuel", type: "select", options: opts("gasoline", "diesel", "propane", "natural-gas", "other") },
    { key: "outputBreakerA", label: "Output breaker", unit: "A", type: "number" },
    { key: "hasOutputDisconnect", label: "Output disconnect built in", type: "checkbox" },
    { key: "installation", label: "Installation", type: "select", options: opts("portable", "stationary"), help: "Empty takes it from the listing: UL 2201 portable, UL 2200 stationary." },
    { key: "connectedByInlet", label: "Connects through a power inlet", type: "tri-state", help: "A portable generator by cord and plug; the plug then disconnects it (445.18(A))." },
    { key: "neutralBonded", label: "Neutral bonded to ground", type: "tri-state", help: "Its bonding jumper or relay joins neutral and ground; only one unit in the system does." },
  ],
  disconnect: protectiveFields,
  fuse: protectiveFields,
  breaker: protectiveFields,
  "rapid-shutdown": [
    { key: "method", label: "Method", type: "select", options: opts("module-level", "array-boundary", "listed-pv-hazard-control", "other") },
    { key: "controls", label: "Controls", type: "text" },
  ],
  "ac-panel": panelFields,
  busbar: panelFields,
};

/** The fields every kind shares are kept when the kind changes; ratings of the old kind are dropped. */
export function changeKind(row: Record<string, unknown>, kind: EquipmentKind): Record<string, unknown> {
  const { tag, manufacturer, model, quantity, listing } = row;
  const base: Record<string, unknown> = { tag, manufacturer, model, quantity, listing, kind };
  if (kind === "charge-controller") Object.assign(base, { batteryVoltagesV: [], hasPvDisconnect: false, hasOvercurrentProtection: false });
  if (isInverterKind(kind)) {
    Object.assign(base, { mpptInputs: [], acOutputPhases: 1, hasPvDisconnect: false, hasOvercurrentProtection: false });
  }
  if (kind === "battery") base.largeScaleFireTested = false;
  if (kind === "generator") Object.assign(base, { hasOutputDisconnect: false, phases: 1 });
  if (kind === "rapid-shutdown") base.controls = "";
  return base;
}

const KIND_OPTIONS: Option[] = EQUIPMENT_KINDS.map((k) => ({ value: k, label: EQUIPMENT_KIND_LABELS[k] }));

export const EQUIPMENT_COLUMNS: GridColumn[] = [
  { key: "tag", header: "Tag", type: "text", width: "w-20" },
  { key: "kind", header: "Kind", type: "select", options: KIND_OPTIONS, required: true, width: "w-40" },
  { key: "manufacturer", header: "Manufacturer", type: "text", width: "w-32" },
  { key: "model", header: "Model", type: "text", width: "w-32" },
  { key: "quantity", header: "Qty", type: "integer", width: "w-14" },
  { key: "listing", header: "Listing", type: "text", width: "w-28" },
];

export const MPPT_INPUT_COLUMNS: GridColumn[] = [
  { key: "id", header: "Input id", type: "text", width: "w-16" },
  { key: "maxVoltageV", header: "Max voltage", unit: "V", type: "number" },
  { key: "maxCurrentA", header: "Max current", unit: "A", type: "number" },
  { key: "minOperatingVoltageV", header: "Window low", unit: "V", type: "number" },
  { key: "maxOperatingVoltageV", header: "Window high", unit: "V", type: "number" },
];
