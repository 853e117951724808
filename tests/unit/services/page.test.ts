import { describe, expect, it } from "vitest";
import { projects } from "../../../db/schema";
import { ServiceError } from "../../../lib/services/errors";
import { afterCursor, pageSize, toPage } from "../../../lib/services/page";

describe("cursor pages", () => {
  it("cuts the extra row into a cursor that names the last row kept", () => {
    const rows = [
      { at: "2026-03-03", id: "c" },
      { at: "2026-03-02", id: "b" },
      { at: "2026-03-01", id: "a" },
    ];
    const page = toPage(rows, 2, (r) => [r.at, r.id]);
    expect(page.rows.map((r) => r.id)).toEqual(["c", "b"]);
    expect(JSON.parse(Buffer.from(page.nextCursor!, "base64url").toString("utf8"))).toEqual(["2026-03-02", "b"]);
    expect(toPage(rows, 3, (r) => [r.at, r.id]).nextCursor).toBeNull();
  });

  it("refuses a page size outside 1 to 200 and a cursor that is not one it made", () => {
    expect(pageSize({})).toBe(50);
    for (const limit of [0, 201, 2.5, Number.NaN]) expect(() => pageSize({ limit })).toThrow(ServiceError);
    expect(() => afterCursor({ cursor: "not-a-cursor" }, projects.updatedAt, projects.id)).toThrow(ServiceError);
    expect(afterCursor({}, projects.updatedAt, projects.id)).toBeUndefined();
  });
});
