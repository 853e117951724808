"use client";

import { useMemo } from "react";
import { EditableGrid, nextTag } from "./editable-grid";
import { arrayColumns, circuitColumns, LOAD_COLUMNS, PV_FED } from "./grid-columns";
import { Section } from "./site-section";
import { useRecordTags } from "./use-record-tags";

export { arrayColumns, circuitColumns, LOAD_COLUMNS };

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
