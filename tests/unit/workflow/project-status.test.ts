import { describe, expect, it } from "vitest";
import { PROJECT_STATUSES, projectTransition, type ProjectStatus } from "../../../lib/schemas/project-status";

/**
 * The life of a project as a firm runs it (common practice for permitted
 * solar work): design, review by a licensed professional, submission to the
 * AHJ, corrections, permit, installation, inspection, close-out; an
 * application may be withdrawn (cancelled) or lapse (expired). Written out
 * here by hand, pair by pair, so the table in the product is checked against
 * it rather than against itself.
 */
const FORWARD: Record<ProjectStatus, ProjectStatus[]> = {
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
  cancelled: ["in-review", "submitted"],
  expired: ["in-review", "submitted"],
};

/** Backward moves only a voided event may cause: the project returns to where the remaining events put it. */
const UNDO: Record<ProjectStatus, ProjectStatus[]> = {
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

describe("project status transitions, every pair", () => {
  for (const from of PROJECT_STATUSES) {
    for (const to of PROJECT_STATUSES) {
      const forward = from === to || FORWARD[from].includes(to);
      it(`${from} → ${to}: ${forward ? "allowed" : "refused"}`, () => {
        const verdict = projectTransition(from, to);
        expect(verdict.allowed).toBe(forward);
        if (!verdict.allowed) expect(verdict.reason.length).toBeGreaterThan(20);
        const undo = projectTransition(from, to, { undo: true });
        expect(undo.allowed).toBe(forward || UNDO[from].includes(to));
      });
    }
  }
});

describe("reasons name what the user can do", () => {
  it("a design cannot jump to permitted, and the refusal lists where it can go", () => {
    const v = projectTransition("design", "permitted");
    expect(v).toEqual({ allowed: false, reason: "A project that is design cannot become permitted; it can become in review, cancelled." });
  });
  it("a closed project stays closed", () => {
    const v = projectTransition("closed", "in-review");
    expect(v.allowed).toBe(false);
    if (!v.allowed) expect(v.reason).toMatch(/closed/);
  });
  it("a backward move outside a void says that only a void allows it", () => {
    const v = projectTransition("permitted", "submitted");
    expect(v.allowed).toBe(false);
    if (!v.allowed) expect(v.reason).toMatch(/only when the event that moved it is voided/);
  });
});
