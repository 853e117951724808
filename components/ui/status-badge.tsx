import { capitalise, STATUS_WORDS, type CheckStatus } from "@/lib/schemas/vocabulary";

/**
 * A status is a word and a shape as well as a colour, so it reads for
 * colour-blind users and on grey-scale printouts.
 */
const STATUS_LOOK: Record<CheckStatus, { shape: string; className: string }> = {
  fail: { shape: "■", className: "bg-signal text-white border-signal" },
  "needs-input": { shape: "◇", className: "bg-query-soft text-query border-query" },
  warning: { shape: "▲", className: "bg-caution-soft text-caution border-caution" },
  attest: { shape: "☐", className: "bg-brass-soft text-brass border-brass" },
  pass: { shape: "●", className: "bg-ok-soft text-ok border-ok" },
  "not-applicable": { shape: "–", className: "bg-sheet text-ink-faint border-rule" },
};

/** "Needs input": the status as a badge or a heading writes it. */
export function statusWord(status: CheckStatus): string {
  return capitalise(STATUS_WORDS[status]);
}

export function StatusBadge({ status, compact = false }: { status: CheckStatus; compact?: boolean }) {
  const look = { ...STATUS_LOOK[status], word: statusWord(status) };
  return (
    <span
      className={`inline-flex items-center whitespace-nowrap rounded-[2px] border font-semibold ${compact ? "gap-0.5 px-1 text-[11px]" : "gap-1 px-1.5 py-0.5 text-xs"} ${look.className}`}
    >
      <span aria-hidden="true">{look.shape}</span>
      {look.word}
    </span>
  );
}

/** A neutral tag for workflow states (project status, review state, submission event). */
export function StateTag({ children }: { children: React.ReactNode }) {
  return (
    <span className="inline-flex items-center whitespace-nowrap rounded-[2px] border border-rule bg-sheet px-1.5 py-0.5 text-xs font-medium text-ink-soft">
      {children}
    </span>
  );
}
