import type { CheckStatus } from "@/lib/compliance/types";

/**
 * A status is a word and a shape as well as a colour, so it reads for
 * colour-blind users and on grey-scale printouts.
 */
const STATUS_LOOK: Record<CheckStatus, { word: string; shape: string; className: string }> = {
  fail: { word: "Fail", shape: "■", className: "bg-signal text-white border-signal" },
  "needs-input": { word: "Needs input", shape: "◇", className: "bg-query-soft text-query border-query" },
  warning: { word: "Warning", shape: "▲", className: "bg-caution-soft text-caution border-caution" },
  attest: { word: "Attest", shape: "☐", className: "bg-brass-soft text-brass border-brass" },
  pass: { word: "Pass", shape: "●", className: "bg-ok-soft text-ok border-ok" },
  "not-applicable": { word: "Not applicable", shape: "–", className: "bg-sheet text-ink-faint border-rule" },
};

export function statusWord(status: CheckStatus): string {
  return STATUS_LOOK[status].word;
}

export function StatusBadge({ status, compact = false }: { status: CheckStatus; compact?: boolean }) {
  const look = STATUS_LOOK[status];
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
