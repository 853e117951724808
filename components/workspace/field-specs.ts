/**
 * The project and site fields of the editor with their labels, units and
 * help: what the form draws and what a message calls a field.
 */
import { BATTERY_LOCATIONS, CONDUCTOR_SIZES, GROUNDING_ELECTRODE_KINDS } from "@/lib/schemas/project-record";
import type { FieldControlProps, Option } from "./field-control";

const SYSTEM_KIND_OPTIONS: Option[] = [
  { value: "stand-alone", label: "Stand-alone" },
  { value: "stand-alone-generator", label: "Stand-alone with generator" },
  { value: "hybrid", label: "Hybrid / grid-interactive" },
];

const OCCUPANCY_OPTIONS: Option[] = [
  { value: "one-two-family-dwelling", label: "One- and two-family dwelling" },
  { value: "other-building", label: "Other building" },
];

const MOUNTING_OPTIONS: Option[] = [
  { value: "ground", label: "Ground mount" },
  { value: "roof", label: "Roof mount" },
];

const INSIDE_BOUNDARY_OPTIONS: Option[] = [
  { value: "listed-hazard-control", label: "Listed PV hazard control system" },
  { value: "80v-in-30s", label: "80 V or less within 30 s" },
  { value: "no-exposed-wiring", label: "No exposed wiring or conductive parts" },
  { value: "none", label: "None" },
];

const RAPID_SHUTDOWN_OPTIONS: Option[] = [
  { value: "module-level", label: "Module-level" },
  { value: "array-boundary", label: "Array boundary" },
  { value: "listed-pv-hazard-control", label: "Listed PV hazard control system" },
  { value: "none", label: "None" },
];

const PV_GROUNDING_OPTIONS: Option[] = [
  { value: "two-wire-functional-ground", label: "2-wire, one functional grounded conductor" },
  { value: "bipolar-functional-ground", label: "Bipolar, functional ground reference" },
  { value: "not-isolated", label: "Not isolated from a grounded inverter output" },
  { value: "ungrounded", label: "Ungrounded" },
  { value: "solidly-grounded", label: "Solidly grounded" },
  { value: "other-listed", label: "Other method, listed equipment" },
];

const BATTERY_LOCATION_OPTIONS: Option[] = BATTERY_LOCATIONS.map((v) => ({ value: v, label: v.replace(/-/g, " ") }));

export type FieldSpec = Pick<FieldControlProps, "path" | "label" | "type" | "options" | "required"> & { unit?: string; help?: string; wide?: boolean };

export const PROJECT_FIELDS: FieldSpec[] = [
  { path: "name", label: "Project name", type: "text", required: true },
  { path: "client", label: "Client", type: "text" },
  { path: "systemKind", label: "System kind", type: "select", options: SYSTEM_KIND_OPTIONS, required: true },
  {
    path: "daysOfAutonomy",
    label: "Days of autonomy",
    unit: "days",
    type: "number",
    help: "Days the batteries carry the loads without sun; two to three by common practice for stand-alone systems.",
  },
  {
    path: "rapidShutdownMethod",
    label: "Rapid-shutdown method",
    type: "select",
    options: RAPID_SHUTDOWN_OPTIONS,
    help: "Needed where PV circuits run on or in a building (690.12).",
  },
  {
    path: "rapidShutdownInsideBoundary",
    label: "Inside the array boundary",
    type: "select",
    options: INSIDE_BOUNDARY_OPTIONS,
    help: "How a building-mounted array's conductors inside the boundary are controlled (690.12(B)(2)).",
  },
  {
    path: "pvGroundingConfiguration",
    label: "PV system grounding",
    type: "select",
    options: PV_GROUNDING_OPTIONS,
    help: "The 690.41(A) configuration of the PV DC circuits. Every one but a small solidly grounded array off buildings needs listed DC ground-fault protection (690.41(B)).",
  },
];

