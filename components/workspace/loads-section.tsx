"use client";

import { LoadsChart } from "@/components/loads/loads-chart";
import { useLive } from "./live-checks";
import { LoadsGrid } from "./row-sections";
import { Section } from "./site-section";

function LoadFigures() {
  const { record } = useLive();
  if (!record) return <p className="mt-4 text-sm text-ink-soft">The figures appear once the record can be read.</p>;
  return <LoadsChart record={record} className="mt-4" />;
}

export function LoadsSection() {
  return (
    <Section id="loads" title="Loads and autonomy" sheet="A · 6">
      <LoadsGrid />
      <LoadFigures />
    </Section>
  );
}
