import { describe, expect, it } from "vitest";
import { csvCell, csvLine, daysBetween, queueFigures } from "../../../lib/schemas/queue";

const ev = (kind: Parameters<typeof queueFigures>[0][number]["kind"], occurredOn: string, data: Record<string, unknown> = {}) => ({ kind, occurredOn, data });

describe("queue arithmetic", () => {
  it("counts calendar days in UTC, weekends included (2026-11-27 is a Friday; to Monday 11-30 is 3 days)", () => {
    expect(daysBetween("2026-11-27", "2026-11-30")).toBe(3);
    expect(daysBetween("2026-12-31", "2027-01-01")).toBe(1);
  });

  it("a submission held by the AHJ past its typical review days is overdue", () => {
    const f = queueFigures([ev("submitted", "2026-11-02"), ev("in-plan-review", "2026-11-05")], "in-plan-review", 14, "2026-12-01");
    expect(f.daysSinceLastEvent).toBe(26);
    expect(f.daysWaiting).toBe(29);
    expect(f.overdue).toBe(true);
    expect(f.holder).toBe("AHJ");
  });

  it("waiting counts from the resubmission, and stops while the designer holds corrections", () => {
    const resubmitted = queueFigures([ev("submitted", "2026-10-01"), ev("corrections-requested", "2026-10-20"), ev("resubmitted", "2026-11-25")], "resubmitted", 14, "2026-12-01");
    expect(resubmitted.daysWaiting).toBe(6);
    expect(resubmitted.overdue).toBe(false);
    const corrections = queueFigures([ev("submitted", "2026-10-01"), ev("corrections-requested", "2026-10-20")], "corrections-requested", 14, "2026-12-01");
    expect(corrections.daysWaiting).toBeNull();
    expect(corrections.holder).toBe("designer");
  });

  it("no typical review days on file: never overdue", () => {
    expect(queueFigures([ev("submitted", "2026-01-01")], "submitted", null, "2026-12-01").overdue).toBe(false);
  });

  it("flags a permit expiring within 30 days with no final passed, and a scheduled inspection ahead is not the last event", () => {
    const events = [ev("submitted", "2026-06-01"), ev("permit-issued", "2026-06-20", { permitNumber: "E-1", expiresOn: "2026-12-20" }), ev("inspection-scheduled", "2026-12-10", { inspectionKind: "final" })];
    const f = queueFigures(events, "inspection-scheduled", 14, "2026-12-01");
    expect(f.permitExpiresOn).toBe("2026-12-20");
    expect(f.expiringSoon).toBe(true);
    expect(f.daysSinceLastEvent).toBe(164);
    const passed = queueFigures([...events, ev("inspection-passed", "2026-12-01", { inspectionKind: "final" })], "inspection-passed", 14, "2026-12-01");
    expect(passed.expiringSoon).toBe(false);
  });
});

describe("CSV cells", () => {
  it("escapes cells a spreadsheet would run as formulas (OWASP CSV injection)", () => {
    expect(csvCell("=HYPERLINK(\"http://x\")")).toBe(`"'=HYPERLINK(""http://x"")"`);
    expect(csvCell("+1")).toBe("'+1");
    expect(csvCell("-2")).toBe("'-2");
    expect(csvCell("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(csvCell("Kestrel Falls")).toBe("Kestrel Falls");
  });
  it("quotes commas, quotes and line breaks (RFC 4180)", () => {
    expect(csvLine(["a,b", 'say "hi"', "two\nlines", null, 3])).toBe('"a,b","say ""hi""","two\nlines",,3');
  });
});