export const SITE_FIELDS: FieldSpec[] = [
  { path: "site.address", label: "Site address", type: "text", wide: true },
  {
    path: "site.occupancy",
    label: "Occupancy",
    type: "select",
    options: OCCUPANCY_OPTIONS,
    required: true,
    help: "One- and two-family dwellings limit PV system voltage to 600 V (690.7).",
  },
  { path: "site.mounting", label: "Mounting", type: "select", options: MOUNTING_OPTIONS, required: true },
  { path: "site.rackingProduct", label: "Racking product", type: "text", help: "Make and model of the racking or mounting system, printed in the packet's structural block." },
  { path: "site.rackingListing", label: "Racking listing", type: "text", help: "The racking's listing, e.g. UL 2703 (mounting and bonding)." },
  {
    path: "site.roofClearanceIn",
    label: "Roof clearance of raceways",
    unit: "in",
    type: "number",
    help: "Height of PV raceways above the roof surface, for the rooftop temperature adder (Table 310.15(B)(2) in 2020/2023; 310.15(B)(3)(c) in 2017).",
  },
  {
    path: "site.designLowTempC",
    label: "Design low temperature",
    unit: "°C",
    type: "number",
    help: "Usually the extreme annual mean minimum design dry-bulb temperature for the nearest weather station in a climate-data handbook (690.7(A) informational note). Allowed −60 … +70 °C.",
  },
  {
    path: "site.designLowTempSource",
    label: "Source of the low temperature",
    type: "text",
    help: "Name the station, the table and its edition, so the reviewer can trace the figure.",
  },
  {
    path: "site.designHighTempC",
    label: "Design high temperature",
    unit: "°C",
    type: "number",
    help: "Usually the 2 % annual design dry-bulb temperature for the nearest station from the same handbook (common practice for ampacity correction and the MPPT window). Allowed −60 … +70 °C.",
  },
  { path: "site.designHighTempSource", label: "Source of the high temperature", type: "text", help: "Station, table, edition." },
  {
    path: "site.moduleTempRiseC",
    label: "Module temperature rise",
    unit: "°C",
    type: "number",
    help: "Cell temperature above ambient at the design high; about 30 °C for rack and roof mounts by common practice, used when left empty.",
  },
  {
    path: "site.sunHoursPerDay",
    label: "Sun hours per day",
    unit: "h",
    type: "number",
    help: "Peak sun hours of the worst month the system must serve (common practice), from a solar-resource map or dataset for the site.",
  },
  {
    path: "site.batteryLocation",
    label: "Battery location",
    type: "select",
    options: BATTERY_LOCATION_OPTIONS,
    help: "Required when the design has a battery: it drives the storage siting limits (IRC R328 / R330, NFPA 855 chapter 15). Never a habitable room.",
  },
  { path: "site.batteryLocationNote", label: "Battery location note", type: "text" },
  {
    path: "site.batterySpacingIn",
    label: "Spacing between storage units",
    unit: "in",
    type: "number",
    help: "3 ft (36 in) unless large-scale fire testing supports less.",
  },
  { path: "site.hasSmokeOrHeatDetection", label: "Smoke or heat detection", type: "tri-state" },
  { path: "site.hasVehicleImpactProtection", label: "Vehicle-impact protection", type: "tri-state", help: "Needed where storage stands in a garage." },
  {
    path: "site.pvOnlyBuilding",
    label: "PV circuits enter a PV-only building",
    type: "tri-state",
    help: "Yes only where the building the ground array's circuits enter houses PV equipment and nothing else (690.12 exception).",
  },
];

const ELECTRODE_LABELS: Record<(typeof GROUNDING_ELECTRODE_KINDS)[number], string> = {
  "ground-rod": "Ground rod",
  "concrete-encased": "Concrete-encased electrode",
  "ground-ring": "Ground ring",
  "metal-water-pipe": "Metal underground water pipe",
  "building-steel": "Building steel",
  plate: "Plate electrode",
  "existing-building-system": "The building's existing electrode system",
};

/**
 * The grounding electrode system and the bond. The bond's options are the record's inverters, generators and AC
 * panels, filled in by the section from the live tag lists.
 */
export const GROUNDING_FIELDS: FieldSpec[] = [
  {
    path: "grounding.electrodes",
    label: "Grounding electrodes",
    type: "multi",
    options: GROUNDING_ELECTRODE_KINDS.map((k) => ({ value: k, label: ELECTRODE_LABELS[k] })),
    help: "Every electrode present at the building, bonded together (250.50). Hold Ctrl or ⌘ to choose several.",
  },
  {
    path: "grounding.gecSize",
    label: "Grounding electrode conductor",
    type: "select",
    options: CONDUCTOR_SIZES.map((s) => ({ value: s, label: Number(s) >= 250 ? `${s} kcmil` : `${s} AWG` })),
    help: "At least the largest DC conductor (250.166) and the Table 250.66 size for the largest AC supply conductor; rods alone need no more than 6 AWG Cu.",
  },
  {
    path: "grounding.gecMaterial",
    label: "GEC material",
    type: "select",
    options: [
      { value: "cu", label: "Cu" },
      { value: "al", label: "Al" },
    ],
    required: true,
  },
  {
    path: "grounding.neutralGroundBondTag",
    label: "Neutral-to-ground bond at",
    type: "select",
    help: "The one inverter, generator or panel where neutral and ground are joined (250.30, 250.6); every other unit floats its neutral.",
  },
];
