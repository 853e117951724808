import type { EventKind } from "./submission";

/**
 * The office queue's arithmetic, pure so the table, the CSV and the tests
 * agree. Days are calendar days between ISO dates (YYYY-MM-DD), counted in
 * UTC like every date the product stores; weekends count, as the typical
 * review days a jurisdiction publishes are calendar days (common practice;
 * where an AHJ counts business days, the office records its typical days
 * accordingly).
 */

/** A permit expiring within this many days, with no final passed, is flagged (common practice: a month's notice to book the final). */
export const EXPIRY_WARNING_DAYS = 30;

/** Statuses during which the AHJ holds the application and review days run. */
const AHJ_REVIEWING: readonly EventKind[] = ["submitted", "in-plan-review", "on-hold", "resubmitted"];

export interface QueueEvent {
  kind: EventKind;
  occurredOn: string;
  data: Record<string, unknown>;
}

export interface QueueFigures {
  /** Calendar days since the latest event that has happened (a scheduled inspection ahead does not count). */
  daysSinceLastEvent: number | null;
  /** Days the AHJ has held the application since it was last (re)submitted, while it reviews it; null otherwise. */
  daysWaiting: number | null;
  overdue: boolean;
  permitExpiresOn: string | null;
  expiringSoon: boolean;
  nextAction: string;
  /** Who holds the next action: the AHJ, the office, the designer, the installer, or no one. */
  holder: "AHJ" | "office" | "designer" | "installer" | "—";
}

export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

/** Figures for one submission from its events (voided ones already removed, in recorded order) and where it stands. */
export function queueFigures(events: readonly QueueEvent[], status: EventKind, typicalReviewDays: number | null, today: string): QueueFigures {
  const happened = events.filter((e) => e.occurredOn <= today);
  const last = happened.map((e) => e.occurredOn).sort().at(-1) ?? null;
  const daysSinceLastEvent = last ? daysBetween(last, today) : null;
  const sentOn = [...events].reverse().find((e) => e.kind === "submitted" || e.kind === "resubmitted")?.occurredOn ?? null;
  const daysWaiting = AHJ_REVIEWING.includes(status) && sentOn ? daysBetween(sentOn, today) : null;
  const overdue = daysWaiting !== null && typicalReviewDays !== null && daysWaiting > typicalReviewDays;
  const permit = [...events].reverse().find((e) => e.kind === "permit-issued");
  const permitExpiresOn = typeof permit?.data.expiresOn === "string" ? permit.data.expiresOn : null;
  const finalPassed = events.some((e) => e.kind === "finaled" || (e.kind === "inspection-passed" && (e.data.inspectionKind === "final" || e.data.inspectionKind === "fire-final")));
  const closed = status === "finaled" || status === "cancelled" || status === "expired";
  const expiringSoon = !closed && !finalPassed && permitExpiresOn !== null && daysBetween(today, permitExpiresOn) <= EXPIRY_WARNING_DAYS;
  const [nextAction, holder] = NEXT[status];
  return { daysSinceLastEvent, daysWaiting, overdue, permitExpiresOn, expiringSoon, nextAction, holder };
}

const NEXT: Record<EventKind, [string, QueueFigures["holder"]]> = {
  submitted: ["Plan review", "AHJ"],
  "in-plan-review": ["Plan review decision", "AHJ"],
  "on-hold": ["Answer the AHJ's hold", "office"],
  "corrections-requested": ["Revise and resubmit", "designer"],
  resubmitted: ["Plan review of the resubmission", "AHJ"],
  approved: ["Pay fees, collect the permit", "office"],
  "permit-issued": ["Install, then book inspections", "installer"],
  "fee-paid": ["—", "—"],
  "inspection-scheduled": ["Inspection", "AHJ"],
  "inspection-passed": ["Book the next inspection or final", "office"],
  "inspection-failed": ["Correct on site, book a re-inspection", "installer"],
  finaled: ["—", "—"],
  expired: ["—", "—"],
  cancelled: ["—", "—"],
};

/**
 * One CSV cell. A cell starting with = + - @ (or a tab or carriage return)
 * would be read as a formula by a spreadsheet, so it is prefixed with a
 * single quote (OWASP, CSV injection); quotes are doubled and the cell quoted
 * when it holds a comma, quote or line break (RFC 4180).
 */
export function csvCell(value: string | number | boolean | null | undefined): string {
  let text = value === null || value === undefined ? "" : String(value);
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(cells: readonly (string | number | boolean | null | undefined)[]): string {
  return cells.map(csvCell).join(",");
}
