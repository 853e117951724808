/** A labelled input whose refusal, when there is one, replaces its hint beside it. */
export function FormField({
  id,
  label,
  hint,
  issue,
  children,
  className,
}: {
  id: string;
  label: string;
  hint?: string;
  issue?: string;
  children: (describedBy: string, invalid: boolean) => React.ReactNode;
  className?: string;
}) {
  const describedBy = `${id}-hint`;
  return (
    <div className={className}>
      <label htmlFor={id} className="field-label block">
        {label}
      </label>
      <div className="mt-1">{children(describedBy, Boolean(issue))}</div>
      <p id={describedBy} className={`mt-1 text-xs ${issue ? "text-signal" : "text-ink-soft"}`}>
        {issue ? `${label} ${issue}.` : (hint ?? "")}
      </p>
    </div>
  );
}
