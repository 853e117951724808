import { StateTag } from "@/components/ui/status-badge";
import { SYSTEM_KIND_LABELS } from "@/lib/schemas/project-record";


function Cell({ label, children, wide }: { label: string; children: React.ReactNode; wide?: boolean }) {
  return (
    <div className={`border-r border-rule px-3 py-1.5 last:border-r-0 ${wide ? "col-span-2" : ""}`}>
      <p className="field-label text-[10px]">{label}</p>
      <div className="text-sm">{children}</div>
    </div>
  );
}

/** The project's title block, as on the sheets of the plan set. */
export function TitleBlock(p: {
  name: string;
  client: string;
  address: string;
  systemKind: string;
  jurisdiction: string;
  necEdition: string;
  status: string;
  version: number;
}) {
  return (
    <header className="sheet mb-3 border-2 border-ink">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-ink px-3 py-2">
        <h1 className="text-xl font-semibold tracking-tight">{p.name}</h1>
        <StateTag>{p.status}</StateTag>
      </div>
      <div className="grid grid-cols-2 sm:grid-cols-6">
        <Cell label="Client">{p.client || "—"}</Cell>
        <Cell label="Site" wide>
          {p.address || "—"}
        </Cell>
        <Cell label="System">{SYSTEM_KIND_LABELS[p.systemKind as keyof typeof SYSTEM_KIND_LABELS] ?? p.systemKind}</Cell>
        <Cell label="Jurisdiction">
          {p.jurisdiction} <span className="figure text-ink-soft">NEC {p.necEdition}</span>
        </Cell>
        <Cell label="Record version">
          <span className="figure">{p.version}</span>
        </Cell>
      </div>
    </header>
  );
}
