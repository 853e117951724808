export function PageHeader({ title, sheet, children }: { title: string; sheet?: string; children?: React.ReactNode }) {
  return (
    <header className="mb-5 flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-2">
      <div>
        {sheet ? <p className="figure text-xs text-ink-faint">{sheet}</p> : null}
        <h1 className="text-xl font-semibold tracking-tight">{title}</h1>
      </div>
      {children ? <div className="flex items-center gap-2">{children}</div> : null}
    </header>
  );
}

export function EmptyState({ children }: { children: React.ReactNode }) {
  return <p className="sheet px-4 py-8 text-center text-sm text-ink-soft">{children}</p>;
}

export function Refusal({ message }: { message: string }) {
  return (
    <div role="alert" className="sheet border-l-4 border-l-signal px-4 py-4 text-sm">
      <p className="font-semibold">Not available to your role</p>
      <p className="mt-1 text-ink-soft">{message}</p>
    </div>
  );
}

/** A label over a value, for the summary panels at the head of a page. */
export function Field({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <p className="field-label">{label}</p>
      <div className="mt-0.5">{children}</div>
    </div>
  );
}
