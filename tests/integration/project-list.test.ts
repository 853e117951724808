import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { projectEquipment, projects } from "../../db/schema";
import { archiveProject, restoreProject } from "../../lib/services/projects/archive";
import { listProjects } from "../../lib/services/projects/list";
import { codeOf, makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const org = makeOrg(db);
const designer = makeContext(db, org.id, ["designer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const north = makeJurisdiction(db, org.id);
const south = makeJurisdiction(db, org.id);

function project(name: string, fields: Partial<typeof projects.$inferInsert> = {}, tags: string[] = []) {
  const row = makeProject(db, org.id, fields.jurisdictionId ?? north.id);
  db.update(projects).set({ name, ...fields }).where(eq(projects.id, row.id)).run();
  tags.forEach((tag, position) => db.insert(projectEquipment).values({ projectId: row.id, tag, kind: "pv-module", position, data: {} }).run());
  return row.id;
}

const cabin = project("Reed Lake cabin", { client: "M. Okafor", address: "12 Reed Lane", updatedAt: "2026-03-01T00:00:00.000Z" }, ["MOD-1", "INV-7"]);
const stall = project("Market stall 9", { client: "Orchard Row market", systemKind: "stand-alone", status: "approved", updatedAt: "2026-03-03T00:00:00.000Z" });
const barn = project("Barn hybrid", { client: "Hollis farm", systemKind: "hybrid", jurisdictionId: south.id, updatedAt: "2026-03-02T00:00:00.000Z" });
project("100% off-grid shed", { client: "Ada_Lee", updatedAt: "2026-02-01T00:00:00.000Z" });
const names = (query: object, request = {}) => listProjects(designer, request, query).rows.map((r) => r.name);

describe("finding a project in the list", () => {
  it("searches name, client, address and equipment tag, case-insensitively", () => {
    expect(names({ q: "reed" })).toEqual(["Reed Lake cabin"]);
    expect(names({ q: "hollis" })).toEqual(["Barn hybrid"]);
    expect(names({ q: "12 reed lane" })).toEqual(["Reed Lake cabin"]);
    expect(names({ q: "INV-7" })).toEqual(["Reed Lake cabin"]);
    expect(names({ q: "nothing like it" })).toEqual([]);
  });

  it("reads % and _ as letters, not wildcards", () => {
    expect(names({ q: "100%" })).toEqual(["100% off-grid shed"]);
    expect(names({ q: "a_l" })).toEqual(["100% off-grid shed"]);
    expect(names({ q: "%" })).toEqual(["100% off-grid shed"]);
  });

  it("filters by status, jurisdiction and system kind", () => {
    expect(names({ status: "approved" })).toEqual(["Market stall 9"]);
    expect(names({ jurisdictionId: south.id })).toEqual(["Barn hybrid"]);
    expect(names({ systemKind: "hybrid" })).toEqual(["Barn hybrid"]);
  });

  it("sorts by last change or by name, and pages by name without repeats", () => {
    expect(names({})).toEqual(["Market stall 9", "Barn hybrid", "Reed Lake cabin", "100% off-grid shed"]);
    expect(names({ sort: "name" })).toEqual(["100% off-grid shed", "Barn hybrid", "Market stall 9", "Reed Lake cabin"]);
    const first = listProjects(designer, { limit: 2 }, { sort: "name" });
    const second = listProjects(designer, { limit: 2, cursor: first.nextCursor }, { sort: "name" });
    expect([...first.rows, ...second.rows].map((r) => r.name)).toEqual(["100% off-grid shed", "Barn hybrid", "Market stall 9", "Reed Lake cabin"]);
    expect(second.nextCursor).toBeNull();
  });

  it("refuses an unknown status or sort with a message, rather than showing everything", () => {
    expect(codeOf(() => listProjects(designer, {}, { status: "finished" }))).toBe("invalid");
    expect(codeOf(() => listProjects(designer, {}, { sort: "size" }))).toBe("invalid");
    expect(codeOf(() => listProjects(designer, {}, { q: "x".repeat(101) }))).toBe("invalid");
  });
});

describe("archiving", () => {
  it("takes a project off the list into the archived view and brings it back", () => {
    archiveProject(designer, barn);
    expect(names({})).not.toContain("Barn hybrid");
    expect(names({ archived: true })).toEqual(["Barn hybrid"]);
    // Reading it still works: nothing of it is lost.
    expect(db.select().from(projects).where(eq(projects.id, barn)).get()?.archivedAt).toMatch(/^\d{4}-/);
    restoreProject(designer, barn);
    expect(names({})).toContain("Barn hybrid");
    expect(names({ archived: true })).toEqual([]);
  });

  it("does not archive a project a reviewer or the permit office is working on", () => {
    db.update(projects).set({ status: "in-review" }).where(eq(projects.id, cabin)).run();
    expect(codeOf(() => archiveProject(designer, cabin))).toBe("conflict");
    expect(names({ archived: true })).toEqual([]);
  });

  it("is for designers of the organisation only", () => {
    expect(codeOf(() => archiveProject(reviewer, stall))).toBe("forbidden");
    const outsider = makeContext(db, makeOrg(db).id, ["designer"]);
    expect(codeOf(() => archiveProject(outsider, stall))).toBe("not-found");
    expect(listProjects(outsider, {}, { q: "stall" }).rows).toEqual([]);
    expect(names({ archived: true })).toEqual([]);
  });
});
