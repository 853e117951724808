import { describe, expect, it } from "vitest";
import { can, PERMISSIONS } from "../../../lib/auth/permissions";
import { homeFor, ROLES } from "../../../lib/auth/roles";

describe("permission matrix", () => {
  it("lets only reviewers decide a review (stamp or return)", () => {
    for (const role of ROLES) expect(can([role], "review:decide")).toBe(role === "reviewer");
  });

  it("lets only designers edit a design", () => {
    for (const role of ROLES) expect(can([role], "project:edit")).toBe(role === "designer");
  });

  it("keeps reviewers, the office and installers from editing the design", () => {
    expect(can(["reviewer"], "project:edit")).toBe(false);
    expect(can(["office"], "project:edit")).toBe(false);
    expect(can(["installer"], "project:edit")).toBe(false);
  });

  it("keeps designers from stamping and the office from stamping", () => {
    expect(can(["designer"], "review:decide")).toBe(false);
    expect(can(["office"], "review:decide")).toBe(false);
  });

  it("gives installers the approved set and labels, nothing else of the design", () => {
    const installerMay = Object.entries(PERMISSIONS)
      .filter(([, roles]) => (roles as readonly string[]).includes("installer"))
      .map(([permission]) => permission)
      .sort();
    expect(installerMay).toEqual(["attachment:upload", "install:confirm", "install:read", "packet:read"].sort());
  });

  it("lets only admins manage users and roles", () => {
    for (const role of ROLES) expect(can([role], "users:manage")).toBe(role === "admin");
  });

  it("lets only the office keep jurisdictions and submissions", () => {
    for (const role of ROLES) {
      expect(can([role], "jurisdiction:edit")).toBe(role === "office");
      expect(can([role], "submission:create")).toBe(role === "office");
      expect(can([role], "submission:record-event")).toBe(role === "office");
    }
  });

  it("combines roles: a person holding several may do what any of them may", () => {
    expect(can(["installer", "designer"], "project:edit")).toBe(true);
    expect(can([], "project:read")).toBe(false);
  });

  it("sends each role to the page that serves it", () => {
    expect(homeFor(["designer"])).toBe("/projects");
    expect(homeFor(["reviewer"])).toBe("/reviews");
    expect(homeFor(["office"])).toBe("/submissions");
    expect(homeFor(["installer"])).toBe("/install");
    expect(homeFor(["admin"])).toBe("/admin/users");
  });
});
