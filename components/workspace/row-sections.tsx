"use client";

import { useMemo } from "react";
import { CIRCUIT_KINDS, CONDUCTOR_SIZES } from "@/lib/schemas/project-record";
import type { Option } from "./field-control";
import { EditableGrid, nextTag, type GridColumn } from "./editable-grid";
import { Section } from "./site-section";
import { useRecordTags, type RecordTags } from "./use-record-tags";

const PV_FED = ["charge-controller", "inverter", "inverter-charger", "hybrid-inverter"] as const;
const SIZE_OPTIONS: Option[] = CONDUCTOR_SIZES.map((s) => ({ value: s, label: Number(s) >= 250 ? `${s} kcmil` : `${s} AWG` }));
const KIND_OPTIONS: Option[] = CIRCUIT_KINDS.map((k) => ({ value: k, label: k.replace(/-/g, " ") }));
const MATERIAL_OPTIONS: Option[] = [
  { value: "cu", label: "Cu" },
  { value: "al", label: "Al" },
];
const TEMP_OPTIONS: Option[] = ["60", "75", "90"].map((t) => ({ value: t, label: `${t} °C` }));
const PHASE_OPTIONS: Option[] = [
  { value: "1", label: "1 (single/split)" },
  { value: "3", label: "3" },
];

type TagLists = Pick<RecordTags, "byKinds" | "mpptInputsOf" | "arrays" | "equipmentAndArrays" | "arrayOptions">;

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

export function ArraysSection() {
  const tags = useRecordTags();
  const columns = useMemo(() => arrayColumns(tags), [tags]);
  return (
    <Section id="arrays" title="PV arrays" sheet="A · 4">
      <EditableGrid
        name="arrays"
        label="PV arrays"
        noun="array"
        columns={columns}
        newRow={() => ({
          tag: nextTag("PV", tags.all),
          moduleTag: tags.byKinds(["pv-module"])[0]?.value ?? "",
          modulesInSeries: 1,
          stringsInParallel: 1,
          feedsTag: tags.byKinds(PV_FED)[0]?.value ?? "",
        })}
        duplicateRow={(row) => ({ ...row, tag: nextTag("PV", tags.all) })}
      />
    </Section>
  );
}

export function circuitColumns(tags: TagLists): GridColumn[] {
  return [
    { key: "tag", header: "Tag", type: "text", width: "w-16" },
    { key: "fromTag", header: "From", type: "select", options: tags.equipmentAndArrays, required: true, width: "w-36" },
    { key: "toTag", header: "To", type: "select", options: tags.equipmentAndArrays, required: true, width: "w-36" },
    { key: "kind", header: "Kind", type: "select", options: KIND_OPTIONS, required: true, width: "w-36" },
    { key: "arrayTag", header: "Array", type: "select", options: tags.arrayOptions, width: "w-24" },
    { key: "stringsCarried", header: "Strings", type: "integer", width: "w-14" },
    { key: "material", header: "Material", type: "select", options: MATERIAL_OPTIONS, required: true, width: "w-16" },
    { key: "size", header: "Size", type: "select", options: SIZE_OPTIONS, width: "w-24" },
    { key: "parallelSets", header: "Sets", type: "integer", width: "w-12" },
    { key: "insulation", header: "Insulation", type: "text", width: "w-24" },
    { key: "insulationTempRatingC", header: "Insulation rating", type: "number-select", options: TEMP_OPTIONS, width: "w-20" },
    { key: "currentCarryingConductors", header: "CCCs in raceway", type: "integer", width: "w-14" },
    { key: "racewayType", header: "Raceway", type: "text", width: "w-28" },
    { key: "racewaySize", header: "Raceway size", type: "text", width: "w-16" },
    { key: "lengthFt", header: "One-way length", unit: "ft", type: "number", width: "w-20" },
    { key: "ambientTempC", header: "Ambient", unit: "°C", type: "number", width: "w-16" },
    { key: "onRooftop", header: "Rooftop", type: "checkbox", width: "w-10" },
    { key: "roofClearanceIn", header: "Roof clearance", unit: "in", type: "number", width: "w-16" },
    { key: "terminalTempRatingC", header: "Terminal rating", type: "number-select", options: TEMP_OPTIONS, width: "w-20" },
    { key: "ocpdTag", header: "Protected by", type: "select", options: tags.byKinds(["fuse", "breaker"]), width: "w-28" },
    { key: "disconnectTags", header: "Disconnects", type: "tags", width: "w-28" },
    { key: "egcSize", header: "EGC", type: "select", options: SIZE_OPTIONS, width: "w-24" },
    { key: "egcMaterial", header: "EGC material", type: "select", options: MATERIAL_OPTIONS, required: true, width: "w-16" },
    { key: "loadCurrentA", header: "Load current", unit: "A", type: "number", width: "w-16" },
    { key: "designCurrentA", header: "Design current", unit: "A", type: "number", width: "w-16" },
    { key: "nominalVoltageV", header: "Nominal voltage", unit: "V", type: "number", width: "w-16" },
    { key: "phases", header: "Phases (AC)", type: "number-select", options: PHASE_OPTIONS, width: "w-20" },
  ];
}

export function CircuitsSection() {
  const tags = useRecordTags();
  const columns = useMemo(() => circuitColumns(tags), [tags]);
  return (
    <Section id="circuits" title="Circuits" sheet="A · 5">
      <p className="mb-2 text-xs text-ink-faint">
        One row per circuit, one-way length. Ambient defaults to the design high temperature; the protecting device must be a fuse or
        breaker in the equipment list.
      </p>
      <EditableGrid
        name="circuits"
        label="Circuits"
        noun="circuit"
        columns={columns}
        newRow={() => ({
          tag: nextTag("C", tags.all),
          fromTag: "",
          toTag: "",
          kind: "pv-source",
          material: "cu",
          parallelSets: 1,
          insulation: "",
          racewayType: "",
          racewaySize: "",
          onRooftop: false,
          disconnectTags: [],
          egcMaterial: "cu",
        })}
        duplicateRow={(row) => ({ ...row, tag: nextTag("C", tags.all) })}
      />
    </Section>
  );
}

export const LOAD_COLUMNS: GridColumn[] = [
  { key: "name", header: "Load", type: "text", width: "w-48" },
  { key: "watts", header: "Power", unit: "W", type: "number", width: "w-20" },
  { key: "quantity", header: "Qty", type: "integer", width: "w-14" },
  { key: "hoursPerDay", header: "Hours a day", unit: "h", type: "number", width: "w-16" },
  { key: "surgeW", header: "Surge", unit: "W", type: "number", width: "w-20" },
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

export function LoadsGrid() {
  const columns = LOAD_COLUMNS;
  return (
    <EditableGrid
      name="loads"
      label="Loads"
      noun="load"
      columns={columns}
      newRow={() => ({ name: "", watts: undefined, quantity: 1, hoursPerDay: undefined, voltageV: 120, simultaneous: true })}
      duplicateRow={(row) => ({ ...row, name: `${String(row.name ?? "")} (copy)` })}
    />
  );
}
