/**
 * The columns of the editor's grids: what each cell edits, its label and its
 * pick-list. The same labels name a field in every message (record-labels).
 */
import { CIRCUIT_KINDS, CONDUCTOR_SIZES } from "@/lib/schemas/project-record";
import { CIRCUIT_KIND_TITLES, conductorSizeText } from "@/lib/schemas/vocabulary";
import { INSULATION_TYPES, RACEWAY_TYPES } from "@/lib/compliance/tables/wiring-types";
import type { GridColumn } from "./editable-grid";
import type { Option } from "./field-control";
import type { RecordTags } from "./use-record-tags";

export const PV_FED = ["charge-controller", "inverter", "inverter-charger", "hybrid-inverter"] as const;
const SIZE_OPTIONS: Option[] = CONDUCTOR_SIZES.map((s) => ({ value: s, label: conductorSizeText(s) }));
const KIND_OPTIONS: Option[] = CIRCUIT_KINDS.map((k) => ({ value: k, label: CIRCUIT_KIND_TITLES[k] }));
const INSULATION_OPTIONS: Option[] = INSULATION_TYPES.map((t) => ({ value: t.code, label: t.label }));
const RACEWAY_OPTIONS: Option[] = RACEWAY_TYPES.map((t) => ({ value: t.code, label: t.label }));
const MATERIAL_OPTIONS: Option[] = [
  { value: "cu", label: "Cu" },
  { value: "al", label: "Al" },
];
const TEMP_OPTIONS: Option[] = ["60", "75", "90"].map((t) => ({ value: t, label: `${t} °C` }));
const PHASE_OPTIONS: Option[] = [
  { value: "1", label: "1 (single/split)" },
  { value: "3", label: "3" },
];

export type TagLists = Pick<RecordTags, "byKinds" | "mpptInputsOf" | "arrays" | "equipmentAndArrays" | "arrayOptions">;

export function arrayColumns(tags: TagLists): GridColumn[] {
  return [
    { key: "tag", header: "Tag", type: "text", width: "w-20" },
    { key: "moduleTag", header: "Module", type: "select", options: tags.byKinds(["pv-module"]), required: true, width: "w-36" },
    { key: "modulesInSeries", header: "Modules in series", type: "integer", width: "w-20" },
    { key: "stringsInParallel", header: "Strings in parallel", type: "integer", width: "w-20" },
    { key: "feedsTag", header: "Feeds", type: "select", options: tags.byKinds(PV_FED), required: true, width: "w-44" },
    {
      key: "mpptInputId",
      header: "MPPT input",
      type: "select",
      width: "w-24",
      options: (i) => tags.mpptInputsOf(tags.arrays[i]?.feedsTag),
    },
  ];
}

