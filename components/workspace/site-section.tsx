"use client";

import { FormField } from "./field-control";
import { GROUNDING_FIELDS, PROJECT_FIELDS, SITE_FIELDS } from "./field-specs";
import { useRecordTags } from "./use-record-tags";

export { GROUNDING_FIELDS, PROJECT_FIELDS, SITE_FIELDS };

const BOND_KINDS = ["inverter", "inverter-charger", "hybrid-inverter", "generator", "ac-panel"] as const;

export function Section({ id, title, sheet, children, aside }: { id: string; title: string; sheet: string; children: React.ReactNode; aside?: React.ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="sheet scroll-mt-4">
      <header className="flex items-baseline justify-between gap-2 border-b border-rule px-4 py-2">
        <h2 id={`${id}-heading`} className="text-base font-semibold">
          {title}
        </h2>
        <span className="flex items-center gap-3">
          {aside}
          <span className="figure text-xs text-ink-faint">{sheet}</span>
        </span>
      </header>
      <div className="px-4 py-4">{children}</div>
    </section>
  );
}

export function ProjectSection() {
  return (
    <Section id="project" title="Project and system" sheet="A · 1">
      <div className="grid gap-4 sm:grid-cols-2">
        {PROJECT_FIELDS.map((f) => (
          <FormField key={f.path} {...f} />
        ))}
      </div>
    </Section>
  );
}

export function SiteSection({ jurisdiction }: { jurisdiction: { name: string; necEdition: string } }) {
  return (
    <Section id="site" title="Site and jurisdiction" sheet="A · 2">
      <p className="mb-4 text-sm">
        <span className="field-label mr-2">Jurisdiction</span>
        <span className="font-medium">{jurisdiction.name}</span>
        <span className="figure ml-2 text-ink-soft">NEC {jurisdiction.necEdition}</span>
        <span className="ml-2 text-xs text-ink-faint">— the permit office keeps the jurisdiction record; its edition sets the code references.</span>
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        {SITE_FIELDS.map((f) => (
          <FormField key={f.path} {...f} />
        ))}
      </div>
    </Section>
  );
}

export function GroundingSection() {
  const tags = useRecordTags();
  return (
    <Section id="grounding" title="Grounding and bonding" sheet="A · 7">
      <div className="grid gap-4 sm:grid-cols-2">
        {GROUNDING_FIELDS.map((f) => (
          <FormField key={f.path} {...f} options={f.path === "grounding.neutralGroundBondTag" ? tags.byKinds(BOND_KINDS) : f.options} />
        ))}
      </div>
    </Section>
  );
}
