import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { createProject } from "../../lib/services/projects/create";
import { listProjects } from "../../lib/services/projects/list";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { listJurisdictions } from "../../lib/services/jurisdictions/list";
import { listUsers } from "../../lib/services/users/list";
import { setUserActive, setUserRoles } from "../../lib/services/users/manage";
import { ServiceError } from "../../lib/services/errors";
import { contextForUser } from "../../lib/services/context";
import { projects, users, userRoles } from "../../db/schema";
import { eq } from "drizzle-orm";
import { makeContext, makeJurisdiction, makeOrg, makeProject, makeUser, tempDatabase, codeOf } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());


describe("organisation scoping: nothing of organisation B is visible or changeable from A", () => {
  const orgA = makeOrg(db, "Org A");
  const orgB = makeOrg(db, "Org B");
  const jurA = makeJurisdiction(db, orgA.id);
  const jurB = makeJurisdiction(db, orgB.id);
  const projectA = makeProject(db, orgA.id, jurA.id);
  const projectB = makeProject(db, orgB.id, jurB.id);
  const designerA = makeContext(db, orgA.id, ["designer"]);
  const adminA = makeContext(db, orgA.id, ["admin"]);
  const userB = makeUser(db, orgB.id, ["designer"]);

  beforeAll(() => {
    expect(projectB.orgId).toBe(orgB.id);
  });

  it("lists only the actor's organisation's projects and jurisdictions", () => {
    const ids = listProjects(designerA).rows.map((p) => p.id);
    expect(ids).toContain(projectA.id);
    expect(ids).not.toContain(projectB.id);
    expect(listJurisdictions(designerA).map((j) => j.id)).toEqual([jurA.id]);
  });

  it("answers not-found when reading another organisation's project by id", () => {
    expect(codeOf(() => getProjectRecord(designerA, projectB.id))).toBe("not-found");
    expect(codeOf(() => getProjectRecord(designerA, projectA.id))).toBeUndefined();
  });

  it("refuses to change another organisation's project and leaves it as it was", () => {
    const before = db.select().from(projects).where(eq(projects.id, projectB.id)).get();
    const record = {
      name: "Hijacked",
      systemKind: "stand-alone",
      site: { occupancy: "other-building", mounting: "ground" },
      jurisdiction: { name: "X", necEdition: "2023" },
    };
    expect(codeOf(() => saveProjectRecord(designerA, projectB.id, record, before!.version))).toBe("not-found");
    const after = db.select().from(projects).where(eq(projects.id, projectB.id)).get();
    expect(after).toEqual(before);
  });

  it("refuses to create a project in another organisation's jurisdiction", () => {
    expect(
      codeOf(() => createProject(designerA, { name: "New", systemKind: "hybrid", jurisdictionId: jurB.id })),
    ).toBe("not-found");
  });

  it("refuses an admin changing or deactivating a user of another organisation", () => {
    expect(codeOf(() => setUserRoles(adminA, { userId: userB.id, roles: ["admin"], version: userB.version }))).toBe("not-found");
    expect(codeOf(() => setUserActive(adminA, { userId: userB.id, active: false, version: userB.version }))).toBe("not-found");
    const still = db.select().from(users).where(eq(users.id, userB.id)).get();
    expect(still?.active).toBe(true);
    const roles = db.select().from(userRoles).where(eq(userRoles.userId, userB.id)).all().map((r) => r.role);
    expect(roles).toEqual(["designer"]);
    expect(listUsers(adminA).map((u) => u.id)).not.toContain(userB.id);
  });
});

describe("refuses the wrong role", () => {
  const org = makeOrg(db);
  const jur = makeJurisdiction(db, org.id);
  const project = makeProject(db, org.id, jur.id);

  it("refuses a reviewer, the office and an installer editing a design", () => {
    for (const role of ["reviewer", "office", "installer"] as const) {
      const ctx = makeContext(db, org.id, [role]);
      expect(codeOf(() => saveProjectRecord(ctx, project.id, {}, project.version))).toBe("forbidden");
    }
  });

  it("refuses an installer listing projects and a designer managing users", () => {
    expect(codeOf(() => listProjects(makeContext(db, org.id, ["installer"])))).toBe("forbidden");
    expect(codeOf(() => listUsers(makeContext(db, org.id, ["designer"])))).toBe("forbidden");
  });

  it("refuses a deactivated user's context altogether", () => {
    const gone = makeUser(db, org.id, ["designer"], { active: false });
    expect(codeOf(() => contextForUser(db, gone.id))).toBe("unauthenticated");
    expect(codeOf(() => contextForUser(db, "forged-user-id"))).toBe("unauthenticated");
  });
});

describe("saving a project", () => {
  const org = makeOrg(db);
  const jur = makeJurisdiction(db, org.id, "2020");
  const designer = makeContext(db, org.id, ["designer"]);
  const { id } = createProject(designer, { name: "Cabin", systemKind: "stand-alone", jurisdictionId: jur.id });

  it("refuses a stale version and keeps the newer save", () => {
    const first = getProjectRecord(designer, id);
    const mine = { ...first.record, client: "First writer" };
    const theirs = { ...first.record, client: "Second writer" };
    expect(saveProjectRecord(designer, id, mine, first.version).version).toBe(first.version + 1);
    expect(codeOf(() => saveProjectRecord(designer, id, theirs, first.version))).toBe("conflict");
    expect(getProjectRecord(designer, id).record.client).toBe("First writer");
  });

  it("refuses an invalid record with the field named and changes nothing", () => {
    const current = getProjectRecord(designer, id);
    let issues: { path: string }[] = [];
    try {
      saveProjectRecord(designer, id, { ...current.record, site: { ...current.record.site, designLowTempC: -80 } }, current.version);
    } catch (error) {
      issues = (error as ServiceError).issues;
    }
    expect(issues.map((i) => i.path)).toContain("site.designLowTempC");
    expect(getProjectRecord(designer, id).version).toBe(current.version);
  });
});
