export interface ChecklistItem {
  label: string;
  tag?: string;
  detail?: string;
  attached: boolean;
}

/**
 * What the jurisdiction asks to see with the packet, item by item, as the
 * submittal-completeness check counts it. A word and a shape as well as colour.
 */
export function SubmittalChecklist({ jurisdiction, items, note }: { jurisdiction: string; items: ChecklistItem[]; note?: string }) {
  const missing = items.filter((i) => !i.attached).length;
  const summary = note ?? (items.length === 0 ? "" : missing === 0 ? `All ${items.length} attached.` : `${items.length - missing} of ${items.length} attached; ${missing} missing.`);
  return (
    <section aria-labelledby="submittal-checklist-title" className="sheet">
      <header className="border-b border-rule px-4 py-2">
        <h2 id="submittal-checklist-title" className="text-sm font-semibold">
          Documents {jurisdiction} asks for
        </h2>
        <p className="text-xs text-ink-soft">{summary}</p>
      </header>
      {items.length === 0 ? (
        <p className="px-4 py-3 text-sm text-ink-soft">The jurisdiction record names no required documents.</p>
      ) : (
        <ul className="divide-y divide-grid text-sm" aria-label={`Required documents, ${missing} missing`}>
          {items.map((item) => (
            <li key={`${item.label}-${item.tag ?? ""}`} className="flex items-baseline justify-between gap-3 px-4 py-1.5">
              <span>
                <span>{item.tag ? <>{item.label} <span className="figure">{item.tag}</span></> : item.label}</span>
                {item.detail ? <span className="ml-2 text-xs text-ink-soft">{item.detail}</span> : null}
              </span>
              {item.attached ? (
                <span className="whitespace-nowrap text-xs font-semibold text-ok">
                  <span aria-hidden="true">● </span>Attached
                </span>
              ) : (
                <span className="whitespace-nowrap text-xs font-semibold text-signal">
                  <span aria-hidden="true">■ </span>Missing
                </span>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
