"use client";

import { OneLineDiagram } from "@/components/diagram/one-line-diagram";
import { focusRecordPaths } from "./focus-path";
import { useLive } from "./live-checks";
import { Section } from "./site-section";

/** Focuses the row a chosen box or wire stands for. */
function focusTag(tag: string) {
  for (const list of ["equipment", "arrays", "circuits"]) {
    const inputs = document.querySelectorAll<HTMLInputElement>(`[name^="${list}."][name$=".tag"]`);
    for (const input of inputs) {
      if (input.value === tag) {
        focusRecordPaths([input.name]);
        return;
      }
    }
  }
}

export function DiagramSection() {
  const { record } = useLive();
  return (
    <Section id="diagram" title="One-line diagram" sheet="E · 1">
      {record ? <OneLineDiagram record={record} onSelect={focusTag} /> : <p className="text-sm text-ink-soft">The diagram appears once the record can be read.</p>}
    </Section>
  );
}
