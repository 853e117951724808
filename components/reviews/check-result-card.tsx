import { StatusBadge } from "@/components/ui/status-badge";
import type { ReviewCheck } from "@/lib/services/reviews/view";

function formatValue(value: number | string | boolean): string {
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") return Number.isInteger(value) ? String(value) : value.toFixed(Math.abs(value) < 10 ? 2 : 1);
  return value;
}

/** One check result as the reviewer reads it: status, what it found, the figures, the working and the code. */
export function CheckResultCard({ result, children }: { result: ReviewCheck; children?: React.ReactNode }) {
  const headingId = `check-${result.id.replace(/[^A-Za-z0-9_-]/g, "_")}`;
  return (
    <article aria-labelledby={headingId} className="border-b border-grid px-4 py-4 last:border-b-0" data-check-id={result.id}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h4 id={headingId} className="text-[0.95rem] font-semibold leading-snug">
          {result.title}
          {result.subject && !result.title.includes(result.subject) ? <span className="figure ml-1.5 font-normal text-ink-soft">{result.subject}</span> : null}
        </h4>
        <StatusBadge status={result.status} />
      </div>
      <p className="mt-1.5 max-w-prose text-sm leading-relaxed">{result.message}</p>
      {result.reason && !result.message.includes(result.reason) ? <p className="mt-1 max-w-prose text-sm leading-relaxed text-ink-soft">{result.reason}</p> : null}
      {result.values.length ? (
        // The name column keeps a width of its own, so a long value (a label's wording) wraps beside it instead of running over it.
        <dl className="mt-2 grid grid-cols-[minmax(9rem,2fr)_minmax(0,3fr)] gap-x-6 gap-y-0.5 text-sm sm:max-w-xl">
          {result.values.map((v) => (
            <div key={v.key} className="contents">
              <dt className="text-ink-soft">{v.label}</dt>
              <dd className={typeof v.value === "string" && v.value.length > 16 ? "break-words" : "figure text-right"}>
                {formatValue(v.value)}
                {v.unit ? <span className="ml-1 text-ink-faint">{v.unit}</span> : null}
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
      {result.formula ? (
        <details className="mt-2 text-sm">
          <summary className="cursor-pointer text-ink-soft">Working</summary>
          <p className="mt-1 max-w-prose leading-relaxed">{result.formula}</p>
        </details>
      ) : null}
      <p className="figure mt-2 text-xs text-ink-faint">{result.codeRefs.join(" · ")}</p>
      {children}
    </article>
  );
}
