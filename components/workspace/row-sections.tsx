"use client";

import { useMemo } from "react";
import { EditableGrid, nextTag } from "./editable-grid";
import { arrayColumns, circuitColumns, LOAD_COLUMNS, PV_FED } from "./grid-columns";

export { CircuitsSection } from "./circuits-section";
import { useReferenceGuard } from "./reference-guard";
import { Section } from "./site-section";
import { useRecordTags } from "./use-record-tags";

export { arrayColumns, circuitColumns, LOAD_COLUMNS };

export function ArraysSection() {
  const tags = useRecordTags();
  const arraysGuard = useReferenceGuard("arrays", "array");
  const columns = useMemo(() => arrayColumns(tags), [tags]);
  return (
    <Section id="arrays" title="PV arrays" sheet="A · 4">
      {arraysGuard.dialog}
      <EditableGrid
        name="arrays"
        onCommit={arraysGuard.onCommit}
        onRequestRemove={arraysGuard.onRequestRemove}
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
