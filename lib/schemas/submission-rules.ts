import type { ProjectStatus } from "./project-status";
import { EVENT_LABELS, EVENT_KINDS, type EventKind } from "./submission";

/**
 * The order a permit application's events may take, as one table: for the
 * event the application stands at, which events may follow, and why the
 * others may not. The service, the event form (it offers only allowed kinds)
 * and the tests read this table. Imports the event vocabulary only.
 *
 * A fee payment is bookkeeping: it may come at any point of an open
 * application and does not change where the application stands, so the event
 * before it decides what may follow. Every other kind is a "standing" kind.
 */

export type StandingKind = Exclude<EventKind, "fee-paid">;
export const STANDING_KINDS = EVENT_KINDS.filter((k): k is StandingKind => k !== "fee-paid");

/** After these the application is closed; a new one starts with a new submission. */
export const CLOSED_KINDS: readonly StandingKind[] = ["finaled", "cancelled", "expired"];

const PLAN_REVIEW_NEXT: readonly EventKind[] = ["in-plan-review", "on-hold", "corrections-requested", "approved", "permit-issued", "fee-paid", "cancelled", "expired"];
const PERMITTED_NEXT: readonly EventKind[] = ["inspection-scheduled", "inspection-passed", "inspection-failed", "fee-paid", "cancelled", "expired"];

/** Allowed followers of each standing kind. */
export const NEXT_EVENTS: Record<StandingKind, readonly EventKind[]> = {
  submitted: PLAN_REVIEW_NEXT,
  "in-plan-review": PLAN_REVIEW_NEXT.filter((k) => k !== "in-plan-review"),
  "on-hold": PLAN_REVIEW_NEXT.filter((k) => k !== "on-hold"),
  // The AHJ waits for the designer's answer; it may also lapse or be withdrawn.
  "corrections-requested": ["resubmitted", "on-hold", "fee-paid", "cancelled", "expired"],
  resubmitted: PLAN_REVIEW_NEXT,
  // Plan approval: the permit follows (often after the fee).
  approved: ["permit-issued", "fee-paid", "cancelled", "expired"],
  "permit-issued": PERMITTED_NEXT,
  "inspection-scheduled": PERMITTED_NEXT,
  // A passed inspection may be the rough one: others follow, and a passed final allows the final sign-off.
  "inspection-passed": [...PERMITTED_NEXT, "finaled"],
  "inspection-failed": PERMITTED_NEXT,
  finaled: [],
  cancelled: [],
  expired: [],
};

export type EventVerdict = { allowed: true } | { allowed: false; reason: string };

const BEFORE_PERMIT: readonly StandingKind[] = ["submitted", "in-plan-review", "on-hold", "corrections-requested", "resubmitted", "approved"];

/** Whether `next` may follow an application standing at `standing`; a refusal says why in the office's words. */
export function nextEventVerdict(standing: StandingKind, next: EventKind): EventVerdict {
  if (NEXT_EVENTS[standing].includes(next)) return { allowed: true };
  const at = EVENT_LABELS[standing].toLowerCase();
  const what = EVENT_LABELS[next];
  if (CLOSED_KINDS.includes(standing)) return { allowed: false, reason: `The application is ${at}; nothing follows it. Start a new submission to continue.` };
  if (next === "submitted") return { allowed: false, reason: "An application is submitted once; after corrections record Resubmitted." };
  if (next === "resubmitted") return { allowed: false, reason: "Resubmitted answers corrections; record Corrections requested first." };
  if (BEFORE_PERMIT.includes(standing) && (next.startsWith("inspection-") || next === "finaled")) {
    return { allowed: false, reason: `${what} cannot come before the permit is issued (the application is ${at}).` };
  }
  if (next === "finaled") return { allowed: false, reason: "Finaled follows a passed final inspection; record the inspection first." };
  if (standing === "corrections-requested") return { allowed: false, reason: `${what} cannot follow Corrections requested; the AHJ waits for the resubmission.` };
  if (!BEFORE_PERMIT.includes(standing) && (PLAN_REVIEW_NEXT.includes(next) || next === "on-hold")) {
    return { allowed: false, reason: `${what} belongs to plan review; the permit is already issued.` };
  }
  if (standing === next) return { allowed: false, reason: `The application is already ${at}.` };
  return { allowed: false, reason: `${what} cannot follow ${EVENT_LABELS[standing]}.` };
}

/** Where an application stands after these events (in order, voided ones already removed): the latest that is not a fee payment. */
export function standingKind(kinds: readonly EventKind[]): StandingKind | null {
  for (let i = kinds.length - 1; i >= 0; i--) {
    const k = kinds[i]!;
    if (k !== "fee-paid") return k;
  }
  return null;
}

/** The event kinds the office may record next; what the event form offers. */
export function allowedNextKinds(kinds: readonly EventKind[]): EventKind[] {
  const standing = standingKind(kinds);
  if (!standing) return [];
  return EVENT_KINDS.filter((k) => nextEventVerdict(standing, k).allowed);
}

/**
 * Checks a whole sequence (the events that remain when one is voided): it must
 * open with Submitted and each event must be allowed after those before it.
 * Returns the first refusal, with its position.
 */
export function sequenceVerdict(kinds: readonly EventKind[]): { allowed: true } | { allowed: false; index: number; reason: string } {
  if (kinds[0] !== "submitted") return { allowed: false, index: 0, reason: "An application opens with Submitted." };
  for (let i = 1; i < kinds.length; i++) {
    const standing = standingKind(kinds.slice(0, i))!;
    const v = nextEventVerdict(standing, kinds[i]!);
    if (!v.allowed) return { allowed: false, index: i, reason: v.reason };
  }
  return { allowed: true };
}

/**
 * The project status an application's events give (voided ones removed), so
 * that each event and each void moves the project through one mapping. A
 * passed final inspection (or fire final) makes the project inspected; a
 * passed rough inspection leaves it permitted.
 */
export function projectStatusForEvents(events: readonly { kind: EventKind; data: Record<string, unknown> }[]): ProjectStatus | null {
  const standing = standingKind(events.map((e) => e.kind));
  switch (standing) {
    case null:
      return null;
    case "submitted":
    case "in-plan-review":
    case "on-hold":
    case "resubmitted":
    case "approved":
      return "submitted";
    case "corrections-requested":
      return "corrections";
    case "permit-issued":
    case "inspection-scheduled":
    case "inspection-failed":
    case "inspection-passed":
      return events.some((e) => e.kind === "inspection-passed" && (e.data.inspectionKind === "final" || e.data.inspectionKind === "fire-final")) ? "inspected" : "permitted";
    case "finaled":
      return "closed";
    case "cancelled":
      return "cancelled";
    case "expired":
      return "expired";
  }
}
