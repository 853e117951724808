/**
 * The life of a project, as one table. Every service that moves a project's
 * status asks this table first (lib/services/projects/status.ts), so a project
 * cannot jump from design to permitted, or from closed back to review.
 * Imports nothing: the table is shared by services, pages and tests.
 */

export const PROJECT_STATUSES = [
  "design",
  "in-review",
  "returned",
  "approved",
  "submitted",
  "corrections",
  "permitted",
  "installed",
  "inspected",
  "closed",
  "cancelled",
  "expired",
] as const;
export type ProjectStatus = (typeof PROJECT_STATUSES)[number];

export const PROJECT_STATUS_LABELS: Record<ProjectStatus, string> = {
  design: "Design",
  "in-review": "In review",
  returned: "Returned",
  approved: "Approved",
  submitted: "Submitted",
  corrections: "Corrections requested",
  permitted: "Permitted",
  installed: "Installed",
  inspected: "Inspected",
  closed: "Closed",
  cancelled: "Cancelled",
  expired: "Expired",
};

export function isProjectStatus(value: string): value is ProjectStatus {
  return (PROJECT_STATUSES as readonly string[]).includes(value);
}

/**
 * Forward moves: from each status, the statuses it may move to in the normal
 * course of work. A revision may be sent for review again while the design is
 * still before the AHJ (to answer corrections, or a change the designer found);
 * once a permit is issued, a changed design goes back to the AHJ as a new
 * submission, not through the project's status.
 */
export const PROJECT_TRANSITIONS: Record<ProjectStatus, readonly ProjectStatus[]> = {
  design: ["in-review", "cancelled"],
  "in-review": ["returned", "approved", "cancelled"],
  returned: ["in-review", "cancelled"],
  approved: ["in-review", "submitted", "cancelled"],
  submitted: ["corrections", "permitted", "in-review", "cancelled", "expired"],
  corrections: ["in-review", "submitted", "cancelled", "expired"],
  permitted: ["installed", "inspected", "closed", "cancelled", "expired"],
  installed: ["inspected", "closed", "cancelled", "expired"],
  inspected: ["closed"],
  closed: [],
  // A withdrawn or lapsed application may be revised and submitted again.
  cancelled: ["in-review", "submitted"],
  expired: ["in-review", "submitted"],
};

/**
 * Backward moves, allowed only when the permit office voids an event recorded
 * in error: the project returns to the status the remaining events give it.
 */
export const PROJECT_UNDO_TRANSITIONS: Record<ProjectStatus, readonly ProjectStatus[]> = {
  design: [],
  "in-review": [],
  returned: [],
  approved: [],
  submitted: ["approved", "corrections", "cancelled", "expired"],
  corrections: ["submitted"],
  permitted: ["submitted", "corrections"],
  installed: [],
  inspected: ["permitted", "installed"],
  closed: ["permitted", "installed", "inspected"],
  cancelled: ["approved", "submitted", "corrections", "permitted", "installed"],
  expired: ["approved", "submitted", "corrections", "permitted", "installed"],
};

export type TransitionVerdict = { allowed: true } | { allowed: false; reason: string };

/**
 * Whether a project may move from one status to another. Staying put is
 * always allowed (sending a second revision while one is in review).
 */
export function projectTransition(from: ProjectStatus, to: ProjectStatus, options: { undo?: boolean } = {}): TransitionVerdict {
  if (from === to) return { allowed: true };
  if (PROJECT_TRANSITIONS[from].includes(to)) return { allowed: true };
  if (options.undo && PROJECT_UNDO_TRANSITIONS[from].includes(to)) return { allowed: true };
  const f = PROJECT_STATUS_LABELS[from].toLowerCase();
  const t = PROJECT_STATUS_LABELS[to].toLowerCase();
  if (from === "closed") return { allowed: false, reason: `The project is closed; it does not become ${t} again.` };
  if (PROJECT_UNDO_TRANSITIONS[from].includes(to)) {
    return { allowed: false, reason: `A project that is ${f} goes back to ${t} only when the event that moved it is voided.` };
  }
  const next = PROJECT_TRANSITIONS[from].map((s) => PROJECT_STATUS_LABELS[s].toLowerCase());
  return { allowed: false, reason: `A project that is ${f} cannot become ${t}; it can become ${next.join(", ")}.` };
}
