import type { EventKind } from "./submission";

export interface SummaryInput {
  /** Where the application stands (voided entries already ignored). */
  status: EventKind;
  /** Its standing events in recorded order. */
  events: readonly { kind: EventKind; occurredOn: string }[];
}

export interface JurisdictionSummary {
  submissions: number;
  /** Applications not finaled, cancelled or expired, by where they stand. */
  openByStatus: { status: EventKind; count: number }[];
  /** Median calendar days from the first submission to the permit, over permitted applications; null when none. */
  medianDaysToPermit: number | null;
  permitted: number;
  /** Share of decided applications approved or permitted with no corrections asked; null when none decided. */
  firstTimeApprovalRate: number | null;
  decided: number;
  /** Corrections letters per application (every application counts). */
  correctionsPerSubmission: number | null;
}

const CLOSED: readonly EventKind[] = ["finaled", "cancelled", "expired"];

function days(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

function median(values: number[]): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/**
 * How a jurisdiction treats the office's applications: what is open and
 * where, how long a permit takes (calendar days, weekends included), how
 * often the first submittal is approved as sent, and how many corrections
 * letters an application draws. Pure, so the figures are tested directly.
 */
export function summariseJurisdiction(rows: readonly SummaryInput[]): JurisdictionSummary {
  const open = new Map<EventKind, number>();
  for (const r of rows) if (!CLOSED.includes(r.status)) open.set(r.status, (open.get(r.status) ?? 0) + 1);
  const toPermit: number[] = [];
  let decided = 0;
  let firstTime = 0;
  let letters = 0;
  for (const r of rows) {
    const submitted = r.events.find((e) => e.kind === "submitted");
    const permit = r.events.find((e) => e.kind === "permit-issued");
    if (submitted && permit) toPermit.push(days(submitted.occurredOn, permit.occurredOn));
    const corrections = r.events.filter((e) => e.kind === "corrections-requested").length;
    letters += corrections;
    const approved = r.events.some((e) => e.kind === "approved" || e.kind === "permit-issued");
    if (approved || corrections > 0) {
      decided += 1;
      if (approved && corrections === 0) firstTime += 1;
    }
  }
  return {
    submissions: rows.length,
    openByStatus: [...open.entries()].map(([status, count]) => ({ status, count })),
    medianDaysToPermit: median(toPermit),
    permitted: toPermit.length,
    firstTimeApprovalRate: decided ? firstTime / decided : null,
    decided,
    correctionsPerSubmission: rows.length ? letters / rows.length : null,
  };
}
