import { StateTag } from "@/components/ui/status-badge";
import { describeChange, type ChangeGroup } from "@/lib/record-diff";
import { SYSTEM_KIND_LABELS } from "@/lib/schemas/project-record";
import { isProjectStatus, PROJECT_STATUS_LABELS } from "@/lib/schemas/project-status";


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
  /** Set when the record changed after the latest approval: the approved revision and the delta. */
  drift?: { revisionNumber: number; groups: ChangeGroup[]; changeCount: number } | null;
  /** Reviewer notes still waiting: open ones on the designer, addressed ones on the reviewer. */
  notes?: { open: number; addressed: number };
}) {
  return (
    <header className="sheet mb-3 border-2 border-ink">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-ink px-3 py-2">
        <h1 className="text-xl font-semibold tracking-tight">{p.name}</h1>
        <span className="flex flex-wrap items-center gap-2">
          <StateTag>{isProjectStatus(p.status) ? PROJECT_STATUS_LABELS[p.status] : p.status}</StateTag>
          {p.notes && p.notes.open + p.notes.addressed > 0 ? (
            <span className="text-xs text-ink-soft" data-testid="review-notes-count">
              Review notes: {p.notes.open} open{p.notes.addressed ? `, ${p.notes.addressed} addressed` : ""}
            </span>
          ) : null}
          {p.drift ? (
            <span className="inline-flex items-center whitespace-nowrap rounded-[2px] border border-caution bg-caution-soft px-1.5 py-0.5 text-xs font-semibold text-caution">
              ▲ Changed since approval
            </span>
          ) : null}
        </span>
      </div>
      {p.drift ? (
        <details className="border-b border-ink px-3 py-2 text-sm" aria-label="Changed since approval">
          <summary className="cursor-pointer">
            The record changed after revision {p.drift.revisionNumber} was approved ({p.drift.changeCount} change{p.drift.changeCount === 1 ? "" : "s"}). It is not offered for
            submission or to installers until a new revision is approved.
          </summary>
          <ul className="mt-2 grid gap-1">
            {p.drift.groups.map((g) => (
              <li key={g.group}>
                <p className="font-semibold">{g.group}</p>
                <ul className="figure ml-4 list-disc text-ink-soft">
                  {g.changes.map((c, i) => (
                    <li key={i}>{describeChange(c).slice(g.group.length).replace(/^[: ]+/, "") || describeChange(c)}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        </details>
      ) : null}
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
