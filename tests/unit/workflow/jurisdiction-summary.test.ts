import { describe, expect, it } from "vitest";
import { summariseJurisdiction } from "../../../lib/schemas/jurisdiction-summary";

// Dates worked by hand: 2026-11-02 → 2026-11-13 is 11 calendar days; → 2026-11-30 is 28; → 2026-12-04 is 32.
const permittedFirstTime = {
  status: "permit-issued" as const,
  events: [
    { kind: "submitted" as const, occurredOn: "2026-11-02" },
    { kind: "in-plan-review" as const, occurredOn: "2026-11-05" },
    { kind: "permit-issued" as const, occurredOn: "2026-11-13" },
  ],
};
const permittedAfterCorrections = {
  status: "finaled" as const,
  events: [
    { kind: "submitted" as const, occurredOn: "2026-11-02" },
    { kind: "corrections-requested" as const, occurredOn: "2026-11-10" },
    { kind: "resubmitted" as const, occurredOn: "2026-11-20" },
    { kind: "permit-issued" as const, occurredOn: "2026-11-30" },
    { kind: "finaled" as const, occurredOn: "2026-12-01" },
  ],
};
const twoLetters = {
  status: "corrections-requested" as const,
  events: [
    { kind: "submitted" as const, occurredOn: "2026-11-02" },
    { kind: "corrections-requested" as const, occurredOn: "2026-11-09" },
    { kind: "resubmitted" as const, occurredOn: "2026-11-16" },
    { kind: "corrections-requested" as const, occurredOn: "2026-11-23" },
  ],
};
const waiting = { status: "in-plan-review" as const, events: [{ kind: "submitted" as const, occurredOn: "2026-11-28" }, { kind: "in-plan-review" as const, occurredOn: "2026-11-30" }] };

describe("a jurisdiction's summary", () => {
  it("counts open applications by status, leaving finaled ones out", () => {
    const s = summariseJurisdiction([permittedFirstTime, permittedAfterCorrections, twoLetters, waiting]);
    expect(s.submissions).toBe(4);
    expect(s.openByStatus).toEqual([
      { status: "permit-issued", count: 1 },
      { status: "corrections-requested", count: 1 },
      { status: "in-plan-review", count: 1 },
    ]);
  });

  it("takes the median days to permit over permitted applications, first-time approval over decided ones, and letters per application", () => {
    const s = summariseJurisdiction([permittedFirstTime, permittedAfterCorrections, twoLetters, waiting]);
    // Days to permit 11 and 28: median (11 + 28) / 2 = 19.5.
    expect(s.medianDaysToPermit).toBe(19.5);
    expect(s.permitted).toBe(2);
    // Decided: three (two permitted, one with letters); approved as first sent: one → 1/3.
    expect(s.decided).toBe(3);
    expect(s.firstTimeApprovalRate).toBeCloseTo(1 / 3, 10);
    // Letters: 0 + 1 + 2 + 0 = 3 over 4 applications.
    expect(s.correctionsPerSubmission).toBe(0.75);
  });

  it("says nothing rather than zero when there is nothing to measure", () => {
    expect(summariseJurisdiction([])).toEqual({
      submissions: 0,
      openByStatus: [],
      medianDaysToPermit: null,
      permitted: 0,
      firstTimeApprovalRate: null,
      decided: 0,
      correctionsPerSubmission: null,
    });
    expect(summariseJurisdiction([waiting]).medianDaysToPermit).toBeNull();
  });
});
