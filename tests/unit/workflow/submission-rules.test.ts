import { describe, expect, it } from "vitest";
import { EVENT_KINDS, type EventKind } from "../../../lib/schemas/submission";
import {
  allowedNextKinds,
  nextEventVerdict,
  projectStatusForEvents,
  sequenceVerdict,
  STANDING_KINDS,
  type StandingKind,
} from "../../../lib/schemas/submission-rules";

/**
 * The order of a permit application's events as an AHJ runs it (common
 * practice for residential electrical permits): plan review, corrections and
 * resubmission, plan approval, permit, inspections, final. Written out here
 * pair by pair, independently of the product's table.
 */
const REVIEW: EventKind[] = ["in-plan-review", "on-hold", "corrections-requested", "approved", "permit-issued", "fee-paid", "cancelled", "expired"];
const PERMITTED: EventKind[] = ["inspection-scheduled", "inspection-passed", "inspection-failed", "fee-paid", "cancelled", "expired"];
const EXPECTED: Record<StandingKind, EventKind[]> = {
  submitted: REVIEW,
  "in-plan-review": REVIEW.filter((k) => k !== "in-plan-review"),
  "on-hold": REVIEW.filter((k) => k !== "on-hold"),
  "corrections-requested": ["resubmitted", "on-hold", "fee-paid", "cancelled", "expired"],
  resubmitted: REVIEW,
  approved: ["permit-issued", "fee-paid", "cancelled", "expired"],
  "permit-issued": PERMITTED,
  "inspection-scheduled": PERMITTED,
  "inspection-passed": [...PERMITTED, "finaled"],
  "inspection-failed": PERMITTED,
  finaled: [],
  cancelled: [],
  expired: [],
};

describe("event order, every pair of kinds", () => {
  it("covers every kind but the fee as a standing kind", () => {
    expect([...STANDING_KINDS].sort()).toEqual(EVENT_KINDS.filter((k) => k !== "fee-paid").sort());
  });
  for (const standing of STANDING_KINDS) {
    for (const next of EVENT_KINDS) {
      const allowed = EXPECTED[standing].includes(next);
      it(`${next} after ${standing}: ${allowed ? "allowed" : "refused"}`, () => {
        const v = nextEventVerdict(standing, next);
        expect(v.allowed).toBe(allowed);
        if (!v.allowed) expect(v.reason).toMatch(/\w+ .*\./);
      });
    }
  }
});

describe("the reasons", () => {
  const reason = (s: StandingKind, n: EventKind) => {
    const v = nextEventVerdict(s, n);
    return v.allowed ? "" : v.reason;
  };
  it("a final inspection cannot precede the permit", () => {
    expect(reason("approved", "inspection-passed")).toMatch(/cannot come before the permit is issued/);
    expect(reason("submitted", "finaled")).toMatch(/before the permit/);
  });
  it("nothing follows Finaled, Cancelled or Expired", () => {
    expect(reason("finaled", "cancelled")).toMatch(/finaled; nothing follows it/);
    expect(reason("cancelled", "fee-paid")).toMatch(/new submission/);
  });
  it("a resubmission answers corrections; an application is submitted once", () => {
    expect(reason("in-plan-review", "resubmitted")).toMatch(/record Corrections requested first/);
    expect(reason("corrections-requested", "submitted")).toMatch(/submitted once/);
  });
  it("Finaled needs a passed inspection", () => {
    expect(reason("inspection-scheduled", "finaled")).toMatch(/passed final inspection/);
  });
});

describe("sequences", () => {
  it("the fee is transparent: what follows is judged by the event before it", () => {
    expect(allowedNextKinds(["submitted", "corrections-requested", "fee-paid"])).toContain("resubmitted");
    expect(sequenceVerdict(["submitted", "fee-paid", "inspection-passed"])).toMatchObject({ allowed: false, index: 2 });
  });
  it("a whole application from submission to final is in order", () => {
    const kinds: EventKind[] = ["submitted", "in-plan-review", "corrections-requested", "resubmitted", "approved", "fee-paid", "permit-issued", "inspection-scheduled", "inspection-passed", "finaled"];
    expect(sequenceVerdict(kinds)).toEqual({ allowed: true });
  });
  it("a sequence must open with Submitted", () => {
    expect(sequenceVerdict(["in-plan-review"])).toMatchObject({ allowed: false, index: 0 });
  });
});

describe("the project status the events give", () => {
  const ev = (kind: EventKind, data: Record<string, unknown> = {}) => ({ kind, data });
  it("follows the application", () => {
    expect(projectStatusForEvents([ev("submitted"), ev("corrections-requested")])).toBe("corrections");
    expect(projectStatusForEvents([ev("submitted"), ev("corrections-requested"), ev("resubmitted")])).toBe("submitted");
    expect(projectStatusForEvents([ev("submitted"), ev("permit-issued"), ev("inspection-passed", { inspectionKind: "rough" })])).toBe("permitted");
    expect(projectStatusForEvents([ev("submitted"), ev("permit-issued"), ev("inspection-passed", { inspectionKind: "final" })])).toBe("inspected");
    expect(projectStatusForEvents([ev("submitted"), ev("permit-issued"), ev("inspection-passed", { inspectionKind: "final" }), ev("finaled")])).toBe("closed");
    expect(projectStatusForEvents([ev("submitted"), ev("cancelled")])).toBe("cancelled");
    expect(projectStatusForEvents([ev("submitted"), ev("expired")])).toBe("expired");
    expect(projectStatusForEvents([])).toBeNull();
  });
});