export function circuitColumns(tags: TagLists): GridColumn[] {
  return [
    { key: "tag", header: "Tag", type: "text", width: "w-14" },
    { key: "fromTag", header: "From", type: "select", options: tags.equipmentAndArrays, required: true, width: "w-36" },
    { key: "toTag", header: "To", type: "select", options: tags.equipmentAndArrays, required: true, width: "w-36" },
    { key: "kind", header: "Kind", type: "select", options: KIND_OPTIONS, required: true, width: "w-28" },
    { key: "arrayTag", header: "Array", type: "select", options: tags.arrayOptions, width: "w-24" },
    { key: "stringsCarried", header: "Strings", type: "integer", width: "w-14" },
    { key: "material", header: "Material", type: "select", options: MATERIAL_OPTIONS, required: true, width: "w-16" },
    { key: "size", header: "Size", type: "select", options: SIZE_OPTIONS, width: "w-20" },
    { key: "parallelSets", header: "Sets", type: "integer", width: "w-12" },
    { key: "insulation", header: "Insulation", type: "select", options: INSULATION_OPTIONS, width: "w-28" },
    { key: "insulationTempRatingC", header: "Insulation rating", type: "number-select", options: TEMP_OPTIONS, width: "w-20" },
    { key: "currentCarryingConductors", header: "CCCs in raceway", type: "integer", width: "w-14" },
    { key: "racewayType", header: "Raceway", type: "select", options: RACEWAY_OPTIONS, width: "w-28" },
    { key: "racewaySize", header: "Raceway size", type: "text", width: "w-16" },
    { key: "lengthFt", header: "One-way length", unit: "ft", type: "number", width: "w-14" },
    { key: "ambientTempC", header: "Ambient", unit: "°C", type: "number", width: "w-16" },
    { key: "onRooftop", header: "Rooftop", type: "checkbox", width: "w-10" },
    { key: "entersBuilding", header: "Enters a building", type: "tri-state", width: "w-16" },
    { key: "readilyAccessible", header: "Readily accessible", type: "tri-state", width: "w-16" },
    { key: "guarded", header: "Guarded", type: "tri-state", width: "w-16" },
    { key: "fineStranded", header: "Fine-stranded", type: "tri-state", width: "w-16" },
    { key: "fineStrandTerminalsIdentified", header: "Terminals for fine strand", type: "tri-state", width: "w-16" },
    { key: "roofClearanceIn", header: "Roof clearance", unit: "in", type: "number", width: "w-16" },
    { key: "terminalTempRatingC", header: "Terminal rating", type: "number-select", options: TEMP_OPTIONS, width: "w-20" },
    { key: "ocpdTag", header: "Protected by", type: "select", options: tags.byKinds(["fuse", "breaker"]), width: "w-24" },
    { key: "disconnectTags", header: "Disconnects", type: "tags", width: "w-28" },
    { key: "egcSize", header: "EGC", type: "select", options: SIZE_OPTIONS, width: "w-24" },
    { key: "egcMaterial", header: "EGC material", type: "select", options: MATERIAL_OPTIONS, required: true, width: "w-16" },
    { key: "loadCurrentA", header: "Load current", unit: "A", type: "number", width: "w-16" },
    { key: "designCurrentA", header: "Design current", unit: "A", type: "number", width: "w-16" },
    { key: "nominalVoltageV", header: "Nominal voltage", unit: "V", type: "number", width: "w-16" },
    { key: "phases", header: "Phases (AC)", type: "number-select", options: PHASE_OPTIONS, width: "w-20" },
    { key: "feedsOtherBuilding", header: "Enters another building (AC)", type: "tri-state", width: "w-16" },
    { key: "buildingDisconnectTag", header: "Building disconnect", type: "select", options: tags.byKinds(["disconnect", "breaker", "ac-panel"]), width: "w-24" },
  ];
}

export const LOAD_COLUMNS: GridColumn[] = [
  { key: "name", header: "Load", type: "text", width: "w-36" },
  { key: "watts", header: "Power", unit: "W", type: "number", width: "w-16" },
  { key: "quantity", header: "Qty", type: "integer", width: "w-14" },
  { key: "hoursPerDay", header: "Hours a day", unit: "h", type: "number", width: "w-16" },
  { key: "dutyPct", header: "Duty", unit: "%", type: "number", width: "w-14", placeholder: "100" },
  { key: "daysPerWeek", header: "Days a week", type: "integer", width: "w-12", placeholder: "7" },
  { key: "surgeW", header: "Surge", unit: "W", type: "number", width: "w-16" },
  {
    key: "voltageV",
    header: "Voltage",
    type: "number-select",
    options: [
      { value: "120", label: "120 V" },
      { value: "240", label: "240 V" },
    ],
    required: true,
    width: "w-20",
  },
  { key: "simultaneous", header: "Runs with others", type: "checkbox", width: "w-10" },
];

/** The circuit columns a designer reads across a row on one screen; the rest open in the row's detail. */
export const CIRCUIT_PRIMARY_KEYS = ["tag", "fromTag", "toTag", "kind", "size", "lengthFt", "ocpdTag"] as const;

const NO_TAGS: TagLists = { byKinds: () => [], mpptInputsOf: () => [], arrays: [], equipmentAndArrays: [], arrayOptions: [] };

/** Labels of every grid column by key, for messages that name a field. */
export const CIRCUIT_COLUMN_LABELS: Record<string, string> = Object.fromEntries(circuitColumns(NO_TAGS).map((c) => [c.key, c.header]));
export const ARRAY_COLUMN_LABELS: Record<string, string> = Object.fromEntries(arrayColumns(NO_TAGS).map((c) => [c.key, c.header]));
